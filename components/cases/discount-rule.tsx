// The discount-approval rule (lib/pipeline/discount.ts) in words, where a discount is typed: the
// sales settings' threshold, and whether the value at hand is above it.
export function DiscountRule({
  id,
  thresholdPct,
  above = false,
}: {
  id: string;
  thresholdPct: number;
  above?: boolean;
}) {
  return (
    <p
      id={id}
      className={`text-caption ${above ? "font-bold text-caution-700" : "text-steel-700"}`}
    >
      Discounts above {thresholdPct} % need a manager&rsquo;s approval before the proposal can be
      sent.
      {above ? " This discount is above it." : ""}
    </p>
  );
}
