import Decimal from "decimal.js";
import { roundMoney, type AxisInput, type CaseInput, type CaseResult } from "../../lib/engine";

// What changed from one frozen proposal to the next, in short sentences for the version list.
// Pure: it reads the two stored snapshots only, so the list stays true however the case, the
// installed base or the catalogue moved since.

export type ProposalSnapshot = { input: CaseInput; result: CaseResult; engineVersion: string };

type Unit = (currency: string) => string;
const fixed =
  (text: string): Unit =>
  () =>
    text;
const perCurrency =
  (suffix: string): Unit =>
  (c) =>
    `${c}${suffix}`;

const ASSUMPTION_LABELS: Record<string, Record<string, [string, Unit]>> = {
  finance: {
    tariffPerKWh: ["Tariff", perCurrency("/kWh")],
    tariffEscalationPct: ["Tariff escalation", fixed("%/yr")],
    discountRatePct: ["Discount rate", fixed("%")],
    horizonYears: ["Horizon", fixed("years")],
    laborRatePerHour: ["Labour rate", perCurrency("/h")],
    downtimeCostPerHour: ["Downtime cost", perCurrency("/h")],
    projectOneTimeCost: ["Project one-time cost", perCurrency("")],
    annualServiceCost: ["Annual service cost", perCurrency("/yr")],
    coolingCop: ["Cabinet cooling COP", fixed("")],
    gridKgCo2PerKWh: ["Grid CO₂ factor", fixed("kg/kWh")],
  },
  margins: {
    openLoopRequiredPct: ["Open-loop required margin", fixed("%")],
    closedLoopRequiredPct: ["Closed-loop required margin", fixed("%")],
  },
  band: {
    lowPct: ["Energy band, low end", fixed("%")],
    highPct: ["Energy band, high end", fixed("%")],
  },
  sensitivity: { swingPct: ["Sensitivity swing", fixed("%")] },
  thermal: { lifeHalvingK: ["Insulation life halving interval", fixed("K")] },
};

const MONEY_PATTERN = /^\+?(\d+\.?\d*|\.\d+)$/;

// Money is compared as a decimal ("0.2" and "0.20" are the same tariff), everything else exactly.
function same(a: unknown, b: unknown): boolean {
  if (
    typeof a === "string" &&
    typeof b === "string" &&
    MONEY_PATTERN.test(a) &&
    MONEY_PATTERN.test(b)
  )
    return new Decimal(a).equals(b);
  return JSON.stringify(a ?? null) === JSON.stringify(b ?? null);
}

const show = (value: unknown) => (value == null ? "none" : String(value));

function assumptionChanges(before: CaseInput, after: CaseInput): string[] {
  const lines: string[] = [];
  for (const [part, labels] of Object.entries(ASSUMPTION_LABELS)) {
    const a = (before[part as keyof CaseInput] ?? {}) as Record<string, unknown>;
    const b = (after[part as keyof CaseInput] ?? {}) as Record<string, unknown>;
    for (const key of new Set([...Object.keys(a), ...Object.keys(b)])) {
      if (same(a[key], b[key])) continue;
      const [label, unit] = labels[key] ?? [key, fixed("")];
      const suffix = unit(after.currency);
      lines.push(`${label}: ${show(a[key])} → ${show(b[key])}${suffix ? ` ${suffix}` : ""}`);
    }
  }
  return lines;
}

const LISTED = 3;

function namesOf(items: string[]): string {
  const shown = items.slice(0, LISTED).join(", ");
  return items.length > LISTED ? `${shown} and ${items.length - LISTED} more` : shown;
}

function axisName(axis: AxisInput, machines: Map<string, string>) {
  // A machine the version does not name is described, never shown by its record id.
  return `${axis.label} (${machines.get(axis.machineId) ?? "a machine no longer in the case"})`;
}

// Everything of an axis but its retrofit: what the installed base says about it. (A key set to
// undefined drops out of the JSON that same() compares.)
const installedPart = (axis: AxisInput) => ({ ...axis, retrofit: undefined });
const termsPart = (axis: AxisInput) => ({ ...axis.retrofit, kit: undefined });

