import type { Metadata } from "next";
import Link from "next/link";
import { SetPasswordForm } from "@/components/auth/set-password-form";
import { Wordmark } from "@/components/shell/brand-mark";
import { buttonClass } from "@/components/ui/button";
import { INVITATION_MESSAGES, inspectInvitation } from "@/db/queries/invitations";
import { vendorCompanyName } from "@/lib/vendor-name";

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

// "Dana Novak of Example Retrofits", as much of it as is known.
function invitedBy(sender: string | null, company: string | null): string {
  if (sender && company) return `${sender} of ${company}`;
  if (sender) return `${sender}, of the supplier preparing your retrofit,`;
  return company ?? "Your retrofit supplier";
}

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
          <div className="space-y-3 text-steel-800">
            <h1 className="text-headline text-steel-900">Welcome, {invitation.name}</h1>
            <p data-testid="invitation-from">
              {invitedBy(invitation.senderName, vendorCompanyName())} has invited you to review{" "}
              {invitation.proposal ? (
                <>
                  the retrofit proposal{" "}
                  <strong>
                    {invitation.proposal.caseName}, version {invitation.proposal.version}
                  </strong>{" "}
                  for {invitation.proposal.siteName},
                </>
              ) : (
                "retrofit proposals"
              )}
              {invitation.accountName ? (
                <>
                  {" "}
                  as the finance reviewer of <strong>{invitation.accountName}</strong>
                </>
              ) : null}
              .
            </p>
            <h2 className="pt-1 text-lead font-bold text-steel-900">What you can do</h2>
            <ul className="list-disc space-y-1 pl-5">
              <li>
                Read the proposal exactly as it was sent: its figures are frozen, so what you read
                is what was offered. The workbook downloads with every formula.
              </li>
              <li>
                Try your own figures (tariff, running hours, step-loss events, discount rate,
                horizon, tax) in a sandbox. Nothing you try there is saved or changes the proposal.
              </li>
              <li>
                Approve it, ask for changes with a comment, or decline. The sender is told by
                e-mail.
              </li>
            </ul>
            <p>
              You will see only the proposals sent to
              {invitation.accountName ? ` ${invitation.accountName}` : " your company"}. First
              choose a password for <strong>{invitation.email}</strong>: this link works once and
              until {invitation.expiresAt.slice(0, 10)} (UTC).
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
