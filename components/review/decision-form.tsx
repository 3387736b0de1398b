"use client";

import { useRouter } from "next/navigation";
import { useState, useTransition } from "react";
import { decideAction } from "@/server/review/actions";
import { SubmitRow, type FormMessage } from "@/components/ui/submit-row";
import { DECISION_CHOICES, type DecisionKey } from "@/lib/glossary";

const CHOICES = (["accept", "changes", "decline"] as const).map((value) => ({
  value,
  ...DECISION_CHOICES[value],
}));

type Decision = DecisionKey;

/** The reviewer's decision with a comment; the supplier's engineer is told by e-mail. */
export function DecisionForm({ proposalId }: { proposalId: number }) {
  const router = useRouter();
  const [decision, setDecision] = useState<Decision | null>(null);
  const [comment, setComment] = useState("");
  const [message, setMessage] = useState<FormMessage>(null);
  const [pending, start] = useTransition();

  function submit(event: React.FormEvent) {
    event.preventDefault();
    if (!decision) return setMessage({ tone: "error", text: "Choose one of the three answers." });
    start(async () => {
      const result = await decideAction(proposalId, { decision, comment });
      if (!result.ok)
        return setMessage({
          tone: "error",
          text: result.fieldErrors.comment ?? result.message,
        });
      const text =
        result.data.mail.status === "queued"
          ? `Your decision is recorded. ${result.data.mail.notice}`
          : "Your decision is recorded and your supplier has been told.";
      setMessage({ tone: "ok", text });
      // An accept or decline takes this form off the page, and its message with it: the page
      // repeats the confirmation from the address.
      router.replace(`?recorded=${result.data.mail.status}#decision`, { scroll: false });
    });
  }

  return (
    <form onSubmit={submit} aria-label="Decision" className="space-y-4">
      <fieldset>
        <legend className="mb-2 text-small font-bold text-steel-800">Your answer</legend>
        <div className="grid gap-2 md:grid-cols-3">
          {CHOICES.map((c) => (
            <label
              key={c.value}
              className={`flex cursor-pointer gap-3 rounded-md border p-3 ${decision === c.value ? "border-flux-600 bg-flux-50" : "border-steel-300 bg-white hover:border-flux-400"}`}
            >
              <input
                type="radio"
                name="decision"
                value={c.value}
                checked={decision === c.value}
                onChange={() => setDecision(c.value)}
                className="mt-1"
              />
              <span>
                <span className="block font-bold text-steel-900">{c.label}</span>
                <span className="block text-small text-steel-700">{c.hint}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>
      <div className="space-y-1">
        <label htmlFor="decision-comment" className="block text-small font-bold text-steel-800">
          Comment {decision === "changes" ? "(required: what should change?)" : "(optional)"}
        </label>
        <textarea
          id="decision-comment"
          value={comment}
          onChange={(e) => setComment(e.target.value)}
          rows={3}
          maxLength={4000}
          className="block w-full rounded-md border border-steel-300 bg-white px-3 py-2 text-body"
        />
      </div>
      <SubmitRow
        label="Send my decision"
        pending={pending}
        pendingLabel="Sending…"
        message={message}
      />
    </form>
  );
}
