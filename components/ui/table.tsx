import Link from "next/link";
import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from "react";

// The wrapper scrolls a wide table inside itself on a narrow screen; as a named, focusable region
// a keyboard user can reach it and scroll it with the arrow keys.
export function Table({ caption, children }: { caption: string; children: ReactNode }) {
  return (
    <div
      role="region"
      aria-label={caption}
      tabIndex={0}
      className="relative overflow-x-auto rounded-panel border border-steel-200 bg-white"
    >
      <table className="min-w-full divide-y divide-steel-200 text-left text-small">
        <caption className="sr-only">{caption}</caption>
        {children}
      </table>
    </div>
  );
}

export function Th({ className = "", ...props }: ThHTMLAttributes<HTMLTableCellElement>) {
  return (
    <th
      scope="col"
      className={`bg-steel-100 px-3 py-2 font-bold text-steel-800 ${className}`}
      {...props}
    />
  );
}

export function Td({ className = "", ...props }: TdHTMLAttributes<HTMLTableCellElement>) {
  return <td className={`px-3 py-2 align-middle text-steel-900 ${className}`} {...props} />;
}

/** A cell holding an amount or a figure: right-aligned, digits of one width, kept on one line. */
export function NumberTd({ className = "", ...props }: TdHTMLAttributes<HTMLTableCellElement>) {
  const classes = ["whitespace-nowrap text-right tabular-nums", className]
    .filter(Boolean)
    .join(" ");
  return <Td className={classes} {...props} />;
}

// A column header that sorts the table through the URL, so a sorted view can be bookmarked.
export function SortHeader({
  label,
  column,
  sort,
  dir,
  href,
  className,
}: {
  label: string;
  column: string;
  sort: string;
  dir: "asc" | "desc";
  href: (column: string, dir: "asc" | "desc") => string;
  className?: string;
}) {
  const active = sort === column;
  const next = active && dir === "asc" ? "desc" : "asc";
  return (
    <Th
      aria-sort={active ? (dir === "asc" ? "ascending" : "descending") : "none"}
      className={className}
    >
      <Link
        href={href(column, next)}
        className="inline-flex items-center gap-1 hover:text-flux-700"
      >
        {label}
        <span aria-hidden="true" className="text-steel-500">
          {active ? (dir === "asc" ? "▲" : "▼") : "↕"}
        </span>
      </Link>
    </Th>
  );
}
