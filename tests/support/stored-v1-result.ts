import type { CaseResult } from "@/lib/engine";
import { caseResultSchemaV1 } from "./case-result-schema";

/**
 * A result as engine 1.0.0 stored it with a proposal issued before v2: today's result without
 * the keys v2 added (value by source, payback status, break-even, motion, holding capability,
 * the two new drivers), checked against the v1 contract so that nothing of v2 is left in it.
 */
export function asStoredV1Result(result: CaseResult): CaseResult {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- keys are removed freely before the parse
  const stored = structuredClone(result) as any;
  stored.engineVersion = "1.0.0";
  delete stored.breakEven;
  for (const key of ["physics", "bandLow", "bandHigh"]) {
    delete stored.scenarios[key].paybackStatus;
    delete stored.scenarios[key].bySource;
  }
  for (const axis of stored.axes) {
    delete axis.motion;
    delete axis.openLoop.holdingCapabilityNm;
  }
  stored.sensitivity = stored.sensitivity.filter(
    (row: { driver: string }) => row.driver !== "throughputGain" && row.driver !== "idleCurrent",
  );
  return caseResultSchemaV1.parse(stored) as unknown as CaseResult;
}
