// First: Next.js reads the request scope's storage from globalThis when its modules load.
import "../support/node-async-storage";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { describe, expect, it } from "vitest";
import EditAxisPage from "@/app/(app)/(installed-base)/axes/[axisId]/page";
import { GET as axisGet, PUT as axisPut } from "@/app/api/v1/axes/[axisId]/route";
import { GET as resultGet } from "@/app/api/v1/cases/[caseId]/result/route";
import { POST as proposalsPost } from "@/app/api/v1/cases/[caseId]/proposals/route";
import { axisToFormValues } from "@/components/installed-base/axis-form-values";
import { HeadlineCards } from "@/components/results/headline-cards";
import { db } from "@/db";
import { listAudit } from "@/db/queries/audit";
import { getAxisOrThrow, updateAxis } from "@/db/queries/axes";
import { buildCaseInput, listCases } from "@/db/queries/cases";
import { listCaseAxes } from "@/db/queries/case-axes";
import {
  listCaseEvidence,
  listProposalEvidence,
  listReviewedProposalEvidence,
  saveEvidence,
} from "@/db/queries/evidence";
import { getVisibleQuoteOrThrow } from "@/db/queries/proposals";
import { frozenSubjects } from "@/lib/evidence/subjects";
import { proposals, type Axis } from "@/db/schema";
import { saveEvidenceAction, clearEvidenceAction } from "@/server/evidence/actions";
import { saveAxisAction } from "@/server/installed-base/actions";
import Decimal from "decimal.js";
import { caseInputSchema, evaluateCase, type CaseResult } from "@/lib/engine";
import { EVIDENCE_FIELDS, indexEvidence, type EvidenceSubject } from "@/lib/evidence/subjects";
import { evidencedReliance } from "@/lib/results/value-reliance";
import { axisInputSchema } from "@/lib/validations/installed-base";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";
import { renderPageAs } from "../support/render-page";

