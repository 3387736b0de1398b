import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { Wordmark } from "@/components/shell/brand-mark";
import { getSessionUser } from "@/server/auth";
import { sameOriginPath } from "@/lib/auth/callback-url";
import { homeFor } from "@/lib/auth/roles";
import { demoUsers, isDemoMode } from "@/server/demo";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await getSessionUser();
  if (user) redirect(homeFor(user.role));
  const params = await searchParams;
  return (
    <div className="w-full max-w-md space-y-8">
      <div className="lg:hidden">
        <Wordmark tone="dark" />
      </div>
      <div>
        <h1 className="text-headline">Sign in to Loopshift</h1>
        <p className="mt-1 text-steel-700">Use the e-mail address your administrator registered.</p>
      </div>
      <SignInForm
        // Only a path on the app's own origin may be the destination after signing in.
        callbackUrl={sameOriginPath(
          params.callbackUrl,
          process.env.NEXTAUTH_URL ?? "http://localhost",
        )}
        demoUsers={isDemoMode() ? demoUsers() : []}
      />
    </div>
  );
}
