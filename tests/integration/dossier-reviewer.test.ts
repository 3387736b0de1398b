import { eq } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import { listCases } from "@/db/queries/cases";
import { listProposals } from "@/db/queries/proposal-versions";
import {
  getDossierAccess,
  getDossierSettings,
  isDossierPaid,
  saveDossierSettings,
} from "@/db/queries/dossiers";
import { recordCheckoutSession } from "@/db/queries/payments";
import { recordPaymentEvent } from "@/server/payments/record-event";
import { db } from "@/db";
import { dossierSettings, mailQueue } from "@/db/schema";
import { ForbiddenError, NotFoundError } from "@/lib/errors";
import { createDossierCheckout } from "@/server/payments/checkout";
import { caller } from "../support/callers";

// The dossier is bought for the customer's investment committee: their reviewer reads it for a
// proposal sent to their own account, once paid, and learns nothing of any other proposal's.
const engineer = caller("engineer@example.com");
// The seeded finance reviewer of Cartonia Packaging Plant (db/seed.ts).
const reviewer = caller("reviewer@example.com");

function proposalOf(caseName: string) {
  const c = listCases(engineer).find((x) => x.name === caseName)!;
  return listProposals(engineer, c.id).at(-1)!;
}
// Sent to the reviewer; another account's, sent to its own customer; the reviewer's own
// account's, not sent yet (db/demo/cases.ts).
const sentToReviewer = proposalOf("North hall cartoners, phase 1");
const otherAccount = proposalOf("Web press register and infeed");
const notSentYet = proposalOf("South hall cartoners");

// A paid checkout of the proposal, as the verified webhook records it.
function pay(proposalId: number, tag: string) {
  recordCheckoutSession(engineer, proposalId, {
    id: `cs_test_${tag}`,
    amountMinor: 49000,
    amount: "490.00",
    currency: "EUR",
  });
  return recordPaymentEvent({
    id: `evt_${tag}`,
    type: "checkout.session.completed",
    session: { id: `cs_test_${tag}`, paymentStatus: "paid", amountTotal: 49000, currency: "eur" },
  });
}

describe("the customer's reviewer and the paid dossier", () => {
  it("sees their proposal's dossier locked until it is paid, and may not buy it", async () => {
    expect(getDossierAccess(reviewer, sentToReviewer.id).grant).toBeNull();
    expect(isDossierPaid(reviewer, sentToReviewer.id)).toBe(false);
    // Refused by role before the payment provider is called.
    await expect(createDossierCheckout(reviewer, sentToReviewer.id)).rejects.toThrow(
      ForbiddenError,
    );
  });

  it("reads it once the supplier has paid: the same seed and ranges, and cannot change them", () => {
    const paid = pay(sentToReviewer.id, "reviewer_sent");
    expect(paid.outcome).toBe("granted");
    // The buyer's receipt is queued with the grant, for the buyer only.
    expect(
      db.select().from(mailQueue).where(eq(mailQueue.id, paid.receiptMailId!)).get(),
    ).toMatchObject({
      toAddress: "engineer@example.com",
    });

    expect(getDossierAccess(reviewer, sentToReviewer.id).grant?.eventId).toBe("evt_reviewer_sent");
    expect(isDossierPaid(reviewer, sentToReviewer.id)).toBe(true);
    const read = getDossierSettings(reviewer, sentToReviewer.id);
    // Reading first records the defaults, but not as the reviewer's edit.
    const row = db
      .select()
      .from(dossierSettings)
      .where(eq(dossierSettings.proposalId, sentToReviewer.id))
      .get()!;
    expect(row.updatedById).toBeNull();
    expect(getDossierSettings(engineer, sentToReviewer.id)).toEqual(read);
    expect(() => saveDossierSettings(reviewer, sentToReviewer.id, { ...read, seed: 1 })).toThrow(
      ForbiddenError,
    );
  });

  it("finds another account's paid dossier not found, not forbidden", () => {
    expect(pay(otherAccount.id, "reviewer_other").outcome).toBe("granted");
    expect(isDossierPaid(engineer, otherAccount.id)).toBe(true);
    expect(() => getDossierAccess(reviewer, otherAccount.id)).toThrow(NotFoundError);
    expect(() => getDossierSettings(reviewer, otherAccount.id)).toThrow(NotFoundError);
    expect(isDossierPaid(reviewer, otherAccount.id)).toBe(false);
  });

  it("finds a paid dossier of their own account not found while its proposal is not sent to them", () => {
    expect(pay(notSentYet.id, "reviewer_unsent").outcome).toBe("granted");
    expect(() => getDossierAccess(reviewer, notSentYet.id)).toThrow(NotFoundError);
    expect(() => getDossierSettings(reviewer, notSentYet.id)).toThrow(NotFoundError);
    expect(isDossierPaid(reviewer, notSentYet.id)).toBe(false);
    expect(() => getDossierAccess(reviewer, 999_999)).toThrow(NotFoundError);
  });
});
