import "../support/node-async-storage";
import { describe, expect, it } from "vitest";
import { POST as importRoute } from "@/app/api/v1/sites/[siteId]/imports/route";
import { listAxesForExport } from "@/db/queries/axes";
import { listSites } from "@/db/queries/sites";
import { checkImportFileInWorker, PARSE_LIMITS } from "@/server/import/check-in-worker";
import { ImportFileError } from "@/lib/import/errors";
import { templateCsv } from "@/lib/import/template";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";

// Issue 13, finding 4: uploads are read in worker threads (server/import/check-in-worker.ts), a
// bounded number at a time, and the route answers exactly as it did when it read them itself.
const engineer = () => caller("engineer@example.com");
const site = { hoursPerYear: 4000, ambientC: 25 };

describe("uploads read in a worker thread", () => {
  it("imports the template through the route: rows validated in the worker, committed here", async () => {
    const own = listSites(engineer())[0]!;
    const before = listAxesForExport(engineer(), own.id, 0, 100_000).axes.length;
    const form = new FormData();
    form.set("file", new File([templateCsv()], "template.csv", { type: "text/csv" }));
    const res = await asRequestOf(engineer(), () =>
      importRoute(new Request("http://localhost/x", { method: "POST", body: form }), {
        params: Promise.resolve({ siteId: String(own.id) }),
      }),
    );
    const body = (await res.json()) as { imported: number; rowsValid: number; errors: unknown[] };
    expect(res.status).toBe(200);
    expect(body.errors).toEqual([]);
    expect(body.imported).toBe(body.rowsValid);
    expect(body.imported).toBeGreaterThan(0);
    expect(listAxesForExport(engineer(), own.id, 0, 100_000).axes.length).toBe(
      before + body.imported,
    );
  });

  it("hands back the reader's refusal with its status and message", async () => {
    const error = await checkImportFileInWorker(
      new TextEncoder().encode('a,b\n1,"2\n'),
      "open-quote.csv",
      { site },
    ).then(
      () => null,
      (e: unknown) => e,
    );
    expect(error).toBeInstanceOf(ImportFileError);
    expect((error as ImportFileError).status).toBe(422);
    expect((error as ImportFileError).message).toMatch(/^row 2 of "open-quote\.csv" opens a quote/);
  });

  it("reads a bounded number of files at once, queues a few and turns the rest away with 503", async () => {
    const capacity = PARSE_LIMITS.workers + PARSE_LIMITS.waiting;
    const outcomes = await Promise.all(
      Array.from({ length: capacity + 2 }, (_, i) =>
        checkImportFileInWorker(new TextEncoder().encode(templateCsv()), `file-${i}.csv`, {
          site,
        }).then(
          (checked) => (checked.result.errors.length === 0 ? "read" : "errors"),
          (e: unknown) => (e instanceof ImportFileError ? `${e.status} ${e.message}` : String(e)),
        ),
      ),
    );
    expect(outcomes.filter((o) => o === "read")).toHaveLength(capacity);
    expect(outcomes.slice(capacity)).toEqual(
      [capacity, capacity + 1].map(
        (i) =>
          `503 "file-${i}.csv" was not read: the server is already reading ${capacity} uploads; try again in a minute`,
      ),
    );
  });
});
