import type ExcelJS from "exceljs";
import { VALUE_SOURCES, type CaseResult, type ParsedCase, type ValueSource } from "@/lib/engine";
import { VALUE_SOURCE_LABELS } from "@/lib/results/engine-v2";
import {
  CASE_WIDE_LABEL,
  FLEET_TOTAL_LABEL,
  machineValueTable,
  type MachineValueTable,
} from "@/lib/results/machine-value";
import { SCENARIO_LABELS } from "@/lib/glossary";
import { valueByMachine } from "@/lib/engine/machine-value";
import { styleHeader } from "./formats";
import {
  CASH_FLOW,
  MAX_HORIZON_YEARS,
  NAME,
  SCENARIOS,
  SHEET,
  absolute,
  columnLetter,
  sheetRef,
  sourceYearColumn,
  type AxesRanges,
  type MachineRanges,
  type ScenarioKey,
} from "./layout";
import { safeText } from "./safe-text";

export const MACHINES_HEADER = "Value by machine over the horizon";
export const MACHINES_DISCOUNTED_HEADER = "Discounted value by machine over the horizon";

/** Column of each source in the per-machine blocks (VALUE_SOURCES order from B), then all sources. */
export const machineSourceColumn = (source: ValueSource): number =>
  2 + VALUE_SOURCES.indexOf(source);
export const MACHINE_ALL_COLUMN = 2 + VALUE_SOURCES.length;

/** The header of one per-machine block, as the test and a reader find it: "Value by machine over the horizon, low trade claim". */
export const machineBlockHeader = (scenario: ScenarioKey, discounted: boolean): string =>
  `${discounted ? MACHINES_DISCOUNTED_HEADER : MACHINES_HEADER}, ${SCENARIO_LABELS[scenario].toLowerCase()}`;

/**
 * Every scenario split by machine, as live formulas (lib/engine/machine-value.ts states the
 * split): a machine's drive and cooling energy, step-loss money and maintenance are the sums of
 * its axes' rows on the Axes sheet, its added output is its row of the Assumptions sheet's
 * machine table; each grows with the Cash flow sheet's escalation or inflation row, added over
 * the horizon (or weighted by the discount-factor row). The engineering estimate counts the
 * energy each axis saves; a trade-claim scenario counts its band (BandLow_Pct, BandHigh_Pct) of
 * the energy each axis uses today, as the Cash flow sheet does for the fleet. A machine is taxed
 * on its own value less the depreciation of its own up-front cost (its axes plus its downtime);
 * the case-wide row carries the service cost and the tax on it less the depreciation of the
 * one-time project cost. Tax is linear in the flows, so the rows add up to the case's figures
 * above them. Returns the row after the blocks.
 */
export function writeMachineValue(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  result: CaseResult,
  ranges: { axes: AxesRanges; machines: MachineRanges },
  currency: string,
  top: number,
): number {
  const tables = new Map<ScenarioKey, MachineValueTable>();
  try {
    const split = valueByMachine(result, input);
    for (const scenario of SCENARIOS)
      tables.set(scenario, machineValueTable(result, input, scenario, split));
  } catch {
    // A stored result that does not match its input, or has no value by source (engine v1):
    // the cells carry formulas only, and Calc works the figures out.
    tables.clear();
  }
  let row = top;
  for (const scenario of SCENARIOS) {
    for (const discounted of [false, true]) {
      const table = tables.get(scenario) ?? null;
      row = writeBlock(sheet, input, ranges, currency, row, scenario, discounted, table) + 1;
    }
  }
  return row;
}

