/**
 * A ratio the result reports, or null when it is not a finite number. A quotient overflows only
 * when its denominator is a vanishing fraction of its numerator — a torque, an energy or a speed
 * of 10^-300 inside FIELD_BOUNDS — and such a denominator is zero in all but name: the figure
 * then means what it means at zero, "not meaningful" (null), rather than Infinity or NaN, which
 * no figure of the result may be (docs/model.md, Validation and edge cases).
 */
export function finiteOrNull(value: number): number | null {
  return Number.isFinite(value) ? value : null;
}