function axisChanges(before: CaseInput, after: CaseInput): string[] {
  const lines: string[] = [];
  const machineNames = new Map(
    [...before.machines, ...after.machines].map((m) => [m.id, m.name] as const),
  );
  const was = new Map(before.axes.map((a) => [a.id, a]));
  const now = new Map(after.axes.map((a) => [a.id, a]));
  const added = after.axes.filter((a) => !was.has(a.id));
  const removed = before.axes.filter((a) => !now.has(a.id));
  if (added.length)
    lines.push(
      `Axes added (${added.length}): ${namesOf(added.map((a) => axisName(a, machineNames)))}`,
    );
  if (removed.length)
    lines.push(
      `Axes removed (${removed.length}): ${namesOf(removed.map((a) => axisName(a, machineNames)))}`,
    );

  const kitMoves = new Map<string, string[]>();
  const newTerms: string[] = [];
  const newData: string[] = [];
  for (const axis of after.axes) {
    const old = was.get(axis.id);
    if (!old) continue;
    const name = axisName(axis, machineNames);
    if (old.retrofit.kit.id !== axis.retrofit.kit.id) {
      const move = `${old.retrofit.kit.id} → ${axis.retrofit.kit.id}`;
      kitMoves.set(move, [...(kitMoves.get(move) ?? []), name]);
    }
    if (!same(termsPart(old), termsPart(axis))) newTerms.push(name);
    if (!same(installedPart(old), installedPart(axis))) newData.push(name);
  }
  const moved = [...kitMoves.values()].reduce((n, names) => n + names.length, 0);
  if (moved > 0 && moved <= LISTED) {
    for (const [move, names] of kitMoves) lines.push(`Kit ${move} on ${names.join(", ")}`);
  } else if (moved > LISTED) {
    const groups = [...kitMoves].map(([move, names]) => `${move} on ${names.length}`);
    lines.push(`Kits changed on ${moved} axes: ${groups.join(", ")}`);
  }
  if (newTerms.length)
    lines.push(`Retrofit terms changed on ${newTerms.length} axes: ${namesOf(newTerms)}`);
  if (newData.length)
    lines.push(`Installed-base data changed on ${newData.length} axes: ${namesOf(newData)}`);
  return lines;
}

// A kit kept on the same axes whose catalogue entry (price, motor, ratings) changed meanwhile.
function catalogueChanges(before: CaseInput, after: CaseInput): string[] {
  const oldKits = new Map(before.axes.map((a) => [a.retrofit.kit.id, a.retrofit.kit]));
  const changed = new Set<string>();
  for (const axis of after.axes) {
    const old = oldKits.get(axis.retrofit.kit.id);
    if (old && !same(old, axis.retrofit.kit)) changed.add(axis.retrofit.kit.id);
  }
  return [...changed].map((id) => {
    const old = oldKits.get(id)!;
    const kit = after.axes.find((a) => a.retrofit.kit.id === id)!.retrofit.kit;
    return same(old.price, kit.price)
      ? `Catalogue data of kit ${id} changed`
      : `Price of kit ${id}: ${show(old.price)} → ${show(kit.price)} ${after.currency}`;
  });
}

function machineChanges(before: CaseInput, after: CaseInput): string[] {
  const was = new Map(before.machines.map((m) => [m.id, m]));
  const changed = after.machines
    .filter((m) => was.has(m.id) && !same(was.get(m.id), m))
    .map((m) => m.name);
  return changed.length
    ? [`Machine figures changed on ${changed.length} machines: ${namesOf(changed)}`]
    : [];
}

function resultChanges(before: CaseResult, after: CaseResult): string[] {
  const lines: string[] = [];
  const money = (v: string, c: string) => roundMoney(v, c);
  const a = before.scenarios.physics;
  const b = after.scenarios.physics;
  const currency = after.currency;
  const capexA = money(before.totals.capex, before.currency);
  const capexB = money(after.totals.capex, currency);
  if (capexA !== capexB) lines.push(`Capex: ${capexA} → ${capexB} ${currency}`);
  const npvA = money(a.npv, before.currency);
  const npvB = money(b.npv, currency);
  if (npvA !== npvB) lines.push(`NPV (physics): ${npvA} → ${npvB} ${currency}`);
  const years = (v: number | null) => (v == null ? "not reached" : `${v.toFixed(2)} years`);
  if (years(a.paybackYears) !== years(b.paybackYears))
    lines.push(`Payback (physics): ${years(a.paybackYears)} → ${years(b.paybackYears)}`);
  return lines;
}

/** The changes from `before` (null for a first version) to `after`, one sentence each. */
export function proposalChanges(
  before: ProposalSnapshot | null,
  after: ProposalSnapshot,
  previousVersion: number,
): string[] {
  if (!before) return ["First version"];
  const lines: string[] = [];
  if (before.engineVersion !== after.engineVersion)
    lines.push(`Engine version: ${before.engineVersion} → ${after.engineVersion}`);
  if (before.input.currency !== after.input.currency)
    lines.push(`Currency: ${before.input.currency} → ${after.input.currency}`);
  lines.push(
    ...assumptionChanges(before.input, after.input),
    ...axisChanges(before.input, after.input),
    ...catalogueChanges(before.input, after.input),
    ...machineChanges(before.input, after.input),
    ...resultChanges(before.result, after.result),
  );
  return lines.length ? lines : [`No change since version ${previousVersion}`];
}
