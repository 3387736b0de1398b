import http from "node:http";
import type { AddressInfo } from "node:net";
import { eq } from "drizzle-orm";
import Stripe from "stripe";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { z } from "zod";
import { POST as webhookRoute } from "@/app/api/webhooks/stripe/route";
import { listCases } from "@/db/queries/cases";
import { listProposals } from "@/db/queries/proposal-versions";
import { readDossierPrice } from "@/db/queries/dossiers";
import { listOutbox } from "@/db/queries/outbox";
import { db } from "@/db";
import { openDatabase } from "@/db/client";
import { dossierGrants, mailQueue } from "@/db/schema";
import { startFakeSmtpServer, type FakeSmtpServer } from "@/server/mail/fake-smtp-server";
import { flushMailQueue } from "@/server/mail/queue";
import { createDossierCheckout } from "@/server/payments/checkout";
import { startFakePaymentApi, type FakePaymentApi } from "@/lib/payments/fake/server";
import { formatMoney } from "@/lib/results/format";
import { caller } from "../support/callers";

// The whole payment path of a receipt: a checkout through the stripe SDK against the local fake,
// the test card paid on its hosted page, the signed webhook delivered over HTTP to the real
// route handler, and the receipt handed over SMTP to the local fake mail server, which files it
// in the outbox. Then the provider's delivery replayed byte for byte.
const APP = "http://loopshift.test:4321";
const SECRET = "sk_test_receipt_integration";
const WEBHOOK_SECRET = "whsec_receipt_integration";

const engineer = () => caller("engineer@example.com");
const admin = () => caller("admin@example.com");

const webhookAnswer = z.object({
  received: z.literal(true),
  duplicate: z.boolean(),
  outcome: z.string(),
});

let smtp: FakeSmtpServer;
let payments: FakePaymentApi;
let receiver: http.Server;
let receiverUrl: string;
// The fake SMTP server files messages through a connection of its own, as under `npm start`.
const smtpDb = openDatabase(process.env.DATABASE_PATH);

// Next.js hands a route handler a web Request; this loopback server does the same for the fake.
function startReceiver(): Promise<http.Server> {
  const server = http.createServer((req, res) => {
    const chunks: Buffer[] = [];
    req.on("data", (c: Buffer) => chunks.push(c));
    req.on("end", async () => {
      const response = await webhookRoute(
        new Request(`${APP}${req.url}`, {
          method: req.method,
          headers: {
            "content-type": String(req.headers["content-type"] ?? "application/json"),
            "stripe-signature": String(req.headers["stripe-signature"] ?? ""),
          },
          body: Buffer.concat(chunks).toString("utf8"),
        }),
      );
      res.writeHead(response.status, { "content-type": "application/json" });
      res.end(await response.text());
    });
  });
  return new Promise((resolve) => server.listen(0, "127.0.0.1", () => resolve(server)));
}

beforeAll(async () => {
  process.env.NEXTAUTH_URL = APP;
  smtp = await startFakeSmtpServer(smtpDb);
  process.env.SMTP_URL = smtp.url;
  receiver = await startReceiver();
  receiverUrl = `http://127.0.0.1:${(receiver.address() as AddressInfo).port}/api/webhooks/stripe`;
  process.env.STRIPE_SECRET_KEY = SECRET;
  process.env.STRIPE_WEBHOOK_SECRET = WEBHOOK_SECRET;
  payments = await startFakePaymentApi({
    secretKey: SECRET,
    webhookSecret: WEBHOOK_SECRET,
    webhookUrl: receiverUrl,
  });
  process.env.STRIPE_API_HOST = payments.host;
  process.env.STRIPE_API_PORT = String(payments.port);
  process.env.STRIPE_API_PROTOCOL = "http";
});
afterAll(async () => {
  await payments?.close();
  await new Promise((r) => receiver?.close(r));
  await smtp?.close();
  smtpDb.$client.close();
});

// The engineer's seeded cases that have a frozen proposal: each test buys a different one.
const frozenProposals = () =>
  listCases(engineer())
    .filter((c) => c.latestVersion !== null)
    .map((c) => ({ caseName: c.name, proposal: listProposals(engineer(), c.id).at(-1)! }));

const payWith = (url: string, card: string) =>
  fetch(url, {
    method: "POST",
    redirect: "manual",
    headers: { "content-type": "application/x-www-form-urlencoded" },
    body: new URLSearchParams({ card, expiry: "12/39", cvc: "123", name: "Invented Buyer" }),
  });

const postToWebhook = async (payload: string, signature: string) => {
  const res = await fetch(receiverUrl, {
    method: "POST",
    headers: { "content-type": "application/json", "stripe-signature": signature },
    body: payload,
  });
  return { status: res.status, body: webhookAnswer.parse(await res.json()) };
};

