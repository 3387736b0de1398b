import type { Axis } from "@/db/schema";

// A stored axis (SI units) as the axis form's values: torques as { value, unit: "N·m" }.
export function axisToFormValues(a: Axis) {
  const nm = (value: number) => ({ value, unit: "N·m" });
  const {
    id: _id,
    siteId: _site,
    createdAt: _created,
    referenceMotorId: _ref,
    pullOutCurve: _curve,
    ...rest
  } = a;
  return {
    ...rest,
    holdingTorqueNm: nm(a.holdingTorqueNm),
    loadTorqueNm: nm(a.loadTorqueNm),
    peakTorqueNm: nm(a.peakTorqueNm),
    holdTorqueNm: nm(a.holdTorqueNm),
  };
}
