"use client";

import { useState, useTransition } from "react";
import { setCaseAxesRetrofitAction } from "@/server/cases/actions";
import { Button } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { StatusLine } from "@/components/installed-base/use-action-form";
import { RETROFIT_LABELS } from "@/lib/validations/case";
import { DiscountRule } from "./discount-rule";
import { parseTypedNumber } from "@/lib/validations/typed-number";

type Kit = { id: number; code: string; name: string; price: string; currency: string };

// A number field left blank stays blank (unchanged); anything typed goes as typed: the server
// reads "2,5" as 2.5 and names the field when it refuses (lib/validations/in-words.ts).
const asTyped = (text: string) => text.trim();

/**
 * Sets kit, discount, install hours and/or commissioning cost on every selected axis in one step;
 * blank fields leave each axis as it is. The server refuses the whole step on any bad value.
 */
export function BulkRetrofitForm({
  caseId,
  selected,
  kits,
  currency,
  thresholdPct,
  onApplied,
}: {
  caseId: number;
  selected: number[];
  kits: Kit[];
  currency: string;
  thresholdPct: number;
  onApplied: () => void;
}) {
  const [kitId, setKitId] = useState("");
  const [discount, setDiscount] = useState("");
  const [hours, setHours] = useState("");
  const [commissioning, setCommissioning] = useState("");
  const [status, setStatus] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [pending, start] = useTransition();
  const count = selected.length;
  const typedDiscount = parseTypedNumber(discount);
  const discountAbove = typedDiscount.ok && typedDiscount.value > thresholdPct;

  function apply(e: React.FormEvent) {
    e.preventDefault();
    start(async () => {
      const result = await setCaseAxesRetrofitAction(caseId, {
        axisIds: selected,
        kitId: kitId === "" ? "" : Number(kitId),
        discountPct: asTyped(discount),
        installHours: asTyped(hours),
        commissioningCost: commissioning.trim(),
      });
      if (!result.ok) {
        setStatus({ tone: "error", text: Object.values(result.fieldErrors)[0] ?? result.message });
        return;
      }
      setKitId("");
      setDiscount("");
      setHours("");
      setCommissioning("");
      setStatus({
        tone: "ok",
        text: `Set ${result.data.fields.join(", ")} on ${result.data.changed} ${result.data.changed === 1 ? "axis" : "axes"}.`,
      });
      onApplied();
    });
  }

  return (
    <form
      aria-label="Set terms for selected axes"
      onSubmit={apply}
      noValidate
      className="space-y-3 rounded-panel border border-steel-200 bg-steel-50 p-3"
    >
      <p className="text-small font-bold text-steel-800">
        Set for the {count} selected {count === 1 ? "axis" : "axes"} (blank fields stay as they are)
      </p>
      <div className="flex flex-wrap items-start gap-3">
        <div>
          <label htmlFor="bulk-kit" className="block text-small font-bold">
            {RETROFIT_LABELS.kitId} for selected axes
          </label>
          <Select
            id="bulk-kit"
            className="w-72 max-w-full"
            value={kitId}
            onChange={(e) => setKitId(e.target.value)}
          >
            <option value="">Unchanged</option>
            {kits.map((k) => (
              <option key={k.id} value={k.id}>
                {k.code} · {k.name} · {k.price} {k.currency}
              </option>
            ))}
          </Select>
        </div>
        <div>
          <label htmlFor="bulk-discount" className="block text-small font-bold">
            {RETROFIT_LABELS.discountPct} for selected axes
          </label>
          <Input
            id="bulk-discount"
            type="text"
            inputMode="decimal"
            value={discount}
            onChange={(e) => setDiscount(e.target.value)}
            aria-describedby="bulk-discount-rule"
            className="w-28"
          />
          <div className="mt-1 max-w-60">
            <DiscountRule
              id="bulk-discount-rule"
              thresholdPct={thresholdPct}
              above={discountAbove}
            />
          </div>
        </div>
        <div>
          <label htmlFor="bulk-hours" className="block text-small font-bold">
            {RETROFIT_LABELS.installHours} for selected axes
          </label>
          <Input
            id="bulk-hours"
            type="text"
            inputMode="decimal"
            value={hours}
            onChange={(e) => setHours(e.target.value)}
            className="w-28"
          />
        </div>
        <div>
          <label htmlFor="bulk-commissioning" className="block text-small font-bold">
            {RETROFIT_LABELS.commissioningCost} ({currency}) for selected axes
          </label>
          <Input
            id="bulk-commissioning"
            inputMode="decimal"
            value={commissioning}
            onChange={(e) => setCommissioning(e.target.value)}
            className="w-36"
          />
        </div>
        {/* Level with the inputs, below their labels. */}
        <div className="pt-6">
          <Button type="submit" disabled={pending || count === 0}>
            {pending ? "Applying…" : "Apply to selected axes"}
          </Button>
        </div>
      </div>
      <StatusLine status={status} />
    </form>
  );
}
