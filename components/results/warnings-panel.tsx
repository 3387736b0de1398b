import { Badge } from "@/components/ui/badge";
import { Panel } from "@/components/ui/panel";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { warningGroups } from "@/lib/results/axis-rows";

// More names than this make a wall of text; the axis table marks every one.
const NAMED = 8;
const PLURAL = { axis: ["axis", "axes"], machine: ["machine", "machines"] } as const;

/**
 * Every warning of the case once: what it means, what to do, and where it applies. The axis
 * table shows only each warning's title, so that its rows stay readable on a large fleet.
 */
export function WarningsPanel({ result, input }: { result: CaseResult; input: ParsedCase | null }) {
  const groups = warningGroups(result, input);
  return (
    <Panel title="Warnings and what to do">
      {groups.length === 0 ? (
        <p className="text-steel-700">No axis or machine of this case is flagged.</p>
      ) : (
        <ul className="space-y-4">
          {groups.map((g) => (
            <li
              key={g.code}
              className={`rounded-md border-l-4 py-1 pl-3 ${g.safety ? "border-danger-600" : "border-caution-600"}`}
            >
              <p className="flex flex-wrap items-center gap-2">
                <span className="font-bold text-steel-900">{g.title}</span>
                {g.safety ? <Badge tone="danger">Safety</Badge> : null}
                <span className="text-caption text-steel-600">
                  {g.concerns.length} {PLURAL[g.scope][g.concerns.length === 1 ? 0 : 1]}
                </span>
              </p>
              <p className="mt-1 max-w-3xl text-small text-steel-900">{g.sentence}</p>
              <p className="mt-1 max-w-3xl text-small text-steel-900">
                <span className="font-bold">What to do: </span>
                {g.advice}
              </p>
              <p className="mt-1 text-caption text-steel-700">
                Concerns {g.concerns.slice(0, NAMED).join(", ")}
                {g.concerns.length > NAMED ? ` and ${g.concerns.length - NAMED} more` : ""}.
              </p>
            </li>
          ))}
        </ul>
      )}
    </Panel>
  );
}
