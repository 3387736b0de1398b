import type { z } from "zod";
import { caseInputSchema, formatPath, type CaseInput, type ParsedCase } from "@/lib/engine";
import { StoredInputError } from "@/lib/errors";
import { FIELD_BOUNDS, type FieldBound } from "@/lib/engine/schema-fields";
import { importField } from "@/lib/import/fields";
import { KIT_FIELDS } from "@/lib/fields";
import { RETROFIT_LABELS } from "@/lib/validations/case";
import { upperFirst } from "@/lib/words";

/**
 * A stored value of a case that the engine's bounds refuse: typically one saved before the
 * bounds existed (an ambient of −1000 °C). What the reader needs to fix it: which machine and
 * axis, which field, what the value is, what range is allowed, and the page where it is edited.
 * Nothing is rewritten: the value stays as stored until someone corrects it.
 */
export interface StoredInputProblem {
  /** The machine's name, when the value belongs to an axis or a machine. */
  machine: string | null;
  /** The axis's label, when the value belongs to an axis. */
  axis: string | null;
  axisId: number | null;
  /** The field as the forms and the import template name it, e.g. "Ambient temperature". */
  field: string;
  /** The engine's path of the field, e.g. "axes[0].duty.ambientC". */
  path: string;
  value: unknown;
  /** The allowed range, e.g. "-40 to 80 °C"; null where the field has no single range. */
  allowed: string | null;
  /** The engine's own message, e.g. "must be at least -40 °C". */
  message: string;
  /** The page where the value is corrected (a link beside the text, never in it), and what to do there. */
  fixAt: { href: string; what: string };
  /** One sentence with all of the above. */
  text: string;
}

const withUnit = (value: number, unit: string) => (unit === "" ? `${value}` : `${value} ${unit}`);

export function allowedRange(bound: FieldBound): string {
  const low = bound.minExclusive ? `above ${bound.min}` : `${bound.min}`;
  return `${low} to ${withUnit(bound.max, bound.unit)}`;
}

/** The import template's key of an axis field from its engine path below axes[i]. */
function axisFieldKey(rest: readonly PropertyKey[]): string | null {
  const [group, name, sub] = rest.map(String);
  if (group === "motor" || (group === "duty" && name !== "motion")) return name ?? null;
  if (group === "duty" && name === "motion") return sub ? `motion.${sub}` : "motion.mechanism";
  if (group === "drive")
    return name === "efficiencyPct"
      ? "driveEfficiencyPct"
      : name === "standbyW"
        ? "driveStandbyW"
        : (name ?? null);
  if (group === "reliability") return name === "event" && sub ? `event.${sub}` : (name ?? null);
  return null;
}

/** Engine fields of a case and a machine that are not import columns, with their bound. */
const CASE_FIELD_BOUNDS: Record<string, FieldBound> = {
  "finance.tariffEscalationPct": FIELD_BOUNDS.ratePct,
  "finance.discountRatePct": FIELD_BOUNDS.discountRatePct,
  "finance.inflationPct": FIELD_BOUNDS.ratePct,
  "finance.coolingCop": FIELD_BOUNDS.coolingCop,
  "finance.gridKgCo2PerKWh": FIELD_BOUNDS.gridKgCo2PerKWh,
  "thermal.lifeHalvingK": FIELD_BOUNDS.lifeHalvingK,
  "band.lowPct": FIELD_BOUNDS.bandPct,
  "band.highPct": FIELD_BOUNDS.bandPct,
  downtimeHours: FIELD_BOUNDS.downtimeHours,
  throughputGainPct: FIELD_BOUNDS.throughputGainPct,
  installHours: FIELD_BOUNDS.installHours,
};

function valueAt(input: unknown, path: readonly PropertyKey[]): unknown {
  let at: unknown = input;
  for (const key of path) {
    if (typeof at !== "object" || at === null) return undefined;
    at = (at as Record<PropertyKey, unknown>)[key];
  }
  return at;
}

const quoted = (name: string) => `"${name}"`;

// The names the forms give the fields that are not import columns (components/cases/assumptions-form.tsx,
// components/installed-base/machine-form.tsx): a message names a field as the page that corrects it does.
const MACHINE_FIELD_LABELS: Record<string, string> = {
  downtimeHours: "Downtime for the retrofit",
  throughputGainPct: "Throughput gain the customer will use",
  marginPerOutputHour: "Margin per output hour",
};
const CASE_FIELD_LABELS: Record<string, string> = {
  "finance.tariffPerKWh": "Electricity tariff",
  "finance.tariffEscalationPct": "Tariff escalation",
  "finance.discountRatePct": "Discount rate",
  "finance.horizonYears": "Horizon",
  "finance.inflationPct": "Inflation",
  "finance.taxRatePct": "Tax rate",
  "finance.coolingCop": "Cabinet cooler COP",
  "finance.gridKgCo2PerKWh": "Grid CO₂ factor",
  "thermal.lifeHalvingK": "Insulation life halves every",
  "band.lowPct": "Energy-gain band, low",
  "band.highPct": "Energy-gain band, high",
};

/** A field's name in words when no label is known: "installHours" reads "install hours". */
const words = (key: string) =>
  key
    .split(".")
    .pop()!
    .replace(/([a-z])([A-Z])/g, "$1 $2")
    .toLowerCase();

