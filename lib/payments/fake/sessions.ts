import crypto from "node:crypto";

/** The part of a checkout session the fake keeps, in the provider's own field names. */
export interface FakeSession {
  id: string;
  object: "checkout.session";
  mode: "payment";
  status: "open" | "complete" | "expired";
  payment_status: "unpaid" | "paid";
  amount_subtotal: number;
  amount_total: number;
  currency: string;
  customer_email: string | null;
  client_reference_id: string | null;
  metadata: Record<string, string>;
  line_items_summary: { name: string; quantity: number; unit_amount: number }[];
  success_url: string;
  cancel_url: string | null;
  url: string | null;
  payment_intent: string | null;
  created: number;
  expires_at: number;
  livemode: false;
}

export class FakeApiError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly param?: string,
    readonly code?: string,
    readonly type = "invalid_request_error",
  ) {
    super(message);
  }
}

const randomId = (prefix: string) => `${prefix}_${crypto.randomBytes(12).toString("hex")}`;
const seconds = () => Math.floor(Date.now() / 1000);

type Params = Record<string, unknown>;
const obj = (v: unknown): Params => (v && typeof v === "object" ? (v as Params) : {});
const str = (v: unknown): string | undefined => (typeof v === "string" ? v : undefined);

/**
 * Creates a session from the form the SDK sends (qs-style nested keys, parsed by the server).
 * Only what Loopshift calls is implemented: mode "payment" with price_data line items.
 */
export function createSession(params: Params, hostedBase: string): FakeSession {
  if (str(params.mode) !== "payment")
    throw new FakeApiError(400, "Only mode=payment is implemented by the local fake", "mode");
  const successUrl = str(params.success_url);
  if (!successUrl)
    throw new FakeApiError(400, "Missing required param: success_url.", "success_url");
  const items = Array.isArray(params.line_items)
    ? (params.line_items as unknown[])
    : Object.values(obj(params.line_items));
  if (items.length === 0)
    throw new FakeApiError(400, "Missing required param: line_items.", "line_items");
  let currency: string | undefined;
  const summary = items.map((raw, i) => {
    const item = obj(raw);
    const priceData = obj(item.price_data);
    const unit = Number(str(priceData.unit_amount));
    const quantity = Number(str(item.quantity) ?? "1");
    const itemCurrency = str(priceData.currency)?.toLowerCase();
    const name = str(obj(priceData.product_data).name);
    if (!itemCurrency || !/^[a-z]{3}$/.test(itemCurrency))
      throw new FakeApiError(400, "Invalid currency", `line_items[${i}][price_data][currency]`);
    if (!Number.isSafeInteger(unit) || unit < 1)
      throw new FakeApiError(
        400,
        "unit_amount must be a positive integer in the currency's minor unit",
        `line_items[${i}][price_data][unit_amount]`,
      );
    if (!Number.isSafeInteger(quantity) || quantity < 1)
      throw new FakeApiError(
        400,
        "quantity must be a positive integer",
        `line_items[${i}][quantity]`,
      );
    if (!name)
      throw new FakeApiError(
        400,
        "Missing product name",
        `line_items[${i}][price_data][product_data][name]`,
      );
    if (currency && currency !== itemCurrency)
      throw new FakeApiError(400, "All line items must share one currency", "line_items");
    currency = itemCurrency;
    return { name, quantity, unit_amount: unit };
  });
  const total = summary.reduce((s, i) => s + i.unit_amount * i.quantity, 0);
  const id = randomId("cs_test");
  const metadata: Record<string, string> = {};
  for (const [k, v] of Object.entries(obj(params.metadata)))
    if (typeof v === "string") metadata[k] = v;
  return {
    id,
    object: "checkout.session",
    mode: "payment",
    status: "open",
    payment_status: "unpaid",
    amount_subtotal: total,
    amount_total: total,
    currency: currency!,
    customer_email: str(params.customer_email) ?? null,
    client_reference_id: str(params.client_reference_id) ?? null,
    metadata,
    line_items_summary: summary,
    success_url: successUrl,
    cancel_url: str(params.cancel_url) ?? null,
    url: `${hostedBase}/pay/${id}`,
    payment_intent: null,
    created: seconds(),
    expires_at: seconds() + 24 * 3600,
    livemode: false,
  };
}

/** The session as the API answers it: without the fake's own summary of the line items. */
export function publicSession(session: FakeSession) {
  const { line_items_summary: _summary, ...rest } = session;
  return { ...rest, url: session.status === "open" ? session.url : null };
}

export function completeSession(session: FakeSession): void {
  session.status = "complete";
  session.payment_status = "paid";
  session.payment_intent = randomId("pi_test");
}

export function completedEvent(session: FakeSession, apiVersion: string) {
  return {
    id: randomId("evt_test"),
    object: "event",
    api_version: apiVersion,
    created: seconds(),
    type: "checkout.session.completed",
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    data: { object: publicSession(session) },
  };
}

/** Luhn check (ISO/IEC 7812-1 annex B): catches a mistyped card number before the card is "charged". */
export function luhnValid(digits: string): boolean {
  let sum = 0;
  for (let i = 0; i < digits.length; i++) {
    let d = Number(digits[digits.length - 1 - i]);
    if (i % 2 === 1) {
      d *= 2;
      if (d > 9) d -= 9;
    }
    sum += d;
  }
  return digits.length >= 12 && sum % 10 === 0;
}

export const TEST_CARDS = {
  pays: "4242424242424242",
  declined: "4000000000000002",
} as const;
