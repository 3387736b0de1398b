import type { CaseResult, ParsedCase } from "@/lib/engine";
import { kitMotor } from "@/lib/engine/currents";
import { INSULATION_CLASS_LIMIT_C } from "@/lib/engine/motor";
import { namesById } from "./case-view";

type InsulationClass = keyof typeof INSULATION_CLASS_LIMIT_C;

export interface WindingTemperatureRow {
  axisId: string;
  label: string;
  machineName: string;
  /** "Z lift (Press 2)": how charts name the axis among those of other machines. */
  name: string;
  /** Open loop today; null under thermal runaway (no steady state). */
  beforeC: number | null;
  afterC: number | null;
  dropK: number | null;
  /** The closed loop may run a new kit motor of another class, so each loop has its own limit. */
  beforeClass: InsulationClass | null;
  afterClass: InsulationClass | null;
  beforeLimitC: number | null;
  afterLimitC: number | null;
  beforeOverLimit: boolean;
  afterOverLimit: boolean;
}

/** Winding temperature before and after per axis, with the IEC 60085 limit of each motor. */
export function windingTemperatures(
  result: CaseResult,
  input: ParsedCase | null,
): WindingTemperatureRow[] {
  const names = namesById(input);
  const inputs = new Map(input?.axes.map((a) => [a.id, a]) ?? []);
  return result.axes.map((axis) => {
    const parsed = inputs.get(axis.id);
    const beforeClass = parsed ? parsed.motor.insulationClass : null;
    const afterClass = parsed ? kitMotor(parsed).insulationClass : null;
    const warnings = new Set<string>(axis.warnings);
    return {
      axisId: axis.id,
      label: names.axis(axis.id),
      machineName: names.machine(axis.machineId),
      name: names.axisWithMachine(axis.id, axis.machineId),
      beforeC: axis.openLoop.windingTempC,
      afterC: axis.closedLoop.windingTempC,
      dropK: axis.savings.tempDropK,
      beforeClass,
      afterClass,
      beforeLimitC: beforeClass ? INSULATION_CLASS_LIMIT_C[beforeClass] : null,
      afterLimitC: afterClass ? INSULATION_CLASS_LIMIT_C[afterClass] : null,
      beforeOverLimit: warnings.has("OL_WINDING_OVER_CLASS") || warnings.has("OL_THERMAL_RUNAWAY"),
      afterOverLimit: warnings.has("CL_WINDING_OVER_CLASS") || warnings.has("CL_THERMAL_RUNAWAY"),
    };
  });
}
