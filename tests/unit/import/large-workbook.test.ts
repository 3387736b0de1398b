import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { ImportFileError } from "@/lib/import/errors";
import { MAX_DATA_ROWS, readWorkbook } from "@/lib/import/read";

// Issue 13, finding 4: a workbook that unpacks large is refused at the row cap while it streams,
// instead of being parsed in full first, and the event loop keeps serving others meanwhile.
async function bigWorkbook(rows: number): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  const sheet = workbook.addWorksheet("Axes");
  sheet.addRow(["Machine", "Axis label", "Holding torque [N·m]", "Note"]);
  const note = "x".repeat(200);
  for (let i = 0; i < rows; i++) sheet.addRow([`M${i % 50}`, `Axis ${i}`, 1.26, `${note}${i}`]);
  return Buffer.from((await workbook.xlsx.writeBuffer()) as ArrayBuffer);
}

describe("a workbook far over the row cap", () => {
  it("is refused quickly at the cap, with bounded memory, while timers keep running", async () => {
    const bytes = await bigWorkbook(5 * MAX_DATA_ROWS);
    global.gc?.();
    const rssBefore = process.memoryUsage().rss;
    let peakRss = rssBefore;
    let ticks = 0;
    // Stands in for another request: it needs the event loop every 20 ms.
    const timer = setInterval(() => {
      ticks++;
      peakRss = Math.max(peakRss, process.memoryUsage().rss);
    }, 20);
    const started = performance.now();
    const error = await readWorkbook(bytes, "huge.xlsx").then(
      () => null,
      (e: unknown) => e,
    );
    const elapsed = performance.now() - started;
    clearInterval(timer);
    expect(error).toBeInstanceOf(ImportFileError);
    expect((error as ImportFileError).message).toBe(
      'Sheet "Axes" of "huge.xlsx" has more than 20,000 rows; the limit is 20,000 — split the file',
    );
    // Loose bounds on a shared 2-core machine: a full load of this file takes several times as
    // long and holds every row (100,000 × 4 cells) at once.
    expect(elapsed).toBeLessThan(15_000);
    expect(peakRss - rssBefore).toBeLessThan(400 * 1024 * 1024);
    // The read yields between chunks, so the interval ran while it went on.
    expect(ticks).toBeGreaterThan(0);
  }, 120_000);
});
