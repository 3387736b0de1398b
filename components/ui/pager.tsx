import Link from "next/link";
import { buttonClass } from "@/components/ui/button";

// "Page 2 of 7 · 312 cases" with previous/next links; the links are built by the caller so that
// the rest of the list state (filter, sort, other filters) stays in the URL.
export function Pager({
  page,
  pageCount,
  total,
  noun,
  href,
}: {
  page: number;
  pageCount: number;
  total: number;
  noun: [singular: string, plural: string];
  href: (page: number) => string;
}) {
  return (
    <nav aria-label="Pages" className="mt-3 flex flex-wrap items-center justify-between gap-2">
      <p className="text-small text-steel-700">
        Page {page} of {pageCount} · {total.toLocaleString("en")} {total === 1 ? noun[0] : noun[1]}
      </p>
      <div className="flex gap-2">
        {page > 1 ? (
          <Link className={buttonClass("secondary", "sm")} href={href(page - 1)} rel="prev">
            Previous
          </Link>
        ) : null}
        {page < pageCount ? (
          <Link className={buttonClass("secondary", "sm")} href={href(page + 1)} rel="next">
            Next
          </Link>
        ) : null}
      </div>
    </nav>
  );
}