/** One problem per issue of the engine's schema on a case built from stored rows. */
export function storedInputProblems(
  caseId: number,
  input: Pick<CaseInput, "machines" | "axes">,
  error: Pick<z.ZodError, "issues">,
): StoredInputProblem[] {
  const machineName = (id: string | undefined) =>
    input.machines.find((m) => m.id === id)?.name ?? null;
  const casePage = `/cases/${caseId}`;
  return error.issues.map((issue) => {
    const path = issue.path;
    const value = valueAt(input, path);
    let shown = value === undefined ? "missing" : JSON.stringify(value);
    let machine: string | null = null;
    let axis: string | null = null;
    let axisId: number | null = null;
    let field = formatPath(path);
    let allowed: string | null = null;
    let fixAt: StoredInputProblem["fixAt"];

    if (path[0] === "axes" && typeof path[1] === "number") {
      const row = input.axes[path[1]];
      axis = row?.label ?? null;
      axisId = row ? Number(row.id) : null;
      machine = machineName(row?.machineId);
      const rest = path.slice(2);
      if (rest[0] === "retrofit" && rest[1] === "kit") {
        const kit = row?.retrofit.kit;
        const kitKey = String(rest[2] ?? "");
        const kitLabel = (KIT_FIELDS as Record<string, { label: string }>)[kitKey]?.label;
        field = `${kitLabel ?? words(kitKey)} of kit ${kit ? quoted(kit.id) : ""}`.trim();
        fixAt = {
          href: "/catalogue",
          what: `correct the kit ${kit?.id ?? ""} in the catalogue, or pick another kit for this axis on the case's page`,
        };
      } else if (rest[0] === "retrofit") {
        const name = String(rest[1]);
        field = (RETROFIT_LABELS as Record<string, string>)[name] ?? `retrofit ${words(name)}`;
        const bound = CASE_FIELD_BOUNDS[name];
        allowed = bound ? allowedRange(bound) : null;
        fixAt = { href: casePage, what: "correct the axis's retrofit terms on the case's page" };
      } else {
        const key = axisFieldKey(rest);
        const spec = key ? importField(key) : undefined;
        if (spec) {
          field = spec.label;
          if (typeof value === "number" && spec.unit) shown = `${value} ${spec.unit}`;
          const bound =
            spec.bound ??
            (spec.min !== undefined && spec.max !== undefined
              ? {
                  min: spec.min,
                  minExclusive: spec.minExclusive,
                  max: spec.max,
                  unit: spec.unit ?? "",
                }
              : undefined);
          allowed = bound ? allowedRange(bound) : null;
        }
        fixAt = {
          href: axisId ? `/axes/${axisId}` : casePage,
          what: "correct the value on the axis's edit page",
        };
      }
    } else if (path[0] === "machines" && typeof path[1] === "number") {
      const row = input.machines[path[1]];
      machine = row?.name ?? null;
      const name = String(path[2]);
      field = MACHINE_FIELD_LABELS[name] ?? words(name);
      const bound = CASE_FIELD_BOUNDS[name];
      allowed = bound ? allowedRange(bound) : null;
      fixAt = {
        href: row ? `/machines/${row.id}` : casePage,
        what: "correct the value on the machine's page",
      };
    } else {
      const name = path.map(String).join(".");
      field = CASE_FIELD_LABELS[name] ?? `assumption ${words(name)}`;
      const bound = CASE_FIELD_BOUNDS[name];
      allowed = bound ? allowedRange(bound) : null;
      fixAt = { href: casePage, what: "correct the case's assumptions on the case's page" };
    }

    const where = [
      machine === null ? null : `machine ${quoted(machine)}`,
      axis === null ? null : `axis ${quoted(axis)}`,
    ]
      .filter((part) => part !== null)
      .join(", ");
    const text =
      `${where ? `${where}: ` : ""}${field} is ${shown}; it ${issue.message}` +
      `${allowed ? ` (allowed: ${allowed})` : ""}; ${fixAt.what}.`;
    return {
      machine,
      axis,
      axisId,
      field,
      path: formatPath(path),
      value,
      allowed,
      message: issue.message,
      fixAt,
      text: upperFirst(text),
    };
  });
}

/** The one-paragraph message of a case whose stored values the engine refuses. */
export function storedInputMessage(problems: readonly StoredInputProblem[]): string {
  const shown = problems.slice(0, 5).map((p) => p.text);
  const more = problems.length - shown.length;
  return [
    problems.length === 1
      ? "This case cannot be evaluated: one stored value lies outside the range the engine accepts (it was saved before that range was checked, and is kept as it is)."
      : `This case cannot be evaluated: ${problems.length} stored values lie outside the ranges the engine accepts (saved before those ranges were checked, and kept as they are).`,
    ...shown,
    ...(more > 0 ? [`And ${more} more.`] : []),
  ].join(" ");
}

/**
 * The input of a frozen proposal, parsed; or, for one frozen before a bound it breaks existed,
 * a StoredInputError that says so. A frozen version is never changed: the fix is made on the
 * case's rows and a new version frozen.
 */
export function parseFrozenInput(proposal: {
  caseId: number;
  version: number;
  input: unknown;
}): ParsedCase {
  const parsed = caseInputSchema.safeParse(proposal.input);
  if (parsed.success) return parsed.data;
  const problems = storedInputProblems(proposal.caseId, proposal.input as CaseInput, parsed.error);
  throw new StoredInputError(frozenInputMessage(proposal.version, problems), problems);
}

export function frozenInputMessage(version: number, problems: readonly StoredInputProblem[]) {
  return `${storedInputMessage(problems).replace(
    /^This case cannot be evaluated/,
    `Proposal version ${version} cannot be evaluated again`,
  )} The frozen version stays as it is: after the correction, freeze a new version from the case.`;
}
