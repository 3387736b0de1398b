import { spawnSync } from "node:child_process";
import fs from "node:fs";
import os from "node:os";
import path from "node:path";
import { eq } from "drizzle-orm";
import Stripe from "stripe";
import { afterEach, describe, expect, it } from "vitest";
import { POST as webhookRoute } from "@/app/api/webhooks/stripe/route";
import { db } from "@/db";
import { listCases } from "@/db/queries/cases";
import { listProposals } from "@/db/queries/proposal-versions";
import { recordCheckoutSession } from "@/db/queries/payments";
import { dossierGrants } from "@/db/schema";
import { LOCAL_WEBHOOK_SECRET } from "@/server/payments/config";
import { caller } from "../support/callers";

// Finding: with a real payment key and no webhook secret, the secret fell back to the public
// local one from the README, so anyone could sign a completed checkout for an unpaid session.
const REAL_KEY = "sk_live_loopshift_invented";
const saved = { ...process.env };
afterEach(() => {
  process.env.STRIPE_SECRET_KEY = saved.STRIPE_SECRET_KEY;
  process.env.STRIPE_WEBHOOK_SECRET = saved.STRIPE_WEBHOOK_SECRET;
  if (saved.STRIPE_SECRET_KEY === undefined) delete process.env.STRIPE_SECRET_KEY;
  if (saved.STRIPE_WEBHOOK_SECRET === undefined) delete process.env.STRIPE_WEBHOOK_SECRET;
});

function forgedCompletion(sessionId: string) {
  const payload = JSON.stringify({
    id: "evt_forged_with_public_secret",
    object: "event",
    type: "checkout.session.completed",
    data: {
      object: {
        id: sessionId,
        object: "checkout.session",
        payment_status: "paid",
        amount_total: 49000,
        currency: "eur",
      },
    },
  });
  const signature = Stripe.webhooks.generateTestHeaderString({
    payload,
    secret: LOCAL_WEBHOOK_SECRET,
  });
  return new Request("http://loopshift.test/api/webhooks/stripe", {
    method: "POST",
    headers: { "content-type": "application/json", "stripe-signature": signature },
    body: payload,
  });
}

describe("a real payment key without a webhook secret", () => {
  it("a checkout completion forged with the README's local secret does not unlock the buyer's unpaid dossier", async () => {
    const engineer = caller("engineer@example.com");
    const proposal = listProposals(
      engineer,
      listCases(engineer).find((c) => c.latestVersion)!.id,
    )[0];
    recordCheckoutSession(engineer, proposal.id, {
      id: "cs_live_unpaid",
      amountMinor: 49000,
      amount: "490.00",
      currency: "EUR",
    });
    process.env.STRIPE_SECRET_KEY = REAL_KEY;
    delete process.env.STRIPE_WEBHOOK_SECRET;

    const response = await webhookRoute(forgedCompletion("cs_live_unpaid"));
    expect(response.status).toBeGreaterThanOrEqual(400);
    expect(
      db.select().from(dossierGrants).where(eq(dossierGrants.proposalId, proposal.id)).all(),
    ).toEqual([]);
  });

  it("npm start stops at once with a message naming STRIPE_WEBHOOK_SECRET", () => {
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), "loopshift-start-"));
    const env: NodeJS.ProcessEnv = {
      ...process.env,
      DATABASE_PATH: path.join(dir, "never.db"),
      STRIPE_SECRET_KEY: REAL_KEY,
      STRIPE_FAKE: "",
      SMTP_URL: "smtp://127.0.0.1:9",
    };
    delete env.STRIPE_WEBHOOK_SECRET;
    const run = spawnSync(path.resolve("node_modules/.bin/tsx"), ["lib/cli/start.ts"], {
      env,
      encoding: "utf8",
      timeout: 60_000,
    });
    expect(run.status).toBe(1);
    expect(run.stderr).toContain("STRIPE_WEBHOOK_SECRET is not set");
    // It stopped before touching the database.
    expect(fs.existsSync(env.DATABASE_PATH!)).toBe(false);
  });

  it("the local fake's key keeps the local secret, so npm start still needs no configuration", async () => {
    delete process.env.STRIPE_SECRET_KEY;
    delete process.env.STRIPE_WEBHOOK_SECRET;
    const response = await webhookRoute(forgedCompletion("cs_local_unknown"));
    // Verified with the local secret, then refused as a session we never created.
    expect(response.status).toBe(200);
    expect(await response.json()).toMatchObject({ outcome: "unknown session" });
  });
});
