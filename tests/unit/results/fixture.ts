import fixtureCase from "@/tests/fixtures/engine-case.json";
import { caseInputSchema, evaluateCase, type CaseResult, type ParsedCase } from "@/lib/engine";

/** The engine fixture, parsed and evaluated once per test file. */
export const input: ParsedCase = caseInputSchema.parse(fixtureCase);
export const result: CaseResult = evaluateCase(fixtureCase);

/** A fresh copy of the raw fixture to edit before evaluating. */
// eslint-disable-next-line @typescript-eslint/no-explicit-any -- fixtures are edited freely before parsing
export const rawCase = (): any => structuredClone(fixtureCase);
