import Link from "next/link";
import { Table, Td, Th } from "@/components/ui/table";

// "Axis rows" counts the rows of the axes list; "Axes (with quantity)" adds up each row's
// quantity, the number of identical physical axes that row stands for.

export function MachinesTable({
  machines,
  siteId,
  currency,
}: {
  machines: {
    id: number;
    name: string;
    line: string | null;
    downtimeHours: number;
    throughputGainPct: number;
    marginPerOutputHour: string;
    axisRows: number;
    axisUnits: number;
  }[];
  siteId: number;
  currency: string;
}) {
  return (
    <Table caption="Machines of this site">
      <thead>
        <tr>
          <Th>Machine</Th>
          <Th>Line</Th>
          <Th className="text-right">Axis rows</Th>
          <Th className="text-right">
            Axes <span className="font-normal">(with quantity)</span>
          </Th>
          <Th className="text-right">Retrofit downtime [h]</Th>
          <Th className="text-right">Throughput gain [%]</Th>
          <Th className="text-right">Margin per output hour</Th>
          <Th>
            <span className="sr-only">Actions</span>
          </Th>
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {machines.map((m) => (
          <tr key={m.id}>
            <Td className="font-bold">
              <Link href={`/machines/${m.id}`} className="text-flux-700 hover:underline">
                {m.name}
              </Link>
            </Td>
            <Td>{m.line ?? "—"}</Td>
            <Td className="text-right tabular-nums">{m.axisRows}</Td>
            <Td className="text-right tabular-nums">{m.axisUnits}</Td>
            <Td className="text-right tabular-nums">{m.downtimeHours}</Td>
            <Td className="text-right tabular-nums">{m.throughputGainPct}</Td>
            <Td className="text-right tabular-nums">
              {m.marginPerOutputHour} {currency}
            </Td>
            <Td>
              <Link
                href={`/sites/${siteId}?machine=${m.id}`}
                className="text-flux-700 hover:underline"
                aria-label={`Its axes here: ${m.name}`}
              >
                Its axes here
              </Link>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
