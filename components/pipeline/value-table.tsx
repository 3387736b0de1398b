import { NumberTd, SortHeader, Table, Td } from "@/components/ui/table";
import type { ValueRow } from "@/components/pipeline/pipeline-charts";
import { FINANCE_TERMS } from "@/lib/glossary";
import type { GroupSort } from "@/lib/pipeline/sort-quotes";
import { formatMoney } from "@/lib/results/format";

// The sums behind a pipeline chart as a table, already sorted on the server; each header links to
// the same page with this table's sort in the URL (so a sorted view can be bookmarked).
export function ValueTable({
  rows,
  currency,
  first,
  caption,
  sort,
  dir,
  href,
}: {
  rows: ValueRow[];
  currency: string;
  first: string;
  caption: string;
  sort: GroupSort;
  dir: "asc" | "desc";
  href: (column: GroupSort, dir: "asc" | "desc") => string;
}) {
  const header = (label: string, column: GroupSort, right = true) => (
    <SortHeader
      label={label}
      column={column}
      sort={sort}
      dir={dir}
      href={(c, d) => href(c as GroupSort, d)}
      className={right ? "text-right" : undefined}
    />
  );
  return (
    <Table caption={caption}>
      <thead>
        <tr>
          {header(first, "label", false)}
          {header("Quotes", "count")}
          {header(`${FINANCE_TERMS.vendorRevenue} [${currency}]`, "revenue")}
          {header(`${FINANCE_TERMS.weightedRevenue} [${currency}]`, "weighted")}
          {header(`${FINANCE_TERMS.customerInvestment} [${currency}]`, "investment")}
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {rows.map((r) => (
          <tr key={r.key}>
            <Td>{r.label}</Td>
            <Td className="text-right tabular-nums">{r.count}</Td>
            <NumberTd>{formatMoney(r.revenue, currency)}</NumberTd>
            <NumberTd>{formatMoney(r.weighted, currency)}</NumberTd>
            <NumberTd>{formatMoney(r.value, currency)}</NumberTd>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
