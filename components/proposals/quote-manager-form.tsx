"use client";

import { useState, useTransition } from "react";
import { approveDiscountAction, updateQuoteAction } from "@/server/proposals/actions";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import type { QuoteStage } from "@/lib/pipeline/stages";
import { SubmitRow, type FormMessage } from "@/components/ui/submit-row";
import { QuoteStageOptions } from "@/components/proposals/quote-stage-options";
import { ROLE_LABELS, type RoleKey } from "@/lib/glossary";

/** A manager's controls on a quote: stage, owner, expected close date. Every change is audited. */
export function QuoteManagerForm({
  proposalId,
  stage,
  ownerId,
  expectedCloseOn,
  owners,
}: {
  proposalId: number;
  stage: QuoteStage;
  ownerId: number;
  expectedCloseOn: string;
  owners: { id: number; name: string; role: RoleKey }[];
}) {
  const [values, setValues] = useState({ stage, ownerId: String(ownerId), expectedCloseOn });
  const [message, setMessage] = useState<FormMessage>(null);
  const [pending, start] = useTransition();

  function submit(event: React.FormEvent) {
    event.preventDefault();
    start(async () => {
      const result = await updateQuoteAction(proposalId, {
        stage: values.stage,
        ownerId: Number(values.ownerId),
        expectedCloseOn: values.expectedCloseOn,
      });
      if (!result.ok)
        return setMessage({
          tone: "error",
          text: Object.values(result.fieldErrors)[0] ?? result.message,
        });
      setMessage({
        tone: "ok",
        text: result.data.changes.length
          ? `Saved: ${result.data.changes.join("; ")}.`
          : "Nothing changed.",
      });
    });
  }

  return (
    <form onSubmit={submit} aria-label="Manage the quote" className="space-y-4">
      <div className="grid gap-4 md:grid-cols-3">
        <Field id="quote-stage" label="Stage">
          <Select
            id="quote-stage"
            value={values.stage}
            onChange={(e) => setValues((v) => ({ ...v, stage: e.target.value as QuoteStage }))}
          >
            <QuoteStageOptions />
          </Select>
        </Field>
        <Field id="quote-owner" label="Owner">
          <Select
            id="quote-owner"
            value={values.ownerId}
            onChange={(e) => setValues((v) => ({ ...v, ownerId: e.target.value }))}
          >
            {owners.map((o) => (
              <option key={o.id} value={o.id}>
                {o.name} ({ROLE_LABELS[o.role]})
              </option>
            ))}
          </Select>
        </Field>
        <Field id="quote-close" label="Expected close">
          <Input
            id="quote-close"
            type="date"
            value={values.expectedCloseOn}
            onChange={(e) => setValues((v) => ({ ...v, expectedCloseOn: e.target.value }))}
          />
        </Field>
      </div>
      <SubmitRow label="Save quote" variant="secondary" pending={pending} message={message} />
    </form>
  );
}

/** A manager approves a kit discount above the threshold, so the proposal may be sent. */
export function ApproveDiscountButton({ proposalId }: { proposalId: number }) {
  const [message, setMessage] = useState<string | null>(null);
  const [pending, start] = useTransition();
  return (
    <div className="flex flex-wrap items-center gap-3">
      <Button
        disabled={pending}
        onClick={() =>
          start(async () => {
            const result = await approveDiscountAction(proposalId);
            if (!result.ok) return setMessage(result.message);
          })
        }
      >
        Approve the discount
      </Button>
      <p aria-live="polite" role="status" className="text-small font-bold text-danger-700">
        {message}
      </p>
    </div>
  );
}
