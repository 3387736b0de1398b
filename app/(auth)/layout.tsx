import type { ReactNode } from "react";
import { Wordmark } from "@/components/shell/brand-mark";

export default function AuthLayout({ children }: { children: ReactNode }) {
  return (
    <div className="grid min-h-screen lg:grid-cols-[1fr_1.1fr]">
      {/* An aside, so this panel sits in a landmark beside <main> (axe-core's "region" rule). */}
      <aside
        aria-label="About Loopshift"
        className="hidden flex-col justify-between bg-flux-900 p-10 text-flux-50 lg:flex"
      >
        <Wordmark />
        <div className="max-w-md space-y-4">
          <p className="text-display font-black text-white">
            Close the loop, and show what it pays.
          </p>
          <p className="text-lead text-flux-100">
            Model a customer&apos;s open-loop stepper axes, size the closed-loop kits, and send a
            payback that finance can check cell by cell.
          </p>
        </div>
        <p className="text-small text-flux-200">
          Retrofit work is electrical work on machinery: qualified persons only, under local codes.
        </p>
      </aside>
      <main className="flex items-center justify-center px-4 py-10">{children}</main>
    </div>
  );
}
