import { eq, like } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { db } from "@/db";
import {
  getDossierAccess,
  getDossierSettings,
  readDossierPrice,
  saveDossierSettings,
  setDossierPrice,
} from "@/db/queries/dossiers";
import { listCases } from "@/db/queries/cases";
import { listProposals } from "@/db/queries/proposal-versions";
import { recordCheckoutSession } from "@/db/queries/payments";
import { recordPaymentEvent } from "@/server/payments/record-event";
import { dossierGrants, mailQueue, paymentEvents } from "@/db/schema";
import { NotFoundError, ForbiddenError } from "@/lib/errors";
import { minorUnits as minorUnitsOf } from "@/lib/payments/minor-units";
import { caller } from "../support/callers";

const engineer = caller("engineer@example.com");
const engineer2 = caller("engineer2@example.com");
const admin = caller("admin@example.com");
const frozen = listCases(engineer).find((c) => c.latestVersion !== null)!;
const proposal = listProposals(engineer, frozen.id)[0];

const completed = (eventId: string, sessionId: string, amountTotal = 49000, currency = "eur") => ({
  id: eventId,
  type: "checkout.session.completed",
  session: { id: sessionId, paymentStatus: "paid", amountTotal, currency },
});
const grantsOf = (proposalId: number) =>
  db.select().from(dossierGrants).where(eq(dossierGrants.proposalId, proposalId)).all();

describe("dossier grants from verified payment events", () => {
  it("grants the dossier once, and a replayed or second event changes nothing", () => {
    recordCheckoutSession(engineer, proposal.id, {
      id: "cs_test_once",
      amountMinor: 49000,
      amount: "490.00",
      currency: "EUR",
    });
    expect(getDossierAccess(engineer, proposal.id).grant).toBeNull();

    const first = recordPaymentEvent(completed("evt_once", "cs_test_once"));
    expect(first).toMatchObject({ duplicate: false, outcome: "granted" });
    expect(first.granted?.buyerEmail).toBe("engineer@example.com");
    // The receipt is queued in the grant's transaction: one message, to the buyer.
    expect(first.receiptMailId).toEqual(expect.any(Number));
    expect(grantsOf(proposal.id)).toHaveLength(1);

    const replay = recordPaymentEvent(completed("evt_once", "cs_test_once"));
    expect(replay).toMatchObject({ duplicate: true, granted: null });
    const another = recordPaymentEvent(completed("evt_twice", "cs_test_once"));
    expect(another).toMatchObject({ duplicate: false, outcome: "already granted", granted: null });
    expect(replay.receiptMailId).toBeNull();
    expect(another.receiptMailId).toBeNull();
    expect(grantsOf(proposal.id)).toHaveLength(1);
    expect(
      db.select().from(mailQueue).where(like(mailQueue.subject, "Receipt for the dossier%")).all(),
    ).toMatchObject([{ id: first.receiptMailId, toAddress: "engineer@example.com" }]);
    expect(
      db.select().from(paymentEvents).where(eq(paymentEvents.id, "evt_once")).all(),
    ).toHaveLength(1);
    expect(getDossierAccess(engineer, proposal.id).grant?.eventId).toBe("evt_once");
  });

  it("grants nothing for a session not ours, an unpaid one, or another amount", () => {
    const before = db.select().from(dossierGrants).all().length;
    expect(recordPaymentEvent(completed("evt_unknown", "cs_test_nobody")).outcome).toBe(
      "unknown session",
    );
    recordCheckoutSession(engineer, proposal.id, {
      id: "cs_test_cheap",
      amountMinor: 49000,
      amount: "490.00",
      currency: "EUR",
    });
    expect(recordPaymentEvent(completed("evt_cheap", "cs_test_cheap", 100)).outcome).toBe(
      "amount or currency differs",
    );
    expect(recordPaymentEvent(completed("evt_usd", "cs_test_cheap", 49000, "usd")).outcome).toBe(
      "amount or currency differs",
    );
    expect(
      recordPaymentEvent({
        id: "evt_unpaid",
        type: "checkout.session.completed",
        session: {
          id: "cs_test_cheap",
          paymentStatus: "unpaid",
          amountTotal: 49000,
          currency: "eur",
        },
      }).outcome,
    ).toBe("not paid");
    expect(db.select().from(dossierGrants).all().length).toBe(before);
  });

  it("hides another account's proposal and dossier: not found, not forbidden", () => {
    expect(() => getDossierAccess(engineer2, proposal.id)).toThrow(NotFoundError);
    expect(() => getDossierSettings(engineer2, proposal.id)).toThrow(NotFoundError);
    expect(() =>
      recordCheckoutSession(engineer2, proposal.id, {
        id: "cs_test_theirs",
        amountMinor: 1,
        amount: "0.01",
        currency: "EUR",
      }),
    ).toThrow(NotFoundError);
  });
});

describe("dossier price and settings", () => {
  it("only administrators set the price; a currency's minor unit limits its decimals", () => {
    expect(readDossierPrice()).toMatchObject({
      amount: "490.00",
      currency: "EUR",
      isDefault: true,
    });
    expect(() => setDossierPrice(engineer, { amount: "1.00", currency: "EUR" })).toThrow(
      ForbiddenError,
    );
    setDossierPrice(admin, { amount: "350.00", currency: "chf" as string });
    expect(readDossierPrice()).toMatchObject({
      amount: "350.00",
      currency: "CHF",
      isDefault: false,
    });
    // ISO 4217: the yen has no minor unit.
    expect(() => setDossierPrice(admin, { amount: "100.50", currency: "JPY" })).toThrow(
      /whole amount/,
    );
    expect(minorUnitsOf("350.00", "CHF")).toBe(35000);
    expect(minorUnitsOf("12000", "JPY")).toBe(12000);
  });

  it("records a seed on first read and keeps it; saving new ranges is validated", () => {
    const first = getDossierSettings(engineer, proposal.id);
    expect(getDossierSettings(engineer, proposal.id)).toEqual(first);
    const saved = saveDossierSettings(engineer, proposal.id, {
      ...first,
      seed: 12345,
      tariff: { lowPct: -10, highPct: 10 },
    });
    expect(getDossierSettings(engineer, proposal.id)).toEqual(saved);
    expect(() =>
      saveDossierSettings(engineer, proposal.id, {
        ...saved,
        loadTorque: { lowPct: 20, highPct: 10 },
      }),
    ).toThrow(/low end must not be above the high end/);
  });
});
