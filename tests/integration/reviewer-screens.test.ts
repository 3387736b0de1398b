import "../support/node-async-storage";
import { eq } from "drizzle-orm";
import { createElement } from "react";
import { afterEach, beforeAll, describe, expect, it } from "vitest";
import InvitationPage from "@/app/(auth)/invitation/[token]/page";
import VendorLayout from "@/app/(app)/layout";
import ReviewLayout from "@/app/(review)/layout";
import { db } from "@/db";
import { createInvitation, revokeInvitation } from "@/db/queries/invitations";
import { createUser } from "@/db/queries/users";
import { accounts, cases, proposals, sites } from "@/db/schema";
import { vendorCompanyName } from "@/lib/vendor-name";
import { paymentsTestMode } from "@/server/payments/config";
import { caller } from "../support/callers";
import { renderPageAs, renderWithRouter } from "../support/render-page";

const admin = () => caller("admin@example.com");
const engineer = () => caller("engineer@example.com");

// The shell's menu marks the page's path: these render at the root.
const ROOT = "/";

const BANNER = "TEST MODE";

describe("the vendor's test-mode banner", () => {
  it("shows on the engineer's pages and never on the reviewer's", async () => {
    // The integration run uses the local test payment service, as `npm start` does without keys.
    expect(paymentsTestMode()).toBe(true);
    const child = createElement("p", null, "page body");
    const vendor = await renderPageAs(engineer(), () => VendorLayout({ children: child }), ROOT);
    expect(vendor).toContain("page body");
    expect(vendor).toContain(BANNER);
    const review = await renderPageAs(
      caller("reviewer@example.com"),
      () => ReviewLayout({ children: child }),
      ROOT,
    );
    expect(review).toContain("page body");
    expect(review).not.toContain(BANNER);
    expect(review).not.toMatch(/test card|local test payment/i);
  });
});

// Two customer accounts, each with a frozen proposal, from the seeded demo.
function proposalOf(accountId: number) {
  return db
    .select({
      id: proposals.id,
      caseName: cases.name,
      version: proposals.version,
      siteName: sites.name,
    })
    .from(proposals)
    .innerJoin(cases, eq(cases.id, proposals.caseId))
    .innerJoin(sites, eq(sites.id, cases.siteId))
    .where(eq(cases.accountId, accountId))
    .get();
}

let ours: { id: number; name: string; proposal: NonNullable<ReturnType<typeof proposalOf>> };
let theirs: { id: number; name: string; proposal: NonNullable<ReturnType<typeof proposalOf>> };

beforeAll(() => {
  const withProposals = db
    .select({ id: accounts.id, name: accounts.name })
    .from(accounts)
    .all()
    .flatMap((a) => {
      const proposal = proposalOf(a.id);
      return proposal ? [{ ...a, proposal }] : [];
    });
  expect(withProposals.length).toBeGreaterThanOrEqual(2);
  [ours, theirs] = withProposals;
});

const savedEnv = { VENDOR_NAME: process.env.VENDOR_NAME, MAIL_FROM: process.env.MAIL_FROM };
afterEach(() => Object.assign(process.env, savedEnv));

let counter = 0;
/** A new reviewer of our account, invited by the demo engineer to the given proposal. */
function invite(proposalId: number, now = new Date()) {
  const email = `invited.${++counter}@example.com`;
  const user = createUser(admin(), {
    email,
    name: `Robin Ledger ${counter}`,
    role: "reviewer",
    accountId: ours.id,
    password: "an-unknown-password-1",
  } as never);
  const { token } = db.transaction((tx) =>
    createInvitation(tx, { userId: user.id, proposalId, createdById: engineer().id, now }),
  );
  return { token, userId: user.id, email };
}

const page = async (token: string) =>
  renderWithRouter(await InvitationPage({ params: Promise.resolve({ token }) }), ROOT);

describe("the invitation page, written for the finance reviewer", () => {
  it("says who invited them, from which company, to which proposal of which account, and what they can do", async () => {
    process.env.VENDOR_NAME = "Harrowgate Motion Retrofits";
    const { token, email } = invite(ours.proposal.id);
    const text = await page(token);
    expect(text).toContain(engineer().name);
    expect(text).toContain("Harrowgate Motion Retrofits");
    expect(text).toContain(ours.name);
    expect(text).toContain(`${ours.proposal.caseName}, version ${ours.proposal.version}`);
    expect(text).toContain(ours.proposal.siteName);
    expect(text).toContain(email);
    // The three things a reviewer can do, in their words.
    expect(text).toMatch(/Read the proposal exactly as it was sent/);
    expect(text).toMatch(/sandbox\. Nothing you try there is saved or changes the\s+proposal/);
    expect(text).toMatch(/Approve it, ask for changes with a comment, or decline/);
    // The form to choose a password is there.
    expect(text).toMatch(/type="password"/);
  });

  it("never describes a proposal of another account, even when the invitation row points at one", async () => {
    const { token } = invite(theirs.proposal.id);
    const text = await page(token);
    expect(text).toContain(ours.name);
    expect(text).not.toContain(theirs.name);
    expect(text).not.toContain(theirs.proposal.caseName);
    expect(text).toContain("retrofit proposals");
  });

  it("takes the company from the sender address when VENDOR_NAME is not set, and none from the default", () => {
    delete process.env.VENDOR_NAME;
    expect(vendorCompanyName({ MAIL_FROM: '"Harrowgate Sales" <sales@harrowgate.example>' })).toBe(
      "Harrowgate Sales",
    );
    expect(vendorCompanyName({ MAIL_FROM: "Loopshift <no-reply@loopshift.invalid>" })).toBeNull();
    expect(vendorCompanyName({})).toBeNull();
  });

  it("says plainly that an expired, withdrawn or unknown link does not work, and names nobody", async () => {
    const tenDaysAgo = new Date(Date.now() - 10 * 24 * 3600 * 1000);
    const expired = invite(ours.proposal.id, tenDaysAgo);
    const expiredPage = await page(expired.token);
    expect(expiredPage).toContain("This link has expired");
    expect(expiredPage).toMatch(/Ask your contact at the supplier to send the proposal again/);

    const withdrawn = invite(ours.proposal.id);
    revokeInvitation(admin(), withdrawn.userId);
    const withdrawnPage = await page(withdrawn.token);
    expect(withdrawnPage).toContain("This link was withdrawn");

    const unknownPage = await page("no-such-token");
    expect(unknownPage).toContain("This link does not work");

    for (const text of [expiredPage, withdrawnPage, unknownPage]) {
      expect(text).toContain('role="alert"');
      expect(text).not.toContain(engineer().name);
      expect(text).not.toContain(ours.name);
      expect(text).not.toContain(ours.proposal.caseName);
      expect(text).not.toMatch(/type="password"/);
    }
  });
});
