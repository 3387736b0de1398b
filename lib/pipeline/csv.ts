import type { QuoteStage } from "./stages";
import { STAGE_LABELS } from "./stages";
import type { VendorRevenue } from "./revenue";

/** One field quoted as RFC 4180 asks: in double quotes when it holds a comma, quote or line break. */
export function csvField(value: string): string {
  return /[",\r\n]/.test(value) ? `"${value.replaceAll('"', '""')}"` : value;
}

type CsvQuote = {
  caseName: string;
  version: number;
  accountName: string;
  siteName: string;
  ownerName: string;
  stage: QuoteStage;
  currency: string;
  revenueParts: VendorRevenue;
  vendorRevenue: string;
  value: string;
  probabilityPct: number;
  weighted: string;
  expectedCloseOn: string;
  paybackYears: number | null;
  decidedAt: string | null;
};

export const PIPELINE_CSV_HEADER = [
  "Proposal",
  "Version",
  "Account",
  "Site",
  "Owner",
  "Stage",
  "Currency",
  "Kits at list price",
  "Discounts",
  "Installation",
  "Commissioning",
  "Vendor revenue",
  "Customer investment",
  "Chance (%)",
  "Weighted revenue",
  "Expected close",
  "Payback (years)",
  "Decided on",
];

/**
 * The filtered quotes as CSV (RFC 4180: CRLF line ends, a header row). Money stays the exact
 * plain decimal string, so a spreadsheet sums exactly what the pipeline page sums. The vendor's
 * revenue comes with its parts (kits at list price − discounts + installation + commissioning),
 * so finance can rebuild it; the customer's investment is beside it (lib/pipeline/revenue.ts).
 */
export function pipelineCsv(quotes: CsvQuote[]): string {
  const rows = quotes.map((q) => [
    q.caseName,
    String(q.version),
    q.accountName,
    q.siteName,
    q.ownerName,
    STAGE_LABELS[q.stage],
    q.currency,
    q.revenueParts.kitsAtListPrice,
    q.revenueParts.discounts,
    q.revenueParts.installation,
    q.revenueParts.commissioning,
    q.vendorRevenue,
    q.value,
    String(q.probabilityPct),
    q.weighted,
    q.expectedCloseOn,
    q.paybackYears === null ? "" : String(q.paybackYears),
    q.decidedAt ? q.decidedAt.slice(0, 10) : "",
  ]);
  return [PIPELINE_CSV_HEADER, ...rows].map((r) => r.map(csvField).join(",")).join("\r\n") + "\r\n";
}
