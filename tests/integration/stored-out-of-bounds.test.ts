// First: Next.js reads the request scope's storage from globalThis when its modules load.
import "../support/node-async-storage";
import { eq, sql } from "drizzle-orm";
import { describe, expect, it } from "vitest";
import EditAxisPage from "@/app/(app)/(installed-base)/axes/[axisId]/page";
import { freezeProposalAction, suggestKitsAction } from "@/server/cases/actions";
import { GET as axisGet, PUT as axisPut } from "@/app/api/v1/axes/[axisId]/route";
import { GET as caseGet } from "@/app/api/v1/cases/[caseId]/route";
import {
  GET as proposalsGet,
  POST as proposalsPost,
} from "@/app/api/v1/cases/[caseId]/proposals/route";
import { GET as resultGet } from "@/app/api/v1/cases/[caseId]/result/route";
import { GET as caseWorkbookGet } from "@/app/api/v1/cases/[caseId]/workbook/route";
import { GET as dossierGet } from "@/app/api/v1/proposals/[proposalId]/dossier/route";
import { GET as proposalWorkbookGet } from "@/app/api/v1/proposals/[proposalId]/workbook/route";
import { db } from "@/db";
import { listCases } from "@/db/queries/cases";
import { listCaseAxes } from "@/db/queries/case-axes";
import { listProposals } from "@/db/queries/proposal-versions";
import { recordCheckoutSession } from "@/db/queries/payments";
import { recordPaymentEvent } from "@/server/payments/record-event";
import { openQuoteFor } from "@/db/queries/quote-open";
import { proposals } from "@/db/schema";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";
import { renderPageAs } from "../support/render-page";

// Issue 13, finding 6: an axis saved before the bounds existed (ambientC −1000 °C, written here
// straight into the migrated SQLite file, as an old version stored it) must not break its case
// with a bare 422 or a throw. Every consumer names the machine, the axis, the field with its
// allowed range (FIELD_BOUNDS.ambientC: −40…80 °C) and the page to fix it on; the axis edit
// screen's API reads and corrects it; nothing is rewritten behind the user's back.
const engineer = () => caller("engineer@example.com");
const target = listCases(engineer()).find((c) => c.axisCount > 0)!;
const axis = listCaseAxes(engineer(), target.id)[0];
const client = db.$client;
const ambientOf = (id: number) =>
  (client.prepare("SELECT ambient_c AS v FROM axes WHERE id = ?").get(id) as { v: number }).v;
const params = <K extends string>(key: K, value: number) => ({
  params: Promise.resolve({ [key]: String(value) } as Record<K, string>),
});
const get = (url = "http://localhost/x") => new Request(url);
const as = <T>(call: () => Promise<T>) => asRequestOf(engineer(), call);

/** What every consumer must say about the one stored value. */
function expectNamesTheProblem(text: string) {
  expect(text).toContain(`Machine "${axis.machineName}"`);
  expect(text).toContain(`axis "${axis.label}"`);
  expect(text).toContain("Ambient temperature is -1000 °C");
  expect(text).toContain("must be at least -40 °C");
  expect(text).toContain("allowed: -40 to 80 °C");
  expect(text).toContain("correct the value on the axis's edit page");
  // The page is a link beside the words (fixAt.href); no database id is shown as text.
  expect(text).not.toContain(`/axes/${axis.axisId}`);
  expect(text).not.toMatch(/\(\/\w+\/\d+\)/);
}

async function expectConflict(res: Response) {
  expect(res.status).toBe(409);
  const body = (await res.json()) as {
    error: string;
    problems: string[];
    issues: { axisId: number; field: string; allowed: string; fixAt: { href: string } }[];
  };
  expectNamesTheProblem(body.error);
  expect(body.problems).toHaveLength(1);
  expectNamesTheProblem(body.problems[0]);
  expect(body.issues[0]).toMatchObject({
    axisId: axis.axisId,
    field: "Ambient temperature",
    allowed: "-40 to 80 °C",
    fixAt: { href: `/axes/${axis.axisId}` },
  });
}

