import { caseInputSchema, type ParsedCase } from "@/lib/engine";

/**
 * The case input as the engine sees it, with every default filled in — or null when the input
 * does not parse (the result view then shows what it can without it: the input is only needed
 * for names, the band and the torque–speed curves).
 */
export function parseCaseInput(input: unknown): ParsedCase | null {
  if (input === undefined || input === null) return null;
  const parsed = caseInputSchema.safeParse(input);
  return parsed.success ? parsed.data : null;
}

/**
 * Display names by id. A record id is never shown for a name the input does not carry (a result
 * read without its input): the reader gets "Unnamed axis" rather than a database row number.
 */
export function namesById(input: ParsedCase | null) {
  const machines = new Map(input?.machines.map((m) => [m.id, m.name]) ?? []);
  const axes = new Map(input?.axes.map((a) => [a.id, a.label]) ?? []);
  const machineOfAxis = new Map(input?.axes.map((a) => [a.id, a.machineId]) ?? []);
  const machine = (id: string) => machines.get(id) ?? "Unnamed machine";
  const axis = (id: string) => axes.get(id) ?? "Unnamed axis";
  return {
    machine,
    axis,
    /**
     * "Z lift (Press 2)": axis labels repeat from machine to machine, so wherever axes of several
     * machines are listed together (charts, warnings, cautions) the machine tells them apart.
     */
    axisWithMachine: (id: string, machineId = machineOfAxis.get(id)) =>
      machineId === undefined ? axis(id) : `${axis(id)} (${machine(machineId)})`,
  };
}

export const DEFAULT_BAND = { lowPct: 25, highPct: 50 } as const;
