import http from "node:http";
import type { AddressInfo } from "node:net";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startFakePaymentApi, type FakePaymentApi } from "@/lib/payments/fake/server";

// The local fake payment API, driven by the real stripe SDK over HTTP, and its webhooks checked
// with the SDK's own constructEvent: the fake must speak the provider's protocol, not ours.
const SECRET = "sk_test_integration";
const WEBHOOK_SECRET = "whsec_integration";

let fake: FakePaymentApi;
let receiver: http.Server;
const received: { body: string; signature: string }[] = [];
let stripe: Stripe;

beforeAll(async () => {
  receiver = http.createServer((req, res) => {
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", () => {
      received.push({ body, signature: String(req.headers["stripe-signature"] ?? "") });
      res.writeHead(200, { "content-type": "application/json" }).end("{}");
    });
  });
  await new Promise<void>((r) => receiver.listen(0, "127.0.0.1", r));
  const { port } = receiver.address() as AddressInfo;
  fake = await startFakePaymentApi({
    secretKey: SECRET,
    webhookSecret: WEBHOOK_SECRET,
    webhookUrl: `http://127.0.0.1:${port}/hook`,
  });
  stripe = new Stripe(SECRET, {
    host: fake.host,
    port: fake.port,
    protocol: "http",
    maxNetworkRetries: 0,
  });
});

afterAll(async () => {
  await fake.close();
  await new Promise((r) => receiver.close(r));
});

const newSession = () =>
  stripe.checkout.sessions.create({
    mode: "payment",
    line_items: [
      {
        quantity: 1,
        price_data: {
          currency: "eur",
          unit_amount: 49000,
          product_data: { name: "Invented dossier" },
        },
      },
    ],
    success_url: "http://app.invalid/paid?session_id={CHECKOUT_SESSION_ID}",
    cancel_url: "http://app.invalid/cancelled",
    client_reference_id: "7",
    metadata: { proposalId: "7" },
  });

const payWith = (url: string, card: string) =>
  fetch(url, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ card, expiry: "12/39", cvc: "123", name: "Invented Buyer" }),
  });

describe("the local fake payment API through the stripe SDK", () => {
  it("creates and retrieves a Checkout Session with the amount and currency asked", async () => {
    const session = await newSession();
    expect(session.id).toMatch(/^cs_test_/);
    expect(session.amount_total).toBe(49000);
    expect(session.currency).toBe("eur");
    expect(session.status).toBe("open");
    expect(session.payment_status).toBe("unpaid");
    expect(session.url).toBe(`${fake.url}/pay/${session.id}`);
    const again = await stripe.checkout.sessions.retrieve(session.id);
    expect(again.id).toBe(session.id);
    expect(again.metadata).toEqual({ proposalId: "7" });
    const page = await (await fetch(session.url!)).text();
    expect(page).toContain("TEST MODE");
    expect(page).toContain("490.00 EUR");
  });

  it("pays with 4242 4242 4242 4242: back to success_url, session paid, signed checkout.session.completed delivered", async () => {
    const session = await newSession();
    const before = received.length;
    const res = await payWith(session.url!, "4242 4242 4242 4242");
    expect(res.status).toBe(303);
    expect(res.headers.get("location")).toBe(`http://app.invalid/paid?session_id=${session.id}`);
    const paid = await stripe.checkout.sessions.retrieve(session.id);
    expect(paid.status).toBe("complete");
    expect(paid.payment_status).toBe("paid");
    expect(received.length).toBe(before + 1);
    const delivery = received[received.length - 1];
    // The SDK's own verification with the shared secret accepts it …
    const event = stripe.webhooks.constructEvent(delivery.body, delivery.signature, WEBHOOK_SECRET);
    expect(event.type).toBe("checkout.session.completed");
    const object = event.data.object as Stripe.Checkout.Session;
    expect(object.id).toBe(session.id);
    expect(object.amount_total).toBe(49000);
    // … and refuses it under another secret.
    expect(() =>
      stripe.webhooks.constructEvent(delivery.body, delivery.signature, "whsec_other"),
    ).toThrow();
  });

  it("declines 4000 0000 0000 0002 with a clear message, charges nothing and sends no event", async () => {
    const session = await newSession();
    const before = received.length;
    const res = await payWith(session.url!, "4000 0000 0000 0002");
    expect(res.status).toBe(402);
    expect(await res.text()).toContain("Your card was declined");
    const after = await stripe.checkout.sessions.retrieve(session.id);
    expect(after.status).toBe("open");
    expect(after.payment_status).toBe("unpaid");
    expect(received.length).toBe(before);
  });

  it("refuses a mistyped card number by its Luhn check (ISO/IEC 7812-1)", async () => {
    const session = await newSession();
    const res = await payWith(session.url!, "4242 4242 4242 4241");
    expect(res.status).toBe(400);
    expect(await res.text()).toContain("The card number is not valid");
  });

  it("cancels: an expired session cannot be paid any more", async () => {
    const session = await newSession();
    const expired = await stripe.checkout.sessions.expire(session.id);
    expect(expired.status).toBe("expired");
    expect(expired.url).toBeNull();
    const res = await payWith(session.url!, "4242424242424242");
    expect(res.status).toBe(409);
    expect(await res.text()).toContain("cancelled or has expired");
  });

  it("answers like the provider to a wrong key and to a missing session", async () => {
    const wrong = new Stripe("sk_test_wrong", {
      host: fake.host,
      port: fake.port,
      protocol: "http",
      maxNetworkRetries: 0,
    });
    await expect(wrong.checkout.sessions.retrieve("cs_test_x")).rejects.toBeInstanceOf(
      Stripe.errors.StripeAuthenticationError,
    );
    await expect(stripe.checkout.sessions.retrieve("cs_test_missing")).rejects.toMatchObject({
      statusCode: 404,
      code: "resource_missing",
    });
  });
});