function writeBlock(
  sheet: ExcelJS.Worksheet,
  input: ParsedCase,
  { axes, machines }: { axes: AxesRanges; machines: MachineRanges },
  currency: string,
  top: number,
  scenario: ScenarioKey,
  discounted: boolean,
  table: MachineValueTable | null,
): number {
  const header = sheet.getRow(top);
  header.getCell(1).value = machineBlockHeader(scenario, discounted);
  for (const s of VALUE_SOURCES)
    header.getCell(machineSourceColumn(s)).value = VALUE_SOURCE_LABELS[s];
  header.getCell(MACHINE_ALL_COLUMN).value = "All sources";
  styleHeader(header);

  const years = (r: number) =>
    `${sheetRef(SHEET.cashFlow)}!$${sourceYearColumn(1)}$${r}:$${sourceYearColumn(MAX_HORIZON_YEARS)}$${r}`;
  const { sources } = CASH_FLOW;
  // Over the horizon: the factor rows added; discounted: each weighted by 1/(1 + rate)^t.
  const over = (r: number) =>
    discounted ? `SUMPRODUCT(${years(r)},${years(sources.discountRow)})` : `SUM(${years(r)})`;
  const escalation = over(sources.escalationRow);
  const inflation = over(sources.inflationRow);
  // The share of Capex's depreciation that `cost` carries, over the horizon.
  const depreciationOf = (cost: string) =>
    `IF(${NAME.capex}=0,0,${cost}*${over(sources.depreciationRow)}/${NAME.capex})`;
  const measure = discounted ? "discounted" : "horizon";

  const write = (r: number, column: number, formula: string, value: number | undefined) => {
    const cell = sheet.getCell(r, column);
    cell.value = value === undefined ? { formula } : { formula, result: value };
    cell.numFmt = currency;
    return cell;
  };
  // By key: a fleet can have many machines, each looked up for every column.
  const rowsByKey = new Map(table?.rows.map((x) => [x.key, x]) ?? []);
  const cached = (key: string, source: ValueSource | "all") => {
    const found = rowsByKey.get(key);
    if (!found) return undefined;
    return (source === "all" ? found.all[measure] : found.values[measure][source]).toNumber();
  };
  const first = columnLetter(machineSourceColumn(VALUE_SOURCES[0]));
  const beforeTax = columnLetter(machineSourceColumn("service"));
  const last = columnLetter(machineSourceColumn("tax"));
  const tax = (r: number, depreciation: string) =>
    `-${NAME.taxRate}/100*(SUM(${first}${r}:${beforeTax}${r})-${depreciation})`;

  // The kWh a scenario counts: what the axes save, or the band's share of what they use today.
  const counted = (saved: string, today: string) =>
    scenario === "physics"
      ? saved
      : `${scenario === "bandLow" ? NAME.bandLow : NAME.bandHigh}/100*${today}`;

  let r = top + 1;
  for (const machine of input.machines) {
    const assumptionsRow = machines.rowOf.get(machine.id);
    if (assumptionsRow === undefined) continue;
    const id = absolute(SHEET.assumptions, "A", assumptionsRow);
    // SUMPRODUCT on equality rather than SUMIF: an id is matched exactly, never as a pattern.
    const ofAxes = (range: string) => `SUMPRODUCT((${axes.machineId}=${id})*${range})`;
    const capex = `(${ofAxes(axes.capexTotal)}+${absolute(SHEET.assumptions, "C", assumptionsRow)}*${NAME.downtimeCost})`;
    sheet.getCell(r, 1).value = safeText(machine.name);
    const formulas: Record<ValueSource, string> = {
      energy: `${counted(ofAxes(axes.energySavedTotal), ofAxes(axes.energyOpenLoopTotal))}*${NAME.tariff}*${escalation}`,
      cooling: `${counted(ofAxes(axes.coolingSavedTotal), ofAxes(axes.coolingOpenLoopTotal))}*${NAME.tariff}*${escalation}`,
      reliability: `${ofAxes(axes.reliability)}*${inflation}`,
      maintenance: `${ofAxes(axes.maintenance)}*${inflation}`,
      throughput: `${absolute(SHEET.assumptions, "H", assumptionsRow)}*${inflation}`,
      service: "0",
      tax: tax(r, depreciationOf(capex)),
    };
    for (const s of VALUE_SOURCES)
      write(r, machineSourceColumn(s), formulas[s], cached(machine.id, s));
    write(r, MACHINE_ALL_COLUMN, `SUM(${first}${r}:${last}${r})`, cached(machine.id, "all"));
    r++;
  }
  sheet.getCell(r, 1).value = CASE_WIDE_LABEL;
  for (const s of VALUE_SOURCES) {
    const formula =
      s === "service"
        ? `-${NAME.serviceCost}*${inflation}`
        : s === "tax"
          ? tax(r, depreciationOf(NAME.projectCost))
          : "0";
    write(r, machineSourceColumn(s), formula, cached("case-wide", s));
  }
  write(r, MACHINE_ALL_COLUMN, `SUM(${first}${r}:${last}${r})`, cached("case-wide", "all"));
  const totalRow = r + 1;
  sheet.getCell(totalRow, 1).value =
    `${FLEET_TOTAL_LABEL}: the machines and the case-wide row added`;
  for (const column of [...VALUE_SOURCES.map(machineSourceColumn), MACHINE_ALL_COLUMN]) {
    const letter = columnLetter(column);
    const source = column === MACHINE_ALL_COLUMN ? "all" : VALUE_SOURCES[column - 2];
    write(
      totalRow,
      column,
      `SUM(${letter}${top + 1}:${letter}${r})`,
      cached("total", source),
    ).font = { bold: true };
  }
  return totalRow + 1;
}
