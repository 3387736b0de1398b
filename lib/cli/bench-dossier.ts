// Issue 7's target: the dossier of a 500-axis case — the engine's dossier (1,000 seeded draws,
// sensitivity at three swings, the tariff × hours table, per-axis curves) and its workbook with
// one sheet per axis — built in under 10 s.
async function main() {
  const { inventedFleet } = await import("./invented-fleet");
  const { caseInputSchema } = await import("../../lib/engine");
  const { buildDossier } = await import("../../lib/dossier");
  const { buildDossierWorkbook } = await import("../../lib/workbook");
  const { DEFAULT_RANGES } = await import("../../lib/validations/dossier");

  const input = caseInputSchema.parse(inventedFleet(500, 40));
  const start = performance.now();
  const dossier = buildDossier(input, { seed: 20240611, ...DEFAULT_RANGES });
  const computed = performance.now();
  const file = await buildDossierWorkbook(input, dossier, {
    title: "Bench dossier",
    accountName: "Invented",
    siteName: "Invented",
    caseName: "500 axes",
    version: 1,
    engineVersion: dossier.result.engineVersion,
    generatedAt: new Date().toISOString(),
  });
  const done = performance.now();
  const total = done - start;
  const met = total < 10_000;
  console.log(
    `dossier of a 500-axis case: ${total.toFixed(0)} ms (engine ${(computed - start).toFixed(0)} ms, workbook ${(done - computed).toFixed(0)} ms, ${(file.length / 1024 / 1024).toFixed(2)} MB, ${dossier.uncertainty.draws.length} draws), process peak ${(process.resourceUsage().maxRSS / 1024).toFixed(0)} MB — target 10000 ms`,
  );
  console.log(`dossier target: ${met ? "met" : "NOT met"}`);
  process.exitCode = met ? 0 : 1;
}

void main();
