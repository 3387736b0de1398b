import Link from "next/link";

/**
 * The way from any set of figures to the page that explains them. The vendor's shell and the
 * reviewer's portal each have their own copy of that page, so the caller names the address.
 */
export function MethodLink({ href, className = "" }: { href: string; className?: string }) {
  return (
    <Link
      href={href}
      className={`inline-flex items-center gap-1.5 rounded text-small font-bold text-flux-700 underline decoration-flux-300 underline-offset-4 hover:text-flux-800 hover:decoration-flux-700 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-flux-600 ${className}`}
    >
      <span
        aria-hidden="true"
        className="grid h-4 w-4 place-items-center rounded-full border border-current text-[0.65rem] leading-none no-underline"
      >
        i
      </span>
      How these figures are computed
    </Link>
  );
}
