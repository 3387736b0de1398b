import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { openDatabase } from "@/db/client";
import { listAxesForExport } from "@/db/queries/axes";
import { createCase } from "@/db/queries/cases";
import { listCaseAxes, setCaseAxes, setCaseAxesRetrofit } from "@/db/queries/case-axes";
import { vendorQuoteOrThrow } from "@/db/queries/proposals";
import { approveDiscount } from "@/db/queries/quotes";
import { getSalesSettings, saveSalesSettings } from "@/db/queries/sales-settings";
import { listSites } from "@/db/queries/sites";
import { freezeProposal } from "@/server/cases/freeze";
import { startFakeSmtpServer, type FakeSmtpServer } from "@/server/mail/fake-smtp-server";
import { sendBlocker, sendProposal } from "@/server/proposals/send";
import { ForbiddenError } from "@/lib/errors";
import { bulkRetrofitSchema } from "@/lib/validations/case";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");
const manager = () => caller("manager@example.com");
const admin = () => caller("admin@example.com");

let smtp: FakeSmtpServer;
// The fake SMTP server files messages through a connection of its own, as under `npm start`.
const smtpDb = openDatabase(process.env.DATABASE_PATH);

beforeAll(async () => {
  process.env.NEXTAUTH_URL = "http://loopshift.test:4321";
  smtp = await startFakeSmtpServer(smtpDb);
  process.env.SMTP_URL = smtp.url;
});
afterAll(async () => {
  await smtp?.close();
  smtpDb.$client.close();
});

describe("a discount set through the case's bulk edit goes through the approval rule", () => {
  it("12 % on three axes, threshold 10 %: frozen, send is blocked, a manager approves, send works", async () => {
    // The administrator's threshold below the discount about to be given.
    saveSalesSettings(admin(), {
      discountThresholdPct: 10,
      stageProbabilities: getSalesSettings().stageProbabilities,
    });

    const site = listSites(manager()).find((s) => s.name === "North hall")!;
    const c = createCase(engineer(), { name: "Approval path", siteId: site.id });
    const picked = listAxesForExport(engineer(), site.id, 0, 5).axes.map((a) => a.id);
    setCaseAxes(engineer(), c.id, picked);
    setCaseAxesRetrofit(
      engineer(),
      c.id,
      bulkRetrofitSchema.parse({ axisIds: picked.slice(0, 3), discountPct: 12 }),
    );
    expect(listCaseAxes(engineer(), c.id).map((a) => a.discountPct)).toEqual(
      expect.arrayContaining([12, 12, 12, 0, 0]),
    );

    const proposal = freezeProposal(engineer(), c.id);
    const quote = vendorQuoteOrThrow(engineer(), proposal.id);
    expect(quote.maxDiscountPct).toBe(12);
    expect(quote.discountApprovedAt).toBeNull();
    expect(sendBlocker(quote)).toMatch(/up to 12 %, above the 10 %/);
    await expect(
      sendProposal(engineer(), proposal.id, { email: "reviewer@example.com", name: "R" }),
    ).rejects.toThrow(/sales manager must approve the discount first/);
    expect(vendorQuoteOrThrow(engineer(), proposal.id).stage).toBe(quote.stage);

    // Only a manager approves.
    expect(() => approveDiscount(engineer(), proposal.id)).toThrow(ForbiddenError);
    approveDiscount(manager(), proposal.id);
    expect(sendBlocker(vendorQuoteOrThrow(engineer(), proposal.id))).toBeNull();

    await expect(
      sendProposal(engineer(), proposal.id, { email: "reviewer@example.com", name: "R" }),
    ).resolves.toMatchObject({ stage: "sent" });
  });
});
