import type { Metadata } from "next";
import Link from "next/link";
import { SetPasswordForm } from "@/components/auth/set-password-form";
import { Wordmark } from "@/components/shell/brand-mark";
import { buttonClass } from "@/components/ui/button";
import { INVITATION_MESSAGES, inspectInvitation } from "@/db/queries/invitations";

export const metadata: Metadata = { title: "Choose your password" };
// The state of a link changes when it is used: never serve a cached page.
export const dynamic = "force-dynamic";

const TITLES = {
  invalid: "This link does not work",
  used: "This link has been used",
  replaced: "This link was replaced",
  revoked: "This link was withdrawn",
  expired: "This link has expired",
} as const;

export default async function InvitationPage({ params }: { params: Promise<{ token: string }> }) {
  const { token } = await params;
  const invitation = inspectInvitation(token);
  return (
    <div className="w-full max-w-md space-y-8">
      <div className="lg:hidden">
        <Wordmark tone="dark" />
      </div>
      {invitation.state === "open" ? (
        <>
          <div>
            <h1 className="text-headline">Welcome, {invitation.name}</h1>
            <p className="mt-1 text-steel-700">
              Choose a password for your reviewer account
              {invitation.accountName ? ` at ${invitation.accountName}` : ""}. This link works once
              and until {invitation.expiresAt.slice(0, 10)} (UTC).
            </p>
            <p className="mt-3 text-steel-700">
              As the finance reviewer you can read the proposals sent to your company, download
              their workbooks, try your own figures in a sandbox, and accept, decline or ask for
              changes. The figures of a proposal are frozen as sent: trying other figures never
              changes them.
            </p>
          </div>
          <SetPasswordForm token={token} email={invitation.email} />
        </>
      ) : (
        <div role="alert" className="space-y-4">
          <h1 className="text-headline">{TITLES[invitation.state]}</h1>
          <p className="text-steel-800">
            {INVITATION_MESSAGES[invitation.state]}
            {invitation.state === "expired"
              ? ` It expired on ${invitation.expiredAt.slice(0, 10)} (UTC).`
              : ""}
          </p>
          <Link href="/sign-in" className={buttonClass("secondary")}>
            Go to sign-in
          </Link>
        </div>
      )}
    </div>
  );
}
