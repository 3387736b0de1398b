import Link from "next/link";
import type { ReactNode } from "react";
import { TestModeBanner } from "@/components/payments/test-mode-banner";
import { ROLE_LABELS, homeFor } from "@/lib/auth/roles";
import type { SessionUser } from "@/lib/auth/session-user";
import { Wordmark } from "./brand-mark";
import { navItemsFor } from "./nav-items";
import { NavLinks } from "./nav-links";
import { SignOutButton } from "./sign-out-button";

function Sidebar({
  user,
  context,
  brand = true,
}: {
  user: SessionUser;
  context?: string;
  brand?: boolean;
}) {
  return (
    <div className="flex h-full flex-col gap-6 p-4">
      {brand ? (
        <Link
          href={homeFor(user.role)}
          className="rounded-md px-1 py-1"
          aria-label="Loopshift home"
        >
          <Wordmark />
        </Link>
      ) : null}
      <nav aria-label="Main">
        <NavLinks items={navItemsFor(user.role)} />
      </nav>
      {/* Named so it is a landmark on phones too, where the menu has no <aside> around it. */}
      <section
        aria-label="Signed-in user"
        className="mt-auto space-y-3 rounded-md bg-flux-950/40 p-3 text-small"
      >
        <div>
          <p className="font-bold text-white">{user.name}</p>
          <p className="break-all text-flux-200">{user.email}</p>
          <p className="mt-1 text-flux-100">{ROLE_LABELS[user.role]}</p>
          {context ? <p className="text-flux-100">{context}</p> : null}
        </div>
        <SignOutButton />
      </section>
    </div>
  );
}

// The signed-in page shell: a dark sidebar on wide screens, a collapsible bar on narrow ones.
export function AppShell({
  user,
  context,
  children,
  paymentsBanner = true,
}: {
  user: SessionUser;
  context?: string;
  children: ReactNode;
  // The vendor's test-mode notice is for vendor staff; the reviewer's screens leave it out.
  paymentsBanner?: boolean;
}) {
  return (
    <div className="min-h-screen md:grid md:grid-cols-[15.5rem_1fr] print:block">
      <a
        href="#main"
        className="sr-only focus:not-sr-only focus:absolute focus:left-2 focus:top-2 focus:z-50 focus:rounded focus:bg-white focus:px-3 focus:py-2"
      >
        Skip to content
      </a>
      <aside className="hidden bg-flux-900 md:block print:hidden">
        <div className="sticky top-0 h-screen">
          <Sidebar user={user} context={context} />
        </div>
      </aside>
      <details className="bg-flux-900 md:hidden print:hidden">
        <summary className="flex cursor-pointer list-none items-center justify-between px-4 py-3 text-white">
          <Wordmark />
          <span className="rounded border border-flux-600 px-2 py-1 text-small font-bold">
            Menu
          </span>
        </summary>
        <Sidebar user={user} context={context} brand={false} />
      </details>
      <div className="flex min-h-screen min-w-0 flex-col">
        {paymentsBanner ? <TestModeBanner /> : null}
        <main id="main" className="mx-auto w-full max-w-7xl flex-1 px-4 py-6 md:px-8 md:py-8">
          {children}
        </main>
        <footer className="border-t border-steel-200 px-4 py-3 text-caption text-steel-600 md:px-8">
          Figures are estimates from datasheet values and the stated assumptions. Converting an axis
          is work on live machinery: qualified people only, machine isolated and locked out, its
          risk assessment and local codes followed.
        </footer>
      </div>
    </div>
  );
}
