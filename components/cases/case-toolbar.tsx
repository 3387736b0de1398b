"use client";

import { useState, useTransition } from "react";
import { freezeProposalAction, suggestKitsAction } from "@/server/cases/actions";
import { Button, buttonClass } from "@/components/ui/button";
import { useDebouncedInvalidate } from "@/lib/hooks/use-case-result";

// Suggest kits, freeze a proposal, download the workbook of the case as it stands.
export function CaseToolbar({ caseId, canFreeze }: { caseId: number; canFreeze: boolean }) {
  const refresh = useDebouncedInvalidate(caseId);
  const [message, setMessage] = useState<{
    tone: "ok" | "error";
    text: string;
    details?: string[];
  } | null>(null);
  const [pending, start] = useTransition();

  function suggest() {
    start(async () => {
      const result = await suggestKitsAction(caseId);
      if (!result.ok) return setMessage({ tone: "error", text: result.message });
      const none = result.data.filter((r) => r.kitId === null);
      setMessage({
        tone: "ok",
        text: `Kits suggested for ${result.data.length - none.length} of ${result.data.length} axes.`,
        details: none.map((r) => r.reason),
      });
      refresh();
    });
  }

  function freeze() {
    start(async () => {
      const result = await freezeProposalAction(caseId);
      if (!result.ok) return setMessage({ tone: "error", text: result.message });
      setMessage({ tone: "ok", text: `Frozen as proposal version ${result.data.version}.` });
    });
  }

  return (
    <div className="space-y-2">
      <div className="flex flex-wrap gap-2">
        <Button variant="secondary" onClick={suggest} disabled={pending}>
          Suggest kits
        </Button>
        <a href={`/api/v1/cases/${caseId}/workbook`} className={buttonClass("secondary")}>
          Download workbook
        </a>
        <Button onClick={freeze} disabled={pending || !canFreeze}>
          Freeze as proposal
        </Button>
      </div>
      <div
        aria-live="polite"
        className={`text-small font-bold ${message?.tone === "error" ? "text-danger-700" : "text-success-700"}`}
      >
        {message?.text}
        {message?.details?.length ? (
          <ul className="mt-1 list-disc pl-5 font-normal text-steel-800">
            {message.details.slice(0, 5).map((d, i) => (
              <li key={i}>{d}</li>
            ))}
          </ul>
        ) : null}
      </div>
    </div>
  );
}
