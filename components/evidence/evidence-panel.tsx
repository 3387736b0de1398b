"use client";

import { useRouter } from "next/navigation";
import { useId, useState, type FormEvent } from "react";
import { clearEvidenceAction, saveEvidenceAction } from "@/server/evidence/actions";
import { Button } from "@/components/ui/button";
import { Field, Input } from "@/components/ui/field";
import type { EvidenceEntry, EvidenceSubject } from "@/lib/evidence/subjects";

/** One typed figure of the subject: its field, its label and its value as the form shows it. */
export interface EvidenceFigure {
  field: string;
  label: string;
  value: string;
}

/**
 * The typed value figures of one axis, machine or case beside where each comes from: a note,
 * the date it was given and who gave it (db/schema/evidence.ts). A figure without a source says
 * so, since the case's headline warns when most of the value rests on such figures.
 */
export function EvidencePanel({
  subjectType,
  subjectId,
  figures,
  entries,
}: {
  subjectType: EvidenceSubject;
  subjectId: number;
  figures: EvidenceFigure[];
  entries: EvidenceEntry[];
}) {
  const byField = new Map(entries.map((e) => [e.field, e]));
  return (
    <div className="space-y-3">
      <p className="text-small text-steel-700">
        Where each figure the value rests on comes from. A reviewer can follow up a figure that
        names its source, its date and who gave it.
      </p>
      <ul className="divide-y divide-steel-100" aria-label="Sources of the typed figures">
        {figures.map((f) => (
          <EvidenceRow
            key={f.field}
            subjectType={subjectType}
            subjectId={subjectId}
            figure={f}
            entry={byField.get(f.field)}
          />
        ))}
      </ul>
    </div>
  );
}

function EvidenceRow({
  subjectType,
  subjectId,
  figure,
  entry,
}: {
  subjectType: EvidenceSubject;
  subjectId: number;
  figure: EvidenceFigure;
  entry: EvidenceEntry | undefined;
}) {
  const router = useRouter();
  const id = useId();
  const [open, setOpen] = useState(false);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [status, setStatus] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);
  const subject = { subjectType, subjectId, field: figure.field };

  async function onSubmit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    const form = new FormData(event.currentTarget);
    setBusy(true);
    const result = await saveEvidenceAction({
      ...subject,
      note: form.get("note"),
      givenOn: form.get("givenOn"),
      givenBy: form.get("givenBy"),
    });
    setBusy(false);
    if (result.ok) {
      setErrors({});
      setStatus({ tone: "ok", text: "Source saved." });
      setOpen(false);
      router.refresh();
    } else {
      setErrors(result.fieldErrors);
      setStatus({ tone: "error", text: result.message });
    }
  }

  async function onClear() {
    setBusy(true);
    const result = await clearEvidenceAction(subject);
    setBusy(false);
    setStatus(
      result.ok ? { tone: "ok", text: "Source removed." } : { tone: "error", text: result.message },
    );
    if (result.ok) router.refresh();
  }

  return (
    <li className="py-3" data-testid={`evidence-${figure.field}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <p className="text-small">
          <span className="font-bold text-steel-900">{figure.label}</span>{" "}
          <span className="tabular-nums text-steel-700">{figure.value}</span>
        </p>
        <Button
          type="button"
          variant="secondary"
          size="sm"
          aria-expanded={open}
          aria-controls={`${id}-form`}
          onClick={() => setOpen(!open)}
        >
          {open ? "Close" : entry ? "Change source" : "Record source"}
        </Button>
      </div>
      {entry ? (
        <p className="mt-1 break-words text-small text-steel-800">
          Source: {entry.note} — {entry.givenBy}, {entry.givenOn}
        </p>
      ) : (
        <p className="mt-1 text-small text-caution-700">No source recorded: typed, unevidenced.</p>
      )}
      {open ? (
        <form
          id={`${id}-form`}
          aria-label={`Source of ${figure.label.toLowerCase()}`}
          onSubmit={onSubmit}
          noValidate
          className="mt-3 grid gap-3 sm:grid-cols-3"
        >
          <div className="sm:col-span-3">
            <Field
              id={`${id}-note`}
              label="Where it comes from"
              hint="Such as “maintenance log 2025, line 3” or “plant manager's estimate”"
              error={errors.note}
            >
              <Input
                id={`${id}-note`}
                name="note"
                defaultValue={entry?.note ?? ""}
                invalid={!!errors.note}
              />
            </Field>
          </div>
          <Field id={`${id}-givenOn`} label="Date given" error={errors.givenOn}>
            <Input
              id={`${id}-givenOn`}
              name="givenOn"
              type="date"
              defaultValue={entry?.givenOn ?? ""}
              invalid={!!errors.givenOn}
            />
          </Field>
          <Field id={`${id}-givenBy`} label="Who gave it" error={errors.givenBy}>
            <Input
              id={`${id}-givenBy`}
              name="givenBy"
              defaultValue={entry?.givenBy ?? ""}
              invalid={!!errors.givenBy}
            />
          </Field>
          <div className="flex flex-wrap items-end gap-2">
            <Button type="submit" size="sm" disabled={busy}>
              {busy ? "Saving…" : "Save source"}
            </Button>
            {entry ? (
              <Button type="button" variant="secondary" size="sm" disabled={busy} onClick={onClear}>
                Remove source
              </Button>
            ) : null}
          </div>
        </form>
      ) : null}
      <p
        aria-live="polite"
        role="status"
        className={`text-small font-bold ${status?.tone === "ok" ? "text-success-700" : "text-danger-700"}`}
      >
        {status?.text}
      </p>
    </li>
  );
}
