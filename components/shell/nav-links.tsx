"use client";

import Link from "next/link";
import { usePathname } from "next/navigation";

export type NavItem = { href: string; label: string };

export function NavLinks({ items }: { items: NavItem[] }) {
  const pathname = usePathname();
  // The most specific item that contains the page is the current one (/admin/outbox is not /admin).
  const current = items
    .filter((item) => pathname === item.href || pathname.startsWith(`${item.href}/`))
    .sort((a, b) => b.href.length - a.href.length)[0]?.href;
  return (
    <ul className="flex flex-col gap-1">
      {items.map((item) => {
        return (
          <li key={item.href}>
            <Link
              href={item.href}
              aria-current={current === item.href ? "page" : undefined}
              className={`block rounded-md px-3 py-2 font-bold ${
                current === item.href
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
