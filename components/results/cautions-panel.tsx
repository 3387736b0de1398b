import { Panel } from "@/components/ui/panel";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import { warningGroups } from "@/lib/results/axis-rows";
import { namesById } from "@/lib/results/case-view";
import { caseCautions } from "@/lib/results/warnings";

// More names than this make a wall of text; the axis table names every one.
const NAMED_AXES = 8;

/** The cautions of this case, as the proposal carries them; local codes and licensed practice prevail. */
export function CautionsPanel({ result, input }: { result: CaseResult; input: ParsedCase | null }) {
  const names = namesById(input);
  const cautions = caseCautions(result, (id) => names.axisWithMachine(id));
  // A machine warning shared by several machines is one line naming them all, not one each.
  const machines = warningGroups(result, input).filter((g) => g.scope === "machine");
  return (
    <Panel title="Cautions">
      <ul className="space-y-3">
        {cautions.map((c) => {
          const specific = c.axes.length > 0;
          return (
            <li
              key={c.id}
              className={`rounded-md border-l-4 py-1 pl-3 ${specific ? "border-danger-600 bg-danger-50" : "border-caution-600 bg-caution-50"}`}
            >
              <p className={`font-bold ${specific ? "text-danger-700" : "text-caution-700"}`}>
                {c.title}
              </p>
              <p className="text-small text-steel-900">{c.text}</p>
              {specific ? (
                <p className="mt-1 text-small text-steel-800">
                  Concerns: {c.axes.slice(0, NAMED_AXES).join(", ")}
                  {c.axes.length > NAMED_AXES ? ` and ${c.axes.length - NAMED_AXES} more` : ""}.
                </p>
              ) : null}
            </li>
          );
        })}
        {machines.map((g) => (
          <li key={g.code} className="rounded-md border-l-4 border-steel-400 bg-steel-50 py-1 pl-3">
            <p className="font-bold text-steel-900">{g.title}</p>
            <p className="text-small text-steel-900">{g.sentence}</p>
            <p className="mt-1 text-small text-steel-800">
              Concerns: {g.concerns.slice(0, NAMED_AXES).join(", ")}
              {g.concerns.length > NAMED_AXES ? ` and ${g.concerns.length - NAMED_AXES} more` : ""}.
            </p>
          </li>
        ))}
      </ul>
    </Panel>
  );
}
