"use client";

import { parseTypedNumber } from "@/lib/validations/typed-number";
import { useMemo, useState, useTransition } from "react";
import { setAxisRetrofitAction, setCaseAxesAction } from "@/server/cases/actions";
import { Button } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { Badge } from "@/components/ui/badge";
import { Table, Td, Th } from "@/components/ui/table";
import { useDebouncedInvalidate } from "@/lib/hooks/use-case-result";
import { BulkRetrofitForm } from "./bulk-retrofit-form";
import { DiscountRule } from "./discount-rule";

type CaseAxis = {
  axisId: number;
  label: string;
  machineName: string;
  quantity: number;
  kitId: number;
  kitCode: string;
  kitName: string;
  kitActive: boolean;
  installHours: number;
  discountPct: number;
  commissioningCost: string;
  maintenanceSavingPerYear: string;
};
type SiteAxis = { id: number; label: string; machineName: string; quantity: number };
type Kit = { id: number; code: string; name: string; price: string; currency: string };
type Terms = Pick<
  CaseAxis,
  "kitId" | "discountPct" | "installHours" | "commissioningCost" | "maintenanceSavingPerYear"
>;

// Rows per page of the case's axes table: a case may hold thousands.
const PAGE_SIZE = 50;

// The axes of the case with their kit and terms (each row editable, or many at once through the
// selection), and the site's axes to pick from (filter, select all visible, save). Each change
// recomputes the results above.
export function CaseAxesEditor({
  caseId,
  caseAxes,
  siteAxes,
  kits,
  currency,
  thresholdPct,
}: {
  caseId: number;
  caseAxes: CaseAxis[];
  siteAxes: SiteAxis[];
  kits: Kit[];
  currency: string;
  thresholdPct: number;
}) {
  const refresh = useDebouncedInvalidate(caseId);
  const [picked, setPicked] = useState(() => new Set(caseAxes.map((a) => a.axisId)));
  const [filter, setFilter] = useState("");
  const [message, setMessage] = useState<string | null>(null);
  const [pending, start] = useTransition();
  const [selected, setSelected] = useState<Set<number>>(() => new Set());
  const [page, setPage] = useState(1);
  const visible = useMemo(() => {
    const q = filter.trim().toLowerCase();
    return q
      ? siteAxes.filter((a) => `${a.label} ${a.machineName}`.toLowerCase().includes(q))
      : siteAxes;
  }, [filter, siteAxes]);
  const pageCount = Math.max(1, Math.ceil(caseAxes.length / PAGE_SIZE));
  const shownPage = Math.min(page, pageCount);
  const pageRows = caseAxes.slice((shownPage - 1) * PAGE_SIZE, shownPage * PAGE_SIZE);
  // Axes that left the case are no longer selectable.
  const inCase = new Set(caseAxes.map((a) => a.axisId));
  const selectedIds = [...selected].filter((id) => inCase.has(id));
  const allOnPage = pageRows.length > 0 && pageRows.every((a) => selected.has(a.axisId));

  function toggle(id: number, on: boolean) {
    const next = new Set(picked);
    if (on) next.add(id);
    else next.delete(id);
    setPicked(next);
  }

  function select(ids: number[], on: boolean) {
    const next = new Set(selected);
    for (const id of ids) {
      if (on) next.add(id);
      else next.delete(id);
    }
    setSelected(next);
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

  // One axis's terms, all of them sent so that changing one keeps the others.
  function saveRow(axis: CaseAxis, change: Partial<Terms>) {
    const terms: Terms = {
      kitId: axis.kitId,
      discountPct: axis.discountPct,
      installHours: axis.installHours,
      commissioningCost: axis.commissioningCost,
      maintenanceSavingPerYear: axis.maintenanceSavingPerYear,
      ...change,
    };
    start(async () => {
      const result = await setAxisRetrofitAction(caseId, axis.axisId, terms);
      setMessage(
        result.ok
          ? `Saved ${axis.label} (${axis.machineName}).`
          : `${axis.label} (${axis.machineName}): ${Object.values(result.fieldErrors)[0] ?? result.message}`,
      );
      if (result.ok) {
        refresh();
      }
    });
  }

  // A number typed into a row: blank or unchanged saves nothing; anything else goes as typed, and
  // the server reads "2,5" as 2.5 or names the field in its refusal (lib/validations/in-words.ts).
  function numberChange(axis: CaseAxis, key: "discountPct" | "installHours", text: string) {
    const read = parseTypedNumber(text);
    if (text.trim() === "" || (read.ok && read.value === axis[key])) return;
    saveRow(axis, { [key]: text.trim() } as unknown as Partial<Terms>);
  }

  const name = (a: CaseAxis) => `${a.label} of ${a.machineName}`;

  return (
    <div className="space-y-6">
      <div className="space-y-3">
        <h3 className="text-body">Axes in this case ({caseAxes.length})</h3>
        <DiscountRule id="discount-rule" thresholdPct={thresholdPct} />
        {caseAxes.length ? (
          <BulkRetrofitForm
            caseId={caseId}
            selected={selectedIds}
            kits={kits}
            currency={currency}
            thresholdPct={thresholdPct}
            onApplied={refresh}
          />
        ) : null}
        <Table caption="Axes in this case and their kits">
          <thead>
            <tr>
              <Th>
                <label className="flex items-center gap-2">
                  <input
                    type="checkbox"
                    checked={allOnPage}
                    onChange={(e) =>
                      select(
                        pageRows.map((a) => a.axisId),
                        e.target.checked,
                      )
                    }
                  />
                  <span className="sr-only">Select all axes on this page</span>
                </label>
              </Th>
              <Th>Axis</Th>
              <Th>Machine</Th>
              <Th className="text-right">Qty</Th>
              <Th>Kit</Th>
              <Th>Discount %</Th>
              <Th>Install hours</Th>
              <Th>Commissioning ({currency})</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {pageRows.map((a) => (
              <tr key={a.axisId}>
                <Td>
                  <input
                    type="checkbox"
                    aria-label={`Select ${name(a)}`}
                    checked={selected.has(a.axisId)}
                    onChange={(e) => select([a.axisId], e.target.checked)}
                  />
                </Td>
                <Td className="font-bold">{a.label}</Td>
                <Td>{a.machineName}</Td>
                <Td className="text-right tabular-nums">{a.quantity}</Td>
                <Td>
                  <label className="sr-only" htmlFor={`kit-${a.axisId}`}>
                    Kit for {name(a)}
                  </label>
                  <Select
                    id={`kit-${a.axisId}`}
                    className="w-72 py-1 text-small"
                    value={a.kitId}
                    disabled={pending}
                    onChange={(e) => saveRow(a, { kitId: Number(e.target.value) })}
                  >
                    {/* A retired kit stays on the axis that has it, and nowhere else. */}
                    {a.kitActive ? null : (
                      <option value={a.kitId}>
                        {a.kitCode} · {a.kitName} (retired)
                      </option>
                    )}
                    {kits.map((k) => (
                      <option key={k.id} value={k.id}>
                        {k.code} · {k.name} · {k.price} {k.currency}
                      </option>
                    ))}
                  </Select>
                </Td>
                <Td>
                  <div className="flex items-center gap-2">
                    <label className="sr-only" htmlFor={`discount-${a.axisId}`}>
                      Discount % for {name(a)}
                    </label>
                    <Input
                      // Remounted when the stored value moves (a bulk step), to show it.
                      key={a.discountPct}
                      id={`discount-${a.axisId}`}
                      type="text"
                      inputMode="decimal"
                      defaultValue={a.discountPct}
                      aria-describedby="discount-rule"
                      className="w-20 py-1 text-small"
                      onBlur={(e) => numberChange(a, "discountPct", e.target.value)}
                    />
                    {a.discountPct > thresholdPct ? (
                      <span className="whitespace-nowrap">
                        <Badge tone="caution">Needs approval</Badge>
                      </span>
                    ) : null}
                  </div>
                </Td>
                <Td>
                  <label className="sr-only" htmlFor={`hours-${a.axisId}`}>
                    Install hours for {name(a)}
                  </label>
                  <Input
                    key={a.installHours}
                    id={`hours-${a.axisId}`}
                    type="text"
                    inputMode="decimal"
                    defaultValue={a.installHours}
                    className="w-24 py-1 text-small"
                    onBlur={(e) => numberChange(a, "installHours", e.target.value)}
                  />
                </Td>
                <Td>
                  <label className="sr-only" htmlFor={`commissioning-${a.axisId}`}>
                    Commissioning cost for {name(a)}
                  </label>
                  <Input
                    key={a.commissioningCost}
                    id={`commissioning-${a.axisId}`}
                    inputMode="decimal"
                    defaultValue={a.commissioningCost}
                    className="w-28 py-1 text-small"
                    onBlur={(e) => {
                      const text = e.target.value.trim();
                      if (text !== "" && text !== a.commissioningCost)
                        saveRow(a, { commissioningCost: text });
                    }}
                  />
                </Td>
              </tr>
            ))}
          </tbody>
        </Table>
        {pageCount > 1 ? (
          <nav
            aria-label="Pages of axes"
            className="flex flex-wrap items-center justify-between gap-2"
          >
            <p className="text-small text-steel-700">
              Page {shownPage} of {pageCount} · {selectedIds.length} selected
            </p>
            <div className="flex gap-2">
              <Button
                variant="secondary"
                size="sm"
                disabled={shownPage <= 1}
                onClick={() => setPage(shownPage - 1)}
              >
                Previous page of axes
              </Button>
              <Button
                variant="secondary"
                size="sm"
                disabled={shownPage >= pageCount}
                onClick={() => setPage(shownPage + 1)}
              >
                Next page of axes
              </Button>
            </div>
          </nav>
        ) : null}
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
