import Link from "next/link";
import { ListFilterForm } from "@/components/ui/list-filter-form";
import { Pager } from "@/components/ui/pager";
import { SortHeader, Table, Td, Th } from "@/components/ui/table";
import type { listMachineAxes } from "@/db/queries/machine-series";
import { listHref } from "@/lib/lists/list-params";
import type { MachineAxisListParams } from "@/lib/validations/installed-base";

type Result = ReturnType<typeof listMachineAxes>;

// The machine page's axes, paged in SQL; filter, sort and page live in the URL (lib/lists).
export function MachineAxesTable({
  machineId,
  result,
  params,
  current,
}: {
  machineId: number;
  result: Result;
  params: MachineAxisListParams;
  current: Record<string, string | undefined>;
}) {
  const path = `/machines/${machineId}`;
  const { deleted: _deleted, ...kept } = current;
  const sortHref = (column: string, dir: "asc" | "desc") =>
    listHref(path, kept, { sort: column, dir });
  const sortProps = { sort: params.sort, dir: params.dir, href: sortHref };
  return (
    <div className="space-y-3">
      <ListFilterForm
        action={path}
        label="Filter this machine's axes"
        search={{
          id: "machine-axes-q",
          label: "Axis label contains",
          value: params.q,
          width: "w-56",
        }}
        keep={{ sort: params.sort, dir: params.dir }}
        submitLabel="Filter"
      />
      <Table caption="Axes of this machine">
        <thead>
          <tr>
            <SortHeader label="Axis" column="label" {...sortProps} />
            <SortHeader label="Quantity" column="quantity" {...sortProps} />
            <Th>Asset tag</Th>
            <SortHeader label="Holding torque [N·m]" column="holdingTorqueNm" {...sortProps} />
            <SortHeader label="Speed [rpm]" column="speedRpm" {...sortProps} />
            <SortHeader label="Current setting [A]" column="currentSettingA" {...sortProps} />
          </tr>
        </thead>
        <tbody className="divide-y divide-steel-100">
          {result.rows.map((a) => (
            <tr key={a.id}>
              <Td className="font-bold">
                <Link href={`/axes/${a.id}`} className="text-flux-700 hover:underline">
                  {a.label}
                </Link>
              </Td>
              <Td className="text-right tabular-nums">{a.quantity}</Td>
              <Td>{a.assetTag ?? "—"}</Td>
              <Td className="text-right tabular-nums">{a.holdingTorqueNm}</Td>
              <Td className="text-right tabular-nums">{a.speedRpm}</Td>
              <Td className="text-right tabular-nums">{a.currentSettingA}</Td>
            </tr>
          ))}
          {result.rows.length === 0 ? (
            <tr>
              <Td colSpan={6} className="py-6 text-center text-steel-700">
                {params.q ? "No axis of this machine matches." : "This machine has no axes yet."}
              </Td>
            </tr>
          ) : null}
        </tbody>
      </Table>
      <Pager
        page={result.page}
        pageCount={result.pageCount}
        total={result.total}
        noun={["axis row", "axis rows"]}
        href={(page) => listHref(path, kept, { page })}
      />
    </div>
  );
}
