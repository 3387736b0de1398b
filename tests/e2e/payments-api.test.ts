import Database from "better-sqlite3";
import ExcelJS from "exceljs";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { z } from "zod";
import { baseUrl, request, signInOverHttp, type CookieJar } from "./support/http";

// The payment path over real HTTP: the app's routes, the local fake payment API driven by the
// stripe SDK, the signed webhook, and what the SQLite file records.
const payments = inject("payments");
const stripe = new Stripe(payments.secretKey, {
  host: payments.host,
  port: payments.port,
  protocol: "http",
  maxNetworkRetries: 0,
});
const database = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });

const lockedSchema = z.object({
  error: z.string(),
  price: z.object({ amount: z.string(), currency: z.string().regex(/^[A-Z]{3}$/) }),
  checkout: z.object({ method: z.literal("POST"), url: z.literal("/api/v1/payments/checkout") }),
});
const checkoutSchema = z.object({ url: z.string().url(), sessionId: z.string() });
const webhookSchema = z.object({
  received: z.literal(true),
  duplicate: z.boolean(),
  outcome: z.string(),
});
// What a reviewer is told before payment: no price and no way to buy; their supplier buys.
const reviewerLockedSchema = z.object({ error: z.string() }).strict();
const outboxSchema = z.array(
  z.object({
    id: z.number(),
    to: z.string(),
    subject: z.string(),
    text: z.string(),
    html: z.string(),
    createdAt: z.string(),
  }),
);
const deliveriesSchema = z.object({
  deliveries: z.array(
    z.object({ eventId: z.string(), payload: z.string(), signature: z.string() }),
  ),
});

let engineer: CookieJar;
let engineer2: CookieJar;
// The seeded finance reviewer of Cartonia Packaging Plant, to whom the seeded proposal was sent.
let reviewer: CookieJar;
let admin: CookieJar;
let proposalId: number;
let caseIds: Map<string, number>;

const count = (sql: string, ...args: unknown[]) =>
  (database.prepare(sql).get(...args) as { n: number }).n;
const grants = () =>
  count("select count(*) as n from dossier_grants where proposal_id = ?", proposalId);

async function checkout(jar = engineer, body: unknown = { proposalId }) {
  const res = await request(jar, "/api/v1/payments/checkout", {
    method: "POST",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
  expect(res.status).toBe(201);
  return checkoutSchema.parse(await res.json());
}

const payWith = (url: string, card: string) =>
  fetch(url, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ card, expiry: "11/38", cvc: "321", name: "Invented Buyer" }),
  });

const postWebhook = (payload: string, signature?: string) =>
  request(null, "/api/webhooks/stripe", {
    method: "POST",
    headers: {
      "content-type": "application/json",
      ...(signature ? { "stripe-signature": signature } : {}),
    },
    body: payload,
  });

beforeAll(async () => {
  ({ jar: engineer } = await signInOverHttp("engineer@example.com", "loopshift-demo"));
  ({ jar: engineer2 } = await signInOverHttp("engineer2@example.com", "loopshift-demo"));
  ({ jar: reviewer } = await signInOverHttp("reviewer@example.com", "loopshift-demo"));
  ({ jar: admin } = await signInOverHttp("admin@example.com", "loopshift-demo"));
  const cases = z
    .object({ cases: z.array(z.object({ id: z.number(), name: z.string() })) })
    .parse(await (await request(engineer, "/api/v1/cases")).json()).cases;
  caseIds = new Map(cases.map((c) => [c.name, c.id]));
  proposalId = await firstProposalOf("North hall cartoners, phase 1");
});

async function firstProposalOf(caseName: string) {
  const list = z
    .object({ proposals: z.array(z.object({ id: z.number(), version: z.number() })) })
    .parse(
      await (await request(engineer, `/api/v1/cases/${caseIds.get(caseName)}/proposals`)).json(),
    );
  return list.proposals.find((p) => p.version === 1)!.id;
}
afterAll(() => database.close());

