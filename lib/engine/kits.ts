import type Decimal from "decimal.js";
import { evaluateClosedLoop } from "./axis";
import { axisDuty } from "./duty";
import { HUNDRED, parseMoney } from "./money";
import {
  axisInputSchema,
  kitInputSchema,
  marginsSchema,
  type AxisInput,
  type KitInput,
  type MarginsInput,
  type ParsedAxis,
  type ParsedKit,
} from "./schema";

export interface KitSuggestion {
  kit: ParsedKit | null;
  reason: string;
}

const nm = (value: number) => `${value.toFixed(3)} N·m`;

/**
 * The cheapest kit, by price after the axis's discount, whose closed-loop usable torque at the
 * axis speed covers its peak torque and that is not undersized (docs/model.md (Currents at the operating point), docs/model.md (Torque margin and speed)). Equal prices
 * keep the order given.
 */
export function suggestKit(
  axis: AxisInput | ParsedAxis,
  kits: readonly KitInput[],
  margins: MarginsInput = {},
): KitSuggestion {
  const parsedAxis = axisInputSchema.parse(axis);
  const parsedMargins = marginsSchema.parse(margins);
  const required = parsedMargins.closedLoopRequiredPct;
  const duty = axisDuty(parsedAxis);
  const { peakTorqueNm, speedRpm } = duty;
  const need = `the peak of ${nm(peakTorqueNm)} at ${speedRpm} rpm`;
  if (kits.length === 0) return { kit: null, reason: `no kits to choose from for ${need}` };

  const discount = HUNDRED.minus(parsedAxis.retrofit.discountPct).div(HUNDRED);
  const candidates = kits.map((input) => {
    const kit = kitInputSchema.parse(input);
    const withKit: ParsedAxis = { ...parsedAxis, retrofit: { ...parsedAxis.retrofit, kit } };
    const closed = evaluateClosedLoop(withKit, duty, parsedMargins, null, false);
    const usable = closed.outcome.result.usableTorqueNm;
    return {
      kit,
      usable,
      fits: usable >= peakTorqueNm && !closed.undersized,
      price: parseMoney(kit.price).times(discount),
    };
  });

  let best: (typeof candidates)[number] | undefined;
  for (const c of candidates)
    if (c.fits && (best === undefined || c.price.lessThan(best.price))) best = c;
  if (best) {
    const covering = candidates.filter((c) => c.fits).length;
    return {
      kit: best.kit,
      reason:
        `${best.kit.id} at ${moneyText(best.price)} is the cheapest of ${covering} kit(s) covering ${need}: ` +
        `usable ${nm(best.usable)} with the ${required} % closed-loop margin`,
    };
  }

  const strongest = candidates.reduce((a, b) => (b.usable > a.usable ? b : a));
  const coverButUndersized = candidates
    .filter((c) => c.usable >= peakTorqueNm)
    .map((c) => c.kit.id);
  return {
    kit: null,
    reason:
      coverButUndersized.length > 0
        ? `no kit fits: ${coverButUndersized.join(", ")} cover ${need} but cannot supply the holding current for ${nm(duty.holdTorqueNm)} within I_max`
        : `no kit covers ${need}: the best usable torque is ${nm(strongest.usable)} (${strongest.kit.id}) with the ${required} % closed-loop margin`,
  };
}

const moneyText = (value: Decimal) => value.toFixed();
