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

/** Display names by id; ids stand in for names the input does not carry. */
export function namesById(input: ParsedCase | null) {
  const machines = new Map(input?.machines.map((m) => [m.id, m.name]) ?? []);
  const axes = new Map(input?.axes.map((a) => [a.id, a.label]) ?? []);
  return {
    machine: (id: string) => machines.get(id) ?? id,
    axis: (id: string) => axes.get(id) ?? id,
  };
}

export const DEFAULT_BAND = { lowPct: 25, highPct: 50 } as const;
