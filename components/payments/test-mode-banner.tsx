import { paymentsTestMode } from "@/server/payments/config";

/** Shown on every signed-in page while payments go to the local fake (or a test key). */
export function TestModeBanner() {
  if (!paymentsTestMode()) return null;
  return (
    // A named region rather than a note: axe-core's "region" rule wants all content in landmarks.
    <div
      role="region"
      aria-label="Payments in test mode"
      className="border-b-2 border-caution-600 bg-caution-50 px-4 py-2 text-small text-caution-700 md:px-8 print:hidden"
    >
      <strong className="tracking-wide">TEST MODE</strong> — payments go to the local test payment
      service. No card is charged; test card 4242 4242 4242 4242 pays, 4000 0000 0000 0002 is
      declined.
    </div>
  );
}
