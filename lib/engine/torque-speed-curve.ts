import { evaluateClosedLoop, evaluateOpenLoop } from "./axis";
import { capabilityNm, MAX_SEARCH_RPM } from "./capability";
import type { CurvePoint } from "./curves";
import { axisDuty } from "./duty";
import { marginsSchema } from "./schema";
import { axisInputSchema, type AxisInput, type ParsedAxis } from "./schema";

/**
 * Torque capability against speed for the charts: the datasheet pull-out curve (open loop,
 * when given; sampled up to its last point) or the model of docs/model.md (Torque at speed) at the loop's hot
 * resistance (sampled up to the 6000 rpm the max-speed search covers). The required margins
 * do not enter: this is the capability, not the usable torque.
 */
export function torqueSpeedCurve(
  axis: AxisInput | ParsedAxis,
  loop: "open" | "closed",
  points = 61,
): CurvePoint[] {
  const parsed = axisInputSchema.parse(axis);
  const duty = axisDuty(parsed);
  const margins = marginsSchema.parse({});
  const capability =
    loop === "open"
      ? evaluateOpenLoop(parsed, duty, 0, null).capability
      : evaluateClosedLoop(parsed, duty, margins, null).outcome.capability;
  const curve = parsed.motor.pullOutCurve;
  const maxRpm = loop === "open" && curve ? curve[curve.length - 1].rpm : MAX_SEARCH_RPM;
  const count = Math.max(2, Math.floor(points));
  return Array.from({ length: count }, (_, i) => {
    const rpm = (maxRpm * i) / (count - 1);
    return { rpm, torqueNm: capabilityNm(capability, rpm) };
  });
}
