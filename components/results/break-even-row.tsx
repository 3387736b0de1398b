import type { ReactNode } from "react";

/** One row of a break-even list: the term, then its value with the sentence that explains it. */
export function BreakEvenRow({
  term,
  value,
  note,
}: {
  term: ReactNode;
  value: ReactNode;
  note?: ReactNode;
}) {
  return (
    <div className="grid gap-1 py-3 sm:grid-cols-[12rem_1fr]">
      <dt className="font-bold text-steel-800">{term}</dt>
      <dd>
        <span className="font-bold text-steel-900">{value}</span>
        {note ? <span className="mt-0.5 block text-small text-steel-700">{note}</span> : null}
      </dd>
    </div>
  );
}