describe("an axis stored out of bounds by an old version", () => {
  it("is named with its machine, field, range and edit page by every consumer, and stays as stored", async () => {
    expect(target).toBeDefined();
    client.prepare("UPDATE axes SET ambient_c = -1000 WHERE id = ?").run(axis.axisId);
    const proposalsBefore = listProposals(engineer(), target.id).length;

    // The case result (what the case page's results panel loads) and the workbook export.
    await expectConflict(await as(() => resultGet(get(), params("caseId", target.id))));
    await expectConflict(await as(() => caseWorkbookGet(get(), params("caseId", target.id))));
    // Freezing a proposal, by the API and by the case page's button (a server action).
    const post = new Request("http://localhost/x", { method: "POST" });
    await expectConflict(await as(() => proposalsPost(post, params("caseId", target.id))));
    const frozen = await as(() => freezeProposalAction(target.id));
    expect(frozen.ok).toBe(false);
    if (!frozen.ok) expectNamesTheProblem(frozen.message);
    const suggested = await as(() => suggestKitsAction(target.id));
    expect(suggested.ok).toBe(false);
    if (!suggested.ok) expectNamesTheProblem(suggested.message);
    expect(listProposals(engineer(), target.id)).toHaveLength(proposalsBefore);

    // The case page's own data still loads: the case, its input and its proposals.
    const caseRes = await as(() => caseGet(get(), params("caseId", target.id)));
    expect(caseRes.status).toBe(200);
    expect((await as(() => proposalsGet(get(), params("caseId", target.id)))).status).toBe(200);

    // Nothing rewrote the stored value.
    expect(ambientOf(axis.axisId)).toBe(-1000);
  });

  it("a proposal frozen with it answers its workbook and its paid dossier with the same names", async () => {
    const input = (await (await as(() => caseGet(get(), params("caseId", target.id)))).json()) as {
      input: unknown;
    };
    const [{ last }] = db
      .select({ last: sql<number>`max(${proposals.version})` })
      .from(proposals)
      .where(eq(proposals.caseId, target.id))
      .all();
    // A version frozen by the old app: its input holds the value, its result whatever was printed.
    const old = listProposals(engineer(), target.id)[0];
    const oldRow = db.select().from(proposals).where(eq(proposals.id, old.id)).get()!;
    const row = db.transaction((tx) => {
      const [inserted] = tx
        .insert(proposals)
        .values({
          caseId: target.id,
          version: (last ?? 0) + 1,
          input: input.input as never,
          result: oldRow.result,
          engineVersion: oldRow.engineVersion,
          createdById: engineer().id,
        })
        .returning()
        .all();
      openQuoteFor(tx, inserted, target.ownerId);
      return inserted;
    });

    const workbook = await as(() => proposalWorkbookGet(get(), params("proposalId", row.id)));
    await expectConflict(workbook.clone());
    expect(((await workbook.json()) as { error: string }).error).toContain(
      `Proposal version ${row.version} cannot be evaluated again`,
    );

    recordCheckoutSession(engineer(), row.id, {
      id: "cs_test_stored_bounds",
      amountMinor: 49000,
      amount: "490.00",
      currency: "EUR",
    });
    recordPaymentEvent({
      id: "evt_stored_bounds",
      type: "checkout.session.completed",
      session: {
        id: "cs_test_stored_bounds",
        paymentStatus: "paid",
        amountTotal: 49000,
        currency: "eur",
      },
    });
    await expectConflict(await as(() => dossierGet(get(), params("proposalId", row.id))));
  });

  it("the axis edit screen's API reads the stored value and takes the correction; then the case evaluates", async () => {
    // The edit page itself renders its form around the stored row (its client part needs the
    // App Router's context, which only next start provides: tests/support/render-page.ts gives
    // an inert one).
    const html = await renderPageAs(engineer(), () =>
      EditAxisPage({ params: Promise.resolve({ axisId: String(axis.axisId) }) }),
    );
    expect(html).toContain(`Edit ${axis.label}`);
    expect(html).toContain('name="ambientC"');

    const res = await as(() => axisGet(get(), params("axisId", axis.axisId)));
    expect(res.status).toBe(200);
    const stored = (await res.json()) as Record<string, unknown>;
    expect(stored.ambientC).toBe(-1000);

    // Saving it unchanged is refused with the field's own message; nothing is written.
    const put = (body: unknown) =>
      new Request("http://localhost/x", {
        method: "PUT",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(body),
      });
    const refused = await as(() => axisPut(put(stored), params("axisId", axis.axisId)));
    expect(refused.status).toBe(422);
    expect(((await refused.json()) as { problems: string[] }).problems).toContain(
      "ambientC: must be at least -40 °C",
    );
    expect(ambientOf(axis.axisId)).toBe(-1000);

    const fixed = await as(() =>
      axisPut(put({ ...stored, ambientC: 20 }), params("axisId", axis.axisId)),
    );
    expect(fixed.status).toBe(200);
    expect(ambientOf(axis.axisId)).toBe(20);
    const result = await as(() => resultGet(get(), params("caseId", target.id)));
    expect(result.status).toBe(200);
    const body = (await result.json()) as { axes: { id: string; openLoop: object }[] };
    expect(body.axes.some((a) => a.id === String(axis.axisId))).toBe(true);
  });
});
