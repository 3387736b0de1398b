export interface CurvePoint {
  rpm: number;
  torqueNm: number;
}

/** A datasheet pull-out curve made non-increasing by a running minimum (docs/model.md (Torque at speed)). */
export function monotoneCurve(points: readonly CurvePoint[]): CurvePoint[] {
  let floor = Infinity;
  return points.map((p) => {
    floor = Math.min(floor, p.torqueNm);
    return { rpm: p.rpm, torqueNm: floor };
  });
}

export function isBeyondCurve(curve: readonly CurvePoint[], rpm: number): boolean {
  return rpm < curve[0].rpm || rpm > curve[curve.length - 1].rpm;
}
