import "server-only";
import {
  caseInputOf,
  currentInputRevision,
  getCaseOrThrow,
  type CaseRow,
} from "@/db/queries/cases";
import {
  caseInputSchema,
  evaluateParsedCase,
  valueByMachine,
  type CaseInput,
  type CaseResult,
} from "@/lib/engine";
import type { SessionUser } from "@/lib/auth/session-user";
import { ConflictError, StoredInputError } from "@/lib/errors";
import { storedInputMessage, storedInputProblems } from "@/lib/results/stored-input-problems";

// Results of recent cases, each tagged with the input revision it was computed at: the counter
// moves with every write to a table the input is built from (an edit of the case, of its site's
// axes or of a kit in the catalogue), so a tag equal to the current revision means the input is
// unchanged — one indexed read instead of building the input again to compare it.
const RESULT_CACHE_LIMIT = 32;
type CachedResult = {
  revision: number;
  input: CaseInput;
  result: CaseResult;
  json?: string;
};
const resultCache = new Map<number, CachedResult>();

// The caller's scope is checked by getCaseOrThrow before an entry is looked up; an entry itself
// does not depend on who asks.
export function evaluateCached(found: CaseRow): CachedResult {
  const revision = currentInputRevision();
  const hit = resultCache.get(found.id);
  if (hit?.revision === revision) return hit;
  const input = caseInputOf(found);
  if (input.axes.length === 0)
    throw new ConflictError("The case has no axes yet: pick axes from its site to see a result");
  // Rows saved before the engine's bounds existed can hold values it refuses: name each one
  // and where to fix it (StoredInputError, 409) rather than a bare 422; nothing is rewritten.
  const parsed = caseInputSchema.safeParse(input);
  if (!parsed.success) {
    const problems = storedInputProblems(found.id, input, parsed.error);
    throw new StoredInputError(storedInputMessage(problems), problems);
  }
  const entry: CachedResult = { revision, input, result: evaluateParsedCase(parsed.data) };
  resultCache.delete(found.id);
  resultCache.set(found.id, entry);
  if (resultCache.size > RESULT_CACHE_LIMIT) resultCache.delete(resultCache.keys().next().value!);
  return entry;
}

/** evaluateCase(buildCaseInput(caller, caseId)), computed once per distinct input. */
export function caseResult(caller: SessionUser, caseId: number): CaseResult {
  return evaluateCached(getCaseOrThrow(caller, caseId)).result;
}

/**
 * The result as JSON text, written once per distinct input: a 500-axis result is close to a
 * megabyte of JSON, which costs more to write again for every request than to keep.
 */
export function caseResultJson(caller: SessionUser, caseId: number): string {
  const entry = evaluateCached(getCaseOrThrow(caller, caseId));
  entry.json ??= JSON.stringify(entry.result);
  return entry.json;
}

/**
 * The input the engine received and its result in one body, `{"input":…,"result":…}`, for the
 * case page: one request after an edit instead of one for each. The result's cached text is
 * reused as it is.
 */
export function caseInputAndResultJson(caller: SessionUser, caseId: number): string {
  const entry = evaluateCached(getCaseOrThrow(caller, caseId));
  entry.json ??= JSON.stringify(entry.result);
  return `{"input":${JSON.stringify(entry.input)},"result":${entry.json}}`;
}

/**
 * The result with its value by source split by machine (lib/engine/machine-value.ts), each
 * machine named, `{"result":…,"valueByMachine":{"physics":{"machines":[…],"caseWide":…},…}}`:
 * what a finance reviewer needs to reconcile the value machine by machine.
 */
export function caseResultWithValueByMachineJson(caller: SessionUser, caseId: number): string {
  const entry = evaluateCached(getCaseOrThrow(caller, caseId));
  entry.json ??= JSON.stringify(entry.result);
  const input = caseInputSchema.parse(entry.input);
  const names = new Map(input.machines.map((m) => [m.id, m.name]));
  const split = valueByMachine(entry.result, input);
  const named = Object.fromEntries(
    Object.entries(split).map(([key, part]) => [
      key,
      {
        machines: part.machines.map((m) => ({ ...m, name: names.get(m.machineId) ?? m.machineId })),
        caseWide: part.caseWide,
      },
    ]),
  );
  return `{"result":${entry.json},"valueByMachine":${JSON.stringify(named)}}`;
}
