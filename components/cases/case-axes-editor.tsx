"use client";

import { useMemo, useState, useTransition } from "react";
import { setAxisRetrofitAction, setCaseAxesAction } from "@/server/cases/actions";
import { Button } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { Table, Td, Th } from "@/components/ui/table";
import { useDebouncedInvalidate } from "@/lib/hooks/use-case-result";

type CaseAxis = {
  axisId: number;
  label: string;
  machineName: string;
  quantity: number;
  kitId: number;
  installHours: number;
  discountPct: number;
};
type SiteAxis = { id: number; label: string; machineName: string; quantity: number };
type Kit = { id: number; code: string; name: string; price: string; currency: string };

// The axes of the case with their kit, and the site's axes to pick from (filter, select all
// visible, save). Each change recomputes the results above.
export function CaseAxesEditor({
  caseId,
  caseAxes,
  siteAxes,
  kits,
}: {
  caseId: number;
  caseAxes: CaseAxis[];
  siteAxes: SiteAxis[];
  kits: Kit[];
}) {
  const refresh = useDebouncedInvalidate(caseId);
  const [picked, setPicked] = useState(() => new Set(caseAxes.map((a) => a.axisId)));
  const [filter, setFilter] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  const [pending, start] = useTransition();
  const visible = useMemo(() => {
    const q = filter.trim().toLowerCase();
    return q
      ? siteAxes.filter((a) => `${a.label} ${a.machineName}`.toLowerCase().includes(q))
      : siteAxes;
  }, [filter, siteAxes]);

  function toggle(id: number, on: boolean) {
    const next = new Set(picked);
    if (on) next.add(id);
    else next.delete(id);
    setPicked(next);
  }

  function save() {
    start(async () => {
      const result = await setCaseAxesAction(caseId, { axisIds: [...picked] });
      setMessage(result.ok ? `The case now holds ${result.data.total} axes.` : result.message);
      if (result.ok) {
        refresh();
      }
    });
  }

  function changeKit(axis: CaseAxis, kitId: number, installHours = axis.installHours) {
    start(async () => {
      const result = await setAxisRetrofitAction(caseId, axis.axisId, {
        kitId,
        installHours,
        discountPct: axis.discountPct,
      });
      setMessage(result.ok ? `Saved ${axis.label} (${axis.machineName}).` : result.message);
      if (result.ok) {
        refresh();
      }
    });
  }

  return (
    <div className="space-y-6">
      <div>
        <h3 className="mb-2 text-body">Axes in this case ({caseAxes.length})</h3>
        <Table caption="Axes in this case and their kits">
          <thead>
            <tr>
              <Th>Axis</Th>
              <Th>Machine</Th>
              <Th className="text-right">Qty</Th>
              <Th>Kit</Th>
              <Th>Install hours</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {caseAxes.map((a) => (
              <tr key={a.axisId}>
                <Td className="font-bold">{a.label}</Td>
                <Td>{a.machineName}</Td>
                <Td className="text-right tabular-nums">{a.quantity}</Td>
                <Td>
                  <label className="sr-only" htmlFor={`kit-${a.axisId}`}>
                    Kit for {a.label} of {a.machineName}
                  </label>
                  <Select
                    id={`kit-${a.axisId}`}
                    className="w-72 py-1 text-small"
                    value={a.kitId}
                    disabled={pending}
                    onChange={(e) => changeKit(a, Number(e.target.value))}
                  >
                    {kits.map((k) => (
                      <option key={k.id} value={k.id}>
                        {k.code} · {k.name} · {k.price} {k.currency}
                      </option>
                    ))}
                  </Select>
                </Td>
                <Td>
                  <label className="sr-only" htmlFor={`hours-${a.axisId}`}>
                    Install hours for {a.label} of {a.machineName}
                  </label>
                  <Input
                    id={`hours-${a.axisId}`}
                    type="number"
                    step="any"
                    min={0}
                    defaultValue={a.installHours}
                    className="w-24 py-1 text-small"
                    onBlur={(e) => {
                      const hours = Number(e.target.value);
                      if (e.target.value !== "" && hours !== a.installHours)
                        changeKit(a, a.kitId, hours);
                    }}
                  />
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
      </div>
      <details open={caseAxes.length === 0}>
        <summary className="cursor-pointer font-bold text-flux-700">
          Pick axes from the site ({picked.size} picked)
        </summary>
        <div className="mt-3 space-y-3">
          <div className="flex flex-wrap items-end gap-3">
            <div>
              <label htmlFor="pick-filter" className="block text-small font-bold">
                Label or machine contains
              </label>
              <Input
                id="pick-filter"
                value={filter}
                onChange={(e) => setFilter(e.target.value)}
                className="w-64"
              />
            </div>
            <Button
              variant="secondary"
              onClick={() => setPicked(new Set([...picked, ...visible.map((a) => a.id)]))}
            >
              Select all visible ({visible.length})
            </Button>
            <Button
              variant="secondary"
              onClick={() =>
                setPicked(new Set([...picked].filter((id) => !visible.some((a) => a.id === id))))
              }
            >
              Clear visible
            </Button>
            <Button onClick={save} disabled={pending}>
              Save selection
            </Button>
          </div>
          <div className="max-h-80 overflow-auto rounded-panel border border-steel-200 bg-white">
            <ul className="divide-y divide-steel-100">
              {visible.map((a) => (
                <li key={a.id} className="px-3 py-1.5 text-small">
                  <label className="flex items-center gap-2">
                    <input
                      type="checkbox"
                      checked={picked.has(a.id)}
                      onChange={(e) => toggle(a.id, e.target.checked)}
                    />
                    <span className="font-bold">{a.label}</span>
                    <span className="text-steel-700">· {a.machineName}</span>
                    {a.quantity > 1 ? <span className="text-steel-700">× {a.quantity}</span> : null}
                  </label>
                </li>
              ))}
            </ul>
          </div>
        </div>
      </details>
      <p aria-live="polite" className="text-small font-bold text-steel-800">
        {message}
      </p>
    </div>
  );
}