const receiptSubject = (caseName: string, version: number) =>
  `Receipt for the dossier of ${caseName}, version ${version}`;
const receiptsIn = (subject: string) => listOutbox(admin()).filter((m) => m.subject === subject);
const queuedReceipts = (subject: string) =>
  db.select().from(mailQueue).where(eq(mailQueue.subject, subject)).all();

describe("the dossier receipt, mailed once through SMTP", () => {
  it("a declined card sends nothing; the test card unlocks the dossier and mails one receipt; a replay mails none", async () => {
    const { caseName, proposal } = frozenProposals()[0];
    const subject = receiptSubject(caseName, proposal.version);
    const price = readDossierPrice();

    const declined = await createDossierCheckout(engineer(), proposal.id);
    expect((await payWith(declined.url, "4000 0000 0000 0002")).status).toBe(402);
    expect(payments.deliveries).toHaveLength(0);
    expect(receiptsIn(subject)).toHaveLength(0);

    const { url, sessionId } = await createDossierCheckout(engineer(), proposal.id);
    const paid = await payWith(url, "4242 4242 4242 4242");
    expect(paid.status).toBe(303);
    expect(payments.deliveries).toHaveLength(1);
    const delivery = payments.deliveries[0];
    expect(delivery.status).toBe(200);

    const received = receiptsIn(subject);
    expect(received).toHaveLength(1);
    const [receipt] = received;
    expect(receipt.to).toBe("engineer@example.com");
    // The link is absolute, from NEXTAUTH_URL: it is opened from a mail program.
    const link = `${APP}/dossiers/${proposal.id}`;
    expect(receipt.text).toContain(link);
    expect(receipt.html).toContain(`href="${link}"`);
    expect(receipt.text).toContain(`Amount paid: ${formatMoney(price.amount, price.currency)}`);
    expect(receipt.text).toContain(`Payment reference: ${sessionId}`);
    expect(receipt.text).toMatch(/qualified persons only/);
    expect(queuedReceipts(subject)).toMatchObject([{ status: "sent", attempts: 1 }]);

    // The provider's retry of the same delivery, byte for byte: recorded already, nothing sent.
    const replay = await postToWebhook(delivery.payload, delivery.signature);
    expect(replay).toMatchObject({ status: 200, body: { duplicate: true } });
    // A second, distinct event about the same paid session: the dossier is granted already.
    const event = JSON.parse(delivery.payload) as { id: string };
    const second = JSON.stringify({ ...event, id: `${event.id}_again` });
    const again = await postToWebhook(
      second,
      Stripe.webhooks.generateTestHeaderString({ payload: second, secret: WEBHOOK_SECRET }),
    );
    expect(again).toMatchObject({
      status: 200,
      body: { duplicate: false, outcome: "already granted" },
    });
    // A forged one is refused before anything is read from it.
    const forged = await fetch(receiverUrl, {
      method: "POST",
      headers: {
        "content-type": "application/json",
        "stripe-signature": Stripe.webhooks.generateTestHeaderString({
          payload: second.replace("_again", "_forged"),
          secret: "whsec_guessed",
        }),
      },
      body: second.replace("_again", "_forged"),
    });
    expect(forged.status).toBe(400);

    expect(receiptsIn(subject)).toHaveLength(1);
    expect(queuedReceipts(subject)).toHaveLength(1);
    expect(
      db.select().from(dossierGrants).where(eq(dossierGrants.proposalId, proposal.id)).all(),
    ).toHaveLength(1);
  });

  it("a mail server that does not answer keeps the receipt queued; the webhook still succeeds and the retry sends it once", async () => {
    const { caseName, proposal } = frozenProposals()[1];
    const subject = receiptSubject(caseName, proposal.version);
    // A port nobody listens on: the fake SMTP server's, closed for the moment.
    const down = await startFakeSmtpServer(smtpDb);
    await down.close();
    process.env.SMTP_URL = down.url;
    try {
      const { url } = await createDossierCheckout(engineer(), proposal.id);
      expect((await payWith(url, "4242 4242 4242 4242")).status).toBe(303);
      expect(payments.deliveries.at(-1)!.status).toBe(200);
      expect(
        db.select().from(dossierGrants).where(eq(dossierGrants.proposalId, proposal.id)).all(),
      ).toHaveLength(1);
      expect(queuedReceipts(subject)).toMatchObject([{ status: "pending", attempts: 1 }]);
      expect(receiptsIn(subject)).toHaveLength(0);
    } finally {
      process.env.SMTP_URL = smtp.url;
    }
    // The retry loop's next turn, once its wait is over.
    await flushMailQueue(new Date(Date.now() + 60 * 60_000));
    expect(receiptsIn(subject)).toHaveLength(1);
    expect(queuedReceipts(subject)).toMatchObject([{ status: "sent", attempts: 2 }]);
  });
});
