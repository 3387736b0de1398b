import Stripe from "stripe";
import { describe, expect, it } from "vitest";
import { POST as webhookRoute } from "@/app/api/webhooks/stripe/route";
import { createUser, findUserForSignIn } from "@/db/queries/users";
import { sendProposalSchema } from "@/lib/validations/pipeline";
import { createUserSchema } from "@/lib/validations/user";
import { caller } from "../support/callers";

// Finding 13.8, the smaller items checked here: webhook timestamps far in the future, and line
// breaks in display names. (HSTS and the CSP nonce are answered by the running app: e2e.)
const SECRET = "whsec_hardening_integration";

function signedDelivery(timestamp: number) {
  const payload = JSON.stringify({
    id: `evt_time_${timestamp}`,
    object: "event",
    type: "customer.created",
    data: { object: { id: "cus_x", object: "customer" } },
  });
  const signature = Stripe.webhooks.generateTestHeaderString({
    payload,
    secret: SECRET,
    timestamp,
  });
  return new Request("http://loopshift.test/api/webhooks/stripe", {
    method: "POST",
    headers: { "content-type": "application/json", "stripe-signature": signature },
    body: payload,
  });
}

describe("webhook timestamps", () => {
  it("a correctly signed webhook dated an hour ahead is refused with 400", async () => {
    process.env.STRIPE_WEBHOOK_SECRET = SECRET;
    const now = Math.floor(Date.now() / 1000);
    expect((await webhookRoute(signedDelivery(now + 3600))).status).toBe(400);
    // Clock skew of a minute is still accepted, as is the present.
    expect((await webhookRoute(signedDelivery(now + 60))).status).toBe(200);
    expect((await webhookRoute(signedDelivery(now))).status).toBe(200);
  });
});

describe("display names", () => {
  it("a name with CR/LF cannot add a mail header or a log line: it is stored on one line", () => {
    const input = createUserSchema.parse({
      email: "crlf@example.com",
      name: "Eve\r\nBcc: everyone@example.org",
      role: "engineer",
      accountId: "",
      password: "long-enough-pw",
    });
    createUser(caller("admin@example.com"), input);
    expect(findUserForSignIn("crlf@example.com")?.name).toBe("Eve Bcc: everyone@example.org");
  });

  it("a reviewer's name sent with a proposal loses its line breaks, and a name of only breaks is refused", () => {
    expect(sendProposalSchema.parse({ email: "r@example.com", name: "Rita\nRoe\u2028" }).name).toBe(
      "Rita Roe",
    );
    expect(sendProposalSchema.safeParse({ email: "r@example.com", name: "\r\n" }).success).toBe(
      false,
    );
  });
});
