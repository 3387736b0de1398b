import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { Wordmark } from "@/components/shell/brand-mark";
import { getSessionUser } from "@/lib/auth";
import { homeFor } from "@/lib/auth/roles";
import { demoUsers, isDemoMode } from "@/lib/demo";

export const metadata: Metadata = { title: "Sign in" };

// Only same-site paths may be a destination after signing in.
function safeCallback(value: string | string[] | undefined): string | undefined {
  const v = Array.isArray(value) ? value[0] : value;
  return v && v.startsWith("/") && !v.startsWith("//") ? v : undefined;
}

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
        callbackUrl={safeCallback(params.callbackUrl)}
        demoUsers={isDemoMode() ? demoUsers() : []}
      />
    </div>
  );
}