describe("buying a dossier over HTTP", () => {
  let price: z.infer<typeof lockedSchema>["price"];
  let openSessionId: string;
  let paidSessionId: string;

  it("answers 402 with the price until the dossier is paid for", async () => {
    const res = await request(engineer, `/api/v1/proposals/${proposalId}/dossier`);
    expect(res.status).toBe(402);
    ({ price } = lockedSchema.parse(await res.json()));
    expect(grants()).toBe(0);
  });

  it("answers the customer's reviewer 402 too, without a price or a way to buy", async () => {
    const res = await request(reviewer, `/api/v1/proposals/${proposalId}/dossier`);
    expect(res.status).toBe(402);
    expect(reviewerLockedSchema.parse(await res.json()).error).toMatch(/your supplier/);
    const buy = await request(reviewer, "/api/v1/payments/checkout", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ proposalId }),
    });
    expect(buy.status).toBe(403);
    const page = await request(reviewer, `/review/proposals/${proposalId}/dossier`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("The dossier is not available yet");
    expect(html).not.toContain("Buy the dossier");
    const proposalPage = await (await request(reviewer, `/review/proposals/${proposalId}`)).text();
    expect(proposalPage).not.toContain("Open the dossier");
  });

  it("prices the checkout on the server, whatever the client sends", async () => {
    const { url, sessionId } = await checkout(engineer, {
      proposalId,
      amount: 1,
      currency: "usd",
    });
    openSessionId = sessionId;
    expect(new URL(url).port).toBe(String(payments.port));
    const session = await stripe.checkout.sessions.retrieve(sessionId);
    // ISO 4217: EUR and CHF have two minor digits.
    expect(session.amount_total).toBe(Math.round(Number(price.amount) * 100));
    expect(session.currency).toBe(price.currency.toLowerCase());
    expect(session.customer_email).toBe("engineer@example.com");
  });

  it("a declined card leaves the dossier locked", async () => {
    const { url, sessionId } = await checkout();
    const res = await payWith(url, "4000 0000 0000 0002");
    expect(res.status).toBe(402);
    expect(await res.text()).toContain("Your card was declined");
    expect((await stripe.checkout.sessions.retrieve(sessionId)).payment_status).toBe("unpaid");
    expect((await request(engineer, `/api/v1/proposals/${proposalId}/dossier`)).status).toBe(402);
  });

  it("the cancel page says nothing was charged and, being a GET, leaves the checkout open", async () => {
    const { url, sessionId } = await checkout();
    const page = await request(engineer, `/dossiers/${proposalId}/cancelled`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("Nothing was charged and the dossier stays locked");
    // Closing it is the page's button, a POST (tests/e2e/cross-site-writes.test.ts clicks it).
    expect(html).toContain("Close the checkout");
    expect((await stripe.checkout.sessions.retrieve(sessionId)).status).toBe("open");
    // Expired at the provider, as the button does, it can no longer be paid.
    await stripe.checkout.sessions.expire(sessionId);
    expect((await payWith(url, "4242 4242 4242 4242")).status).toBe(409);
    expect(grants()).toBe(0);
  });

  it("refuses a forged or tampered webhook with 400 and records nothing", async () => {
    const session = await stripe.checkout.sessions.retrieve(openSessionId);
    const payload = JSON.stringify({
      id: "evt_forged_1",
      object: "event",
      type: "checkout.session.completed",
      data: { object: { ...session, status: "complete", payment_status: "paid" } },
    });
    const forged = Stripe.webhooks.generateTestHeaderString({ payload, secret: "whsec_guessed" });
    expect((await postWebhook(payload, forged)).status).toBe(400);
    expect((await postWebhook(payload)).status).toBe(400);
    const genuine = Stripe.webhooks.generateTestHeaderString({
      payload,
      secret: payments.webhookSecret,
    });
    const tampered = payload.replace("evt_forged_1", "evt_forged_2");
    expect((await postWebhook(tampered, genuine)).status).toBe(400);
    expect(count("select count(*) as n from payment_events where id like 'evt_forged%'")).toBe(0);
    expect(grants()).toBe(0);
    expect((await request(engineer, `/api/v1/proposals/${proposalId}/dossier`)).status).toBe(402);
  });

  it("pays with the test card: the webhook unlocks the dossier and the workbook downloads", async () => {
    const { url, sessionId } = await checkout();
    const res = await payWith(url, "4242 4242 4242 4242");
    expect(res.status).toBe(303);
    const back = new URL(res.headers.get("location")!);
    expect(back.pathname).toBe(`/dossiers/${proposalId}/paid`);
    expect(back.searchParams.get("session_id")).toBe(sessionId);
    paidSessionId = sessionId;
    expect(grants()).toBe(1);

    const paidPage = await request(engineer, `${back.pathname}${back.search}`);
    expect(await paidPage.text()).toContain("the dossier is unlocked");

    const file = await request(engineer, `/api/v1/proposals/${proposalId}/dossier`);
    expect(file.status).toBe(200);
    expect(file.headers.get("content-type")).toContain("spreadsheetml");
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(Buffer.from(await file.arrayBuffer()) as unknown as ArrayBuffer);
    const names = workbook.worksheets.map((w) => w.name);
    for (const sheet of [
      "Summary",
      "Cash flow",
      "Monthly cash flow",
      "Payback grid",
      "Sensitivity",
      "Uncertainty",
      "Axis sheets",
    ])
      expect(names).toContain(sheet);
    const seed = workbook.getWorksheet("Uncertainty")!.getRow(2).getCell(2).value;
    expect(String(seed)).toBe(file.headers.get("x-dossier-seed"));
  });

  it("a replayed webhook grants nothing twice", async () => {
    const auth = { authorization: `Bearer ${payments.secretKey}` };
    const { deliveries } = deliveriesSchema.parse(
      await (
        await fetch(`http://${payments.host}:${payments.port}/_fake/deliveries`, { headers: auth })
      ).json(),
    );
    const last = deliveries[deliveries.length - 1];
    const replay = await postWebhook(last.payload, last.signature);
    expect(replay.status).toBe(200);
    expect(webhookSchema.parse(await replay.json())).toMatchObject({ duplicate: true });
    expect(grants()).toBe(1);
    expect(count("select count(*) as n from payment_events where id = ?", last.eventId)).toBe(1);
    // Paying again is refused before any checkout is opened.
    const again = await request(engineer, "/api/v1/payments/checkout", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ proposalId }),
    });
    expect(again.status).toBe(409);
  });

  it("after paying and a replay, the outbox holds exactly one receipt to the buyer, with the dossier link", async () => {
    const messages = outboxSchema.parse(
      await (await request(admin, "/api/v1/admin/outbox")).json(),
    );
    const receipts = messages.filter(
      (m) => m.subject === "Receipt for the dossier of North hall cartoners, phase 1, version 1",
    );
    expect(receipts).toHaveLength(1);
    expect(receipts[0].to).toBe("engineer@example.com");
    const link = `${baseUrl()}/dossiers/${proposalId}`;
    expect(receipts[0].text).toContain(link);
    expect(receipts[0].html).toContain(`href="${link}"`);
    expect(receipts[0].text).toContain(`Payment reference: ${paidSessionId}`);
  });

  it("opens the paid dossier to the customer's reviewer: the report page and the workbook", async () => {
    const proposalPage = await request(reviewer, `/review/proposals/${proposalId}`);
    expect(await proposalPage.text()).toContain(`href="/review/proposals/${proposalId}/dossier"`);
    const page = await request(reviewer, `/review/proposals/${proposalId}/dossier`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain("Uncertainty: P10, P50 and P90");
    expect(html).not.toContain("Save and rebuild");
    const file = await request(reviewer, `/api/v1/proposals/${proposalId}/dossier`);
    expect(file.status).toBe(200);
    expect(file.headers.get("content-type")).toContain("spreadsheetml");
    // The same recorded seed as the buyer's download: the same dossier.
    const buyers = await request(engineer, `/api/v1/proposals/${proposalId}/dossier`);
    expect(file.headers.get("x-dossier-seed")).toBe(buyers.headers.get("x-dossier-seed"));
  });

  it("hides from the reviewer another account's paid dossier, and their own account's proposal not sent to them: 404", async () => {
    // Webline Print Finishing's proposal, sent to its own customer, paid for by the engineer.
    const otherId = await firstProposalOf("Web press register and infeed");
    const { url } = await checkout(engineer, { proposalId: otherId });
    expect((await payWith(url, "4242 4242 4242 4242")).status).toBe(303);
    expect((await request(engineer, `/api/v1/proposals/${otherId}/dossier`)).status).toBe(200);
    // Cartonia's own proposal that is ready but not sent yet.
    const unsentId = await firstProposalOf("South hall cartoners");
    for (const id of [otherId, unsentId, 999_999]) {
      expect((await request(reviewer, `/api/v1/proposals/${id}/dossier`)).status).toBe(404);
      expect((await request(reviewer, `/review/proposals/${id}/dossier`)).status).toBe(404);
      expect((await request(reviewer, `/review/proposals/${id}`)).status).toBe(404);
    }
  });

  it("another account cannot read, buy or open this dossier: 404", async () => {
    expect((await request(engineer2, `/api/v1/proposals/${proposalId}/dossier`)).status).toBe(404);
    const buy = await request(engineer2, "/api/v1/payments/checkout", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ proposalId }),
    });
    expect(buy.status).toBe(404);
    expect((await request(engineer2, `/dossiers/${proposalId}`)).status).toBe(404);
    expect((await request(null, `/api/v1/proposals/${proposalId}/dossier`)).status).toBe(401);
    const invalid = await request(engineer, "/api/v1/payments/checkout", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ proposalId: "x" }),
    });
    expect(invalid.status).toBe(422);
  });
});
