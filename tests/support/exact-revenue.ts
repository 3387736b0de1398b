// The vendor's revenue and the customer's own costs of a frozen proposal, computed for the tests
// alone, in BigInt fixed point, sharing no code with the app's decimal.js sums
// (lib/pipeline/revenue.ts, docs/model.md (The business case)).

// An exact decimal as a BigInt of millionths of a millionth (12 places), written here from plain
// string arithmetic so that the check shares no code with the app's decimal.js sums. Every
// figure the revenue multiplies (prices, hours, percentages) has far fewer places than that.
export const SCALE = 12;
export const ONE = 10n ** BigInt(SCALE);
export function fixed(value: string | number | undefined): bigint {
  const text = value === undefined ? "0" : String(value);
  if (!/^-?\d+(\.\d+)?$/.test(text)) throw new Error(`not a plain decimal: ${text}`);
  const negative = text.startsWith("-");
  const [whole, frac = ""] = text.replace("-", "").split(".");
  if (frac.length > SCALE) throw new Error(`more than ${SCALE} places: ${text}`);
  const n = BigInt(whole) * ONE + BigInt(frac.padEnd(SCALE, "0"));
  return negative ? -n : n;
}
export const times = (a: bigint, b: bigint) => (a * b) / ONE; // exact while the places stay within 12
/** Half-even to whole cents, as the app rounds money for display (docs/model.md). */
export function cents(n: bigint): bigint {
  const unit = ONE / 100n;
  const q = n / unit;
  const r = n % unit;
  if (r * 2n > unit || (r * 2n === unit && q % 2n === 1n)) return q + 1n;
  return q;
}

export type FrozenInput = {
  finance: {
    laborRatePerHour?: string;
    downtimeCostPerHour?: string;
    projectOneTimeCost?: string;
  };
  machines: { downtimeHours?: number }[];
  axes: {
    quantity: number;
    retrofit: {
      kit: { price: string | number };
      discountPct?: number;
      installHours?: number;
      commissioningCost?: string;
    };
  }[];
};

/** What the vendor invoices, from the frozen input alone: Σ units × (kit − discount + labour + commissioning). */
export function expectedRevenue(input: FrozenInput) {
  let kits = 0n;
  let discounts = 0n;
  let installation = 0n;
  let commissioning = 0n;
  const rate = fixed(input.finance.laborRatePerHour);
  for (const axis of input.axes) {
    const units = fixed(axis.quantity);
    const list = times(units, fixed(axis.retrofit.kit.price));
    kits += list;
    discounts += times(list, fixed(axis.retrofit.discountPct)) / 100n;
    installation += times(times(units, fixed(axis.retrofit.installHours)), rate);
    commissioning += times(units, fixed(axis.retrofit.commissioningCost));
  }
  return {
    kits,
    discounts,
    installation,
    commissioning,
    revenue: kits - discounts + installation + commissioning,
  };
}

/** The customer's own costs on top: machine downtime at the downtime rate, the project's one-time cost. */
export function expectedOwnCosts(input: FrozenInput) {
  const hours = input.machines.reduce((h, m) => h + fixed(m.downtimeHours), 0n);
  return (
    times(hours, fixed(input.finance.downtimeCostPerHour)) + fixed(input.finance.projectOneTimeCost)
  );
}
