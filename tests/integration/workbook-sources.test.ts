// First: Next.js reads the request scope's storage from globalThis when its modules load.
import "../support/node-async-storage";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { GET as caseWorkbookGet } from "@/app/api/v1/cases/[caseId]/workbook/route";
import { GET as proposalWorkbookGet } from "@/app/api/v1/proposals/[proposalId]/workbook/route";
import { GET as dossierGet } from "@/app/api/v1/proposals/[proposalId]/dossier/route";
import { recordCheckoutSession } from "@/db/queries/payments";
import { recordPaymentEvent } from "@/server/payments/record-event";
import { buildCaseInput, listCases } from "@/db/queries/cases";
import { listCaseEvidence, listReviewedProposalEvidence } from "@/db/queries/evidence";
import { getProposalSnapshotOrThrow } from "@/db/queries/proposals";
import { listProposals } from "@/db/queries/proposal-versions";
import { caseInputSchema, evaluateCase } from "@/lib/engine";
import { frozenSubjects, indexEvidence } from "@/lib/evidence/subjects";
import { SOURCES_SHEET } from "@/lib/glossary";
import { typedValueFigures } from "@/lib/results/value-reliance";
import { caller } from "../support/callers";
import { recalculateWithLibreOffice } from "../support/libreoffice";
import { asRequestOf } from "../support/next-request";

// Issue 16: the workbook a finance reviewer works from lists every typed figure the value rests
// on beside its recorded source, as the screens do: the vendor's case workbook through the case,
// the reviewer's proposal workbook through the proposal sent to them. The demo records sources
// for the cartoner case and none for the labellers (db/demo/evidence.ts).
const engineer = () => caller("engineer@example.com");
const reviewer = () => caller("reviewer@example.com");
const caseNamed = (name: string) => listCases(engineer()).find((c) => c.name === name)!;
const params = <K extends string>(key: K, value: number) => ({
  params: Promise.resolve({ [key]: String(value) } as Record<K, string>),
});
const get = () => new Request("http://localhost/x");

/**
 * The Sources sheet's rows as LibreOffice Calc saves the file again (tests/support/libreoffice.ts):
 * the sheet the streaming writer wrote opens in a spreadsheet program and keeps its rows.
 */
async function sourcesSheet(res: Response, last = true) {
  expect(res.status).toBe(200);
  const workbook = new ExcelJS.Workbook();
  await workbook.xlsx.load(
    recalculateWithLibreOffice(Buffer.from(await res.arrayBuffer())) as never,
  );
  const names = workbook.worksheets.map((s) => s.name);
  // After Cautions: last in a proposal workbook, before the dossier's own sheets in a dossier.
  expect(names[names.indexOf("Cautions") + 1]).toBe(SOURCES_SHEET);
  if (last) expect(names.at(-1)).toBe(SOURCES_SHEET);
  const sheet = workbook.getWorksheet(SOURCES_SHEET)!;
  const rows: string[][] = [];
  sheet.eachRow((row) => rows.push((row.values as unknown[]).slice(1).map((v) => String(v ?? ""))));
  return rows;
}

describe("the Sources sheet of the workbooks", () => {
  it("the vendor's case workbook: every typed figure, most value first, with its recorded source", async () => {
    const target = caseNamed("North hall cartoners, phase 1");
    const input = caseInputSchema.parse(buildCaseInput(engineer(), target.id));
    const figures = typedValueFigures(evaluateCase(input), input, target.id);
    const index = indexEvidence(listCaseEvidence(engineer(), target.id));
    const sourced = figures.filter((f) => index[f.key]);
    expect(sourced.length).toBeGreaterThan(0);
    expect(sourced.length).toBeLessThan(figures.length);

    const rows = await sourcesSheet(
      await asRequestOf(engineer(), () => caseWorkbookGet(get(), params("caseId", target.id))),
    );
    expect(rows[1][0]).toBe(
      `${figures.length - sourced.length} of ${figures.length} typed figures the value rests on have no recorded source.`,
    );
    const body = rows.slice(3);
    expect(body).toHaveLength(figures.length);
    figures.forEach((f, i) => {
      const entry = index[f.key];
      expect(body[i][0].toLowerCase()).toBe(f.words.toLowerCase());
      expect(Number(body[i][1])).toBeCloseTo(Number(f.valuePerYear), 6);
      expect(body[i].slice(2)).toEqual(
        entry ? [entry.note, entry.givenBy, entry.givenOn] : ["No source recorded"],
      );
    });
  });

  it("the reviewer's proposal workbook: the frozen figures, none of them sourced for the labellers", async () => {
    const target = caseNamed("North hall labellers");
    const proposal = listProposals(engineer(), target.id).at(-1)!;
    const { input: frozen, result } = getProposalSnapshotOrThrow(reviewer(), proposal.id);
    const input = caseInputSchema.parse(frozen);
    const figures = typedValueFigures(result, input, target.id);
    expect(
      listReviewedProposalEvidence(reviewer(), proposal.id, frozenSubjects(input)),
    ).toHaveLength(0);

    const rows = await sourcesSheet(
      await asRequestOf(reviewer(), () =>
        proposalWorkbookGet(get(), params("proposalId", proposal.id)),
      ),
    );
    expect(rows[1][0]).toBe(
      `${figures.length} of ${figures.length} typed figures the value rests on have no recorded source.`,
    );
    expect(rows.slice(3).every((r) => r[2] === "No source recorded")).toBe(true);
  });

  it("the paid dossier's workbook carries the same sheet, for the reviewer too", async () => {
    const target = caseNamed("North hall cartoners, phase 1");
    const proposal = listProposals(engineer(), target.id).at(-1)!;
    recordCheckoutSession(engineer(), proposal.id, {
      id: "cs_test_workbook_sources",
      amountMinor: 49000,
      amount: "490.00",
      currency: "EUR",
    });
    const paid = recordPaymentEvent({
      id: "evt_workbook_sources",
      type: "checkout.session.completed",
      session: {
        id: "cs_test_workbook_sources",
        paymentStatus: "paid",
        amountTotal: 49000,
        currency: "eur",
      },
    });
    expect(paid.outcome).toBe("granted");
    const { input: frozen, result } = getProposalSnapshotOrThrow(reviewer(), proposal.id);
    const input = caseInputSchema.parse(frozen);
    const figures = typedValueFigures(result, input, target.id);
    const index = indexEvidence(
      listReviewedProposalEvidence(reviewer(), proposal.id, frozenSubjects(input)),
    );
    const rows = await sourcesSheet(
      await asRequestOf(reviewer(), () => dossierGet(get(), params("proposalId", proposal.id))),
      false,
    );
    const body = rows.slice(3);
    expect(body).toHaveLength(figures.length);
    expect(body.filter((r) => r[2] !== "No source recorded")).toHaveLength(
      figures.filter((f) => index[f.key]).length,
    );
  });
});