// Issue 16, evidence for what is typed: a step-loss event's cost built up from downtime, scrap and
// restart labour, saved through the API and the axis form's schema; the source of each typed
// figure recorded through the evidence service and refused through its server actions; the
// headline's split of the value read from the served result; frozen proposals untouched.
const engineer = () => caller("engineer@example.com");
const otherEngineer = () => caller("engineer2@example.com");
const reviewer = () => caller("reviewer@example.com");
const target = listCases(engineer()).find((c) => c.axisCount > 0)!;
const caseAxis = listCaseAxes(engineer(), target.id)[0];
const params = <K extends string>(key: K, value: number) => ({
  params: Promise.resolve({ [key]: String(value) } as Record<K, string>),
});
const as = <T>(call: () => Promise<T>) => asRequestOf(engineer(), call);
const put = (body: unknown) =>
  new Request("http://localhost/x", {
    method: "PUT",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
const EVENT = { downtimeMinutes: 30, scrapParts: 2, scrapCostPerPart: "5", restartLaborHours: 0.5 };
const frozenRows = () =>
  db
    .select()
    .from(proposals)
    .all()
    .map((p) => JSON.stringify([p.id, p.input, p.result, p.engineVersion]));

async function servedResult(): Promise<CaseResult> {
  const res = await as(() =>
    resultGet(new Request("http://localhost/x"), params("caseId", target.id)),
  );
  expect(res.status).toBe(200);
  return (await res.json()) as CaseResult;
}

function apiBody(axis: Axis) {
  const { id: _id, siteId: _s, createdAt: _c, ...rest } = axis;
  return rest;
}

describe("the cost of a step-loss event built up from what it causes", () => {
  it("is stored through the API, refused beside a typed cost, and loaded by the axis form", async () => {
    // A proposal frozen before anything changes, to check below that it never moves.
    const frozen = await as(() =>
      proposalsPost(
        new Request("http://localhost/x", { method: "POST" }),
        params("caseId", target.id),
      ),
    );
    expect(frozen.status).toBe(201);
    const before = frozenRows();

    const stored = getAxisOrThrow(engineer(), caseAxis.axisId);
    const both = await as(() =>
      axisPut(put({ ...apiBody(stored), event: EVENT }), params("axisId", stored.id)),
    );
    expect(both.status, "costPerEvent and event together are refused").toBe(422);

    const { costPerEvent: _typed, ...withoutCost } = apiBody(stored);
    const res = await as(() =>
      axisPut(
        put({ ...withoutCost, stepLossEventsPerYear: 4, avoidedPct: 90, event: EVENT }),
        params("axisId", stored.id),
      ),
    );
    expect(res.status).toBe(200);
    const read = (await (
      await as(() => axisGet(new Request("http://localhost/x"), params("axisId", stored.id)))
    ).json()) as Axis;
    expect(read.event).toEqual(EVENT);
    expect(read.costPerEvent).toBe("0");

    // The form loads it as "built up", and its schema's output parses to itself (the server
    // action parses again what the form's resolver made).
    const form = axisToFormValues(read);
    expect(form).toMatchObject({ costMode: "built", event: EVENT });
    const once = axisInputSchema.parse(form);
    expect(axisInputSchema.parse(once)).toEqual(once);
    expect(once).toMatchObject({ event: EVENT, costPerEvent: "0" });

    // Switched to one typed figure, the event goes; left out (the importer), it stays.
    const typed = axisInputSchema.parse({ ...form, costMode: "typed", costPerEvent: "250" });
    expect(typed).toMatchObject({ event: null, costPerEvent: "250" });
    const { costMode: _m, event: _e, ...older } = form;
    expect("event" in axisInputSchema.parse(older)).toBe(false);
    updateAxis(engineer(), stored.id, axisInputSchema.parse(form));
    expect(getAxisOrThrow(engineer(), stored.id).event).toEqual(EVENT);

    // The server action checks the event boxes when the cost is built up (its success path
    // revalidates Next's cache, which only next start provides: the service is called above).
    const refused = await as(() =>
      saveAxisAction(stored.id, { ...form, event: { ...EVENT, downtimeMinutes: -5 } }),
    );
    expect(refused).toMatchObject({ ok: false });
    if (!refused.ok) expect(Object.keys(refused.fieldErrors)).toContain("event.downtimeMinutes");

    // The engine prices it with the case's rates: the served result equals the same case with
    // the cost typed as one figure worked by hand (30/60 h of downtime, 2 × 5 of scrap, 0.5 h of
    // restart labour at the case's rates).
    const caseInput = buildCaseInput(engineer(), target.id);
    const { finance } = caseInputSchema.parse(caseInput);
    const byHand = new Decimal(finance.downtimeCostPerHour)
      .times(30)
      .div(60)
      .plus(10)
      .plus(new Decimal(finance.laborRatePerHour).times(0.5));
    const typedInput = structuredClone(caseInput);
    const same = typedInput.axes.find((a) => a.id === String(stored.id))!;
    same.reliability = { ...same.reliability, event: undefined, costPerEvent: byHand.toFixed() };
    const result = await servedResult();
    expect(result.axes.find((a) => a.id === String(stored.id))!.savings.stepLossEventsAvoided).toBe(
      3.6,
    );
    expect(result.scenarios.physics.bySource.reliability).toEqual(
      evaluateCase(typedInput).scenarios.physics.bySource.reliability,
    );

    // The edit page shows the built-up cost priced with this case's rates, by case name.
    const html = await renderPageAs(engineer(), () =>
      EditAxisPage({ params: Promise.resolve({ axisId: String(stored.id) }) }),
    );
    expect(html).toContain("Built up from downtime, scrap and restart labour");
    expect(html).toContain(`${target.name}:`);
    expect(html).toContain("per event: downtime 30 min at");
    expect(html).toContain("Sources of the step-loss figures");
    expect(html).toContain("No source recorded");

    expect(frozenRows(), "frozen proposals are unchanged").toEqual(before);
  });
});

describe("the source of each typed figure", () => {
  const valid = {
    subjectType: "axis",
    subjectId: caseAxis.axisId,
    field: "stepLossEventsPerYear",
    note: "Maintenance log 2025, line 3",
    givenOn: "2026-02-01",
    givenBy: "R. Okafor, maintenance lead",
  };

  it("is refused to another tenant as a missing axis, to the reviewer for the role, and without its three parts", async () => {
    const missing = await asRequestOf(otherEngineer(), () =>
      saveEvidenceAction({ ...valid, subjectId: 999_999 }),
    );
    const foreign = await asRequestOf(otherEngineer(), () => saveEvidenceAction(valid));
    expect(foreign).toMatchObject({ ok: false });
    expect(foreign, "not yours is answered as missing").toEqual(missing);
    expect(await asRequestOf(reviewer(), () => saveEvidenceAction(valid))).toMatchObject({
      ok: false,
      message: "Your role may not do this",
    });
    const blank = await as(() =>
      saveEvidenceAction({ ...valid, note: " ", givenOn: "2026-02-30", givenBy: "" }),
    );
    expect(blank).toMatchObject({ ok: false, message: "Check the highlighted fields." });
    if (!blank.ok)
      expect(Object.keys(blank.fieldErrors).sort()).toEqual(["givenBy", "givenOn", "note"]);
    const wrongField = await as(() => saveEvidenceAction({ ...valid, field: "label" }));
    expect(wrongField).toMatchObject({ ok: false });
    const clearForeign = await asRequestOf(otherEngineer(), () =>
      clearEvidenceAction({ subjectType: "axis", subjectId: caseAxis.axisId, field: "avoidedPct" }),
    );
    expect(clearForeign).toMatchObject({ ok: false, message: "No such axis" });
    expect(listCaseEvidence(engineer(), target.id)).toEqual([]);
  });

  it("moves the headline's value from unevidenced to evidenced, audited, and never touches a frozen proposal", async () => {
    const before = frozenRows();
    const result = await servedResult();
    const input = caseInputSchema.parse(buildCaseInput(engineer(), target.id));
    const physics = result.scenarios.physics;
    const none = evidencedReliance(physics, result, input, {}, target.id);
    expect(none).not.toBeNull();
    expect(none!.evidenced).toBe("0");
    expect(none!.unevidencedPct).toBe(none!.typedPct);

    const headline = (index: ReturnType<typeof indexEvidence>) =>
      renderToStaticMarkup(
        createElement(HeadlineCards, {
          result,
          input,
          evidence: { caseId: target.id, index },
        }),
      );
    // The demo case rests mostly on typed figures (step-loss events and added output).
    expect(none!.mostlyUnevidenced).toBe(true);
    const html = headline({});
    expect(html).toContain("Mostly typed figures without a source.");
    // Once above the three scenario cards, not on each of them.
    expect(html.split('data-testid="unevidenced-warning"')).toHaveLength(2);
    expect(html).toContain(none!.unevidencedFigures[0]);

    // A source for every typed figure of the case, its axes and their machines.
    const subjects: [EvidenceSubject, number][] = [["case", target.id]];
    for (const a of listCaseAxes(engineer(), target.id)) {
      subjects.push(["axis", a.axisId]);
      if (!subjects.some(([s, id]) => s === "machine" && id === a.machineId))
        subjects.push(["machine", a.machineId]);
    }
    for (const [subjectType, subjectId] of subjects)
      for (const field of Object.keys(EVIDENCE_FIELDS[subjectType]))
        saveEvidence(engineer(), { ...valid, subjectType, subjectId, field });

    const entries = listCaseEvidence(engineer(), target.id);
    expect(entries.length).toBeGreaterThan(0);
    expect(entries[0]).toMatchObject({
      note: valid.note,
      givenBy: valid.givenBy,
      givenOn: valid.givenOn,
    });
    const all = evidencedReliance(physics, result, input, indexEvidence(entries), target.id)!;
    expect(all.unevidenced).toBe("0");
    expect(all.unevidencedFigures).toEqual([]);
    expect(all.evidencedPct).toBe(all.typedPct);
    expect(headline(indexEvidence(entries))).not.toContain("without a source");

    // Recorded again, the one row per figure is replaced, not repeated.
    saveEvidence(engineer(), {
      ...valid,
      note: "Shift reports, weeks 1–12",
      subjectType: "axis",
      subjectId: caseAxis.axisId,
      field: "stepLossEventsPerYear",
    });
    const again = listCaseEvidence(engineer(), target.id);
    expect(again).toHaveLength(entries.length);
    expect(
      again.find(
        (e) =>
          e.subjectType === "axis" &&
          e.subjectId === caseAxis.axisId &&
          e.field === "stepLossEventsPerYear",
      )!.note,
    ).toBe("Shift reports, weeks 1–12");

    const audit = listAudit(caller("admin@example.com")).filter(
      (a) => a.action === "evidence.save",
    );
    expect(audit.length).toBe(entries.length + 1);
    expect(audit[0]).toMatchObject({ actorEmail: "engineer@example.com", targetType: "axis" });

    // The proposal page reads the sources of the subjects its frozen input names.
    const frozenInput = db
      .select()
      .from(proposals)
      .all()
      .find((p) => p.caseId === target.id)!.input;
    const ids = (list: { id: string }[]) => list.map((x) => Number(x.id));
    const forProposal = listProposalEvidence(engineer(), target.id, {
      axisIds: ids(frozenInput.axes),
      machineIds: ids(frozenInput.machines),
    });
    expect(forProposal.length).toBe(again.length);

    // Another tenant reads none of it, and frozen proposals are as they were.
    expect(() => listCaseEvidence(otherEngineer(), target.id)).toThrow("No such case");
    expect(frozenRows()).toEqual(before);
  });

  it("the customer's reviewer reads the sources of a proposal sent to them, and of no other", () => {
    const all = db.select().from(proposals).all();
    const visible = (id: number) => {
      try {
        getVisibleQuoteOrThrow(reviewer(), id);
        return true;
      } catch {
        return false;
      }
    };
    const theirs = all.find((p) => visible(p.id))!;
    const notTheirs = all.find((p) => !visible(p.id))!;
    expect(theirs, "the demo reviewer has a proposal").toBeDefined();
    const subjects = frozenSubjects(theirs.input);
    saveEvidence(engineer(), {
      subjectType: "axis",
      subjectId: subjects.axisIds[0]!,
      field: "stepLossEventsPerYear",
      note: "Maintenance log, last twelve months",
      givenOn: "2026-11-20",
      givenBy: "Line supervisor",
    });
    const read = listReviewedProposalEvidence(reviewer(), theirs.id, subjects);
    expect(read).toEqual(listProposalEvidence(engineer(), theirs.caseId, subjects));
    expect(read.map((e) => e.note)).toContain("Maintenance log, last twelve months");
    expect(() =>
      listReviewedProposalEvidence(reviewer(), notTheirs.id, frozenSubjects(notTheirs.input)),
    ).toThrow();
  });
});
