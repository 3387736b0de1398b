import Link from "next/link";
import { buttonClass } from "@/components/ui/button";
import { ListFilterForm } from "@/components/ui/list-filter-form";
import { SortHeader, Table, Td, Th } from "@/components/ui/table";
import type { listAxes } from "@/db/queries/axes";
import type { AxisListParams } from "@/lib/validations/installed-base";
import { AXIS_COLUMNS, DEFAULT_AXIS_COLUMNS } from "./axis-columns";

type Result = ReturnType<typeof listAxes>;

// The site's axes, a page of 50 at a time; filter, sort, page and column choice all live in the
// URL so the server does the work and a view can be shared.
export function AxesTable({
  siteId,
  machines,
  result,
  params,
  columns,
}: {
  siteId: number;
  machines: { id: number; name: string }[];
  result: Result;
  params: AxisListParams;
  columns: string[];
}) {
  const chosen = columns.length ? columns : DEFAULT_AXIS_COLUMNS;
  const shown = AXIS_COLUMNS.filter((c) => chosen.includes(c.key));
  const href = (changes: Record<string, string | number | undefined>) => {
    const qs = new URLSearchParams();
    const merged = {
      q: params.q,
      machine: params.machineId,
      sort: params.sort,
      dir: params.dir,
      page: params.page,
      ...changes,
    };
    for (const [k, v] of Object.entries(merged))
      if (v !== undefined && v !== "") qs.set(k, String(v));
    for (const c of columns) qs.append("col", c);
    return `/sites/${siteId}?${qs}`;
  };
  const sortHref = (column: string, dir: "asc" | "desc") => href({ sort: column, dir, page: 1 });

  return (
    <div className="space-y-3">
      <ListFilterForm
        action={`/sites/${siteId}`}
        label="Filter axes"
        search={{
          id: "axes-q",
          label: "Label or machine contains",
          value: params.q,
          width: "w-56",
        }}
        selects={[
          {
            id: "axes-machine",
            name: "machine",
            label: "Machine",
            value: params.machineId ? String(params.machineId) : undefined,
            anyLabel: "All machines",
            options: machines.map((m) => ({ value: m.id, label: m.name })),
            width: "w-56",
          },
        ]}
        keep={{ sort: params.sort, dir: params.dir }}
        submitLabel="Apply"
      >
        <details className="relative">
          <summary className={`${buttonClass("secondary")} cursor-pointer list-none`}>
            Columns
          </summary>
          <fieldset className="absolute z-10 mt-1 grid w-72 gap-1 rounded-panel border border-steel-200 bg-white p-3 shadow-panel">
            <legend className="sr-only">Columns to show</legend>
            {AXIS_COLUMNS.map((c) => (
              <label key={c.key} className="flex items-center gap-2 text-small">
                <input
                  type="checkbox"
                  name="col"
                  value={c.key}
                  defaultChecked={chosen.includes(c.key)}
                />
                {c.label}
              </label>
            ))}
          </fieldset>
        </details>
      </ListFilterForm>

      <Table caption="Axes of this site">
        <thead>
          <tr>
            <SortHeader
              label="Axis"
              column="label"
              sort={params.sort}
              dir={params.dir}
              href={sortHref}
            />
            {shown.map((c) =>
              c.sort ? (
                <SortHeader
                  key={c.key}
                  label={c.label}
                  column={c.sort}
                  sort={params.sort}
                  dir={params.dir}
                  href={sortHref}
                />
              ) : (
                <Th key={c.key} className={c.numeric ? "text-right" : ""}>
                  {c.label}
                </Th>
              ),
            )}
            <Th>
              <span className="sr-only">Edit</span>
            </Th>
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {result.rows.map((row) => (
            <tr key={row.id}>
              <Td className="font-bold">{row.label}</Td>
              {shown.map((c) => (
                <Td key={c.key} className={c.numeric ? "text-right tabular-nums" : ""}>
                  {c.value(row)}
                </Td>
              ))}
              <Td>
                <Link
                  href={`/axes/${row.id}`}
                  className="text-flux-700 hover:underline"
                  aria-label={`Edit ${row.label} of ${row.machineName}`}
                >
                  Edit
                </Link>
              </Td>
            </tr>
          ))}
          {result.rows.length === 0 ? (
            <tr>
              <Td colSpan={shown.length + 2} className="py-6 text-center text-steel-700">
                No axis matches. Add one, or import a spreadsheet below.
              </Td>
            </tr>
          ) : null}
        </tbody>
      </Table>

      <nav
        aria-label="Pages of axes"
        className="flex items-center justify-between text-small text-steel-700"
      >
        <span>
          Page {result.page} of {result.pageCount} · {result.total.toLocaleString("en")} axis rows
        </span>
        <span className="flex gap-2">
          {result.page > 1 ? (
            <Link className={buttonClass("secondary", "sm")} href={href({ page: result.page - 1 })}>
              Previous
            </Link>
          ) : null}
          {result.page < result.pageCount ? (
            <Link className={buttonClass("secondary", "sm")} href={href({ page: result.page + 1 })}>
              Next
            </Link>
          ) : null}
        </span>
      </nav>
    </div>
  );
}
