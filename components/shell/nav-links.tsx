"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export type NavItem = { href: string; label: string };

export function NavLinks({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  const matches = (href: string) => pathname === href || pathname.startsWith(`${href}/`);
  // A section nested in another (/admin/payments in /admin) marks only itself as current.
  const currentHref = items
    .map((i) => i.href)
    .filter(matches)
    .sort((a, b) => b.length - a.length)[0];
  return (
    <ul className="flex flex-col gap-1">
      {items.map((item) => {
        const current = item.href === currentHref;
        return (
          <li key={item.href}>
            <Link
              href={item.href}
              aria-current={current ? "page" : undefined}
              className={`block rounded-md px-3 py-2 font-bold ${
                current
                  ? "bg-flux-700 text-white"
                  : "text-flux-100 hover:bg-flux-800 hover:text-white"
              }`}
            >
              {item.label}
            </Link>
          </li>
        );
      })}
    </ul>
  );
}
