import fs from "node:fs";
import net from "node:net";
import os from "node:os";
import path from "node:path";
import Database from "better-sqlite3";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { prepareDatabase, spawnNext } from "../../lib/cli/app-server";
import { prepareRuntimeEnv } from "../../lib/cli/runtime-env";
import { csvField, parseCsv } from "../../lib/import/csv";
import { templateCsv } from "../../lib/import/template";
import { request, signInOverHttp } from "./support/http";

// The server dies (kill -9: no handler, no cleanup) while it commits a 10,000-row import. The
// import is all or nothing (README: "all-or-nothing commit"), so whatever instant it dies at,
// the file must hold none of the rows or all of them, and SQLite must find it intact.
// Each run gets its own server over its own copy of a seeded database: the shared e2e server
// must not be killed.
const ROWS = 10_000;
const LABEL = "Killed import axis";

const dir = fs.mkdtempSync(path.join(os.tmpdir(), "loopshift-kill-"));
const seeded = path.join(dir, "seeded.db");

function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.listen(0, "127.0.0.1", () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
    srv.on("error", reject);
  });
}

// The template's example row, ROWS times, with machine and label varied (as the benchmark does).
function bigCsv(): string {
  const [headers, example] = parseCsv(templateCsv().replace(/^\uFEFF/, ""));
  const lines = [headers!.map((h) => csvField(h)).join(",")];
  for (let i = 0; i < ROWS; i++) {
    lines.push(
      headers!
        .map((h, k) =>
          csvField(
            h.startsWith("Machine")
              ? `Kill machine ${i % 40}`
              : h.startsWith("Axis label")
                ? `${LABEL} ${i}`
                : example![k]!,
          ),
        )
        .join(","),
    );
  }
  return `${lines.join("\r\n")}\r\n`;
}

async function startServer(databasePath: string) {
  const port = await freePort();
  const env = prepareRuntimeEnv({
    ...process.env,
    PORT: String(port),
    DATABASE_PATH: databasePath,
    NEXTAUTH_URL: `http://localhost:${port}`,
    // The import sends no mail and takes no payment: nothing needs to answer on these.
    SMTP_URL: "smtp://127.0.0.1:9",
    STRIPE_FAKE: "off",
  });
  const child = spawnNext(env, "start", "pipe");
  const exited = new Promise<void>((resolve) => child.once("exit", () => resolve()));
  const base = env.NEXTAUTH_URL!;
  const until = Date.now() + 60_000;
  for (;;) {
    try {
      if ((await fetch(`${base}/sign-in`, { redirect: "manual" })).status < 500) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > until) {
      child.kill("SIGKILL");
      throw new Error(`the app did not answer at ${base}`);
    }
    await new Promise((r) => setTimeout(r, 200));
  }
  return { base, child, exited };
}

const walSize = (db: string) => {
  try {
    return fs.statSync(`${db}-wal`).size;
  } catch {
    return 0;
  }
};

let csv: string;
const outcomes: string[] = [];
let siteId: number;

beforeAll(() => {
  prepareDatabase(seeded);
  const db = new Database(seeded);
  // Fold the seed's WAL into the file so each copy is the whole database.
  db.pragma("wal_checkpoint(TRUNCATE)");
  siteId = (db.prepare("select id from sites order by id limit 1").get() as { id: number }).id;
  db.close();
  csv = bigCsv();
});

afterAll(() => fs.rmSync(dir, { recursive: true, force: true }));

describe("kill -9 of the server while it commits a 10,000-row import", () => {
  // Extra wait after the commit is seen starting to write. Here the commit of 10,000 rows takes
  // under 10 ms once it spills, so the early kills land inside the transaction and the later
  // ones between COMMIT and the answer: both ends of "none or all".
  it.each([0, 2, 5, 10, 25])(
    "leaves none or all of the rows and a database that passes integrity_check (kill %i ms into the commit)",
    async (delayMs) => {
      const file = path.join(dir, `run-${delayMs}.db`);
      fs.copyFileSync(seeded, file);
      const server = await startServer(file);
      let outcome = "";
      try {
        const { jar, error } = await signInOverHttp(
          "manager@example.com",
          "loopshift-demo",
          server.base,
        );
        expect(error).toBeNull();
        const form = new FormData();
        form.set("file", new File([csv], "kill.csv", { type: "text/csv" }));
        const baseline = walSize(file);
        const upload = request(
          jar,
          `/api/v1/sites/${siteId}/imports`,
          { method: "POST", body: form },
          server.base,
        ).then(
          (res) => `answered ${res.status}`,
          () => "connection dropped",
        );
        // Reading and validating 10,000 rows writes nothing; the commit's transaction spills
        // pages into the WAL as it inserts. Its growth marks the commit under way.
        const until = Date.now() + 60_000;
        let answered: string | null = null;
        void upload.then((o) => (answered = o));
        while (walSize(file) <= baseline && answered === null && Date.now() < until) {
          await new Promise((r) => setTimeout(r, 2));
        }
        if (delayMs) await new Promise((r) => setTimeout(r, delayMs));
        server.child.kill("SIGKILL");
        await server.exited;
        outcome = await upload;
        outcomes.push(outcome);
      } finally {
        server.child.kill("SIGKILL");
      }

      const db = new Database(file);
      try {
        const imported = (
          db.prepare("select count(*) as n from axes where label like ?").get(`${LABEL} %`) as {
            n: number;
          }
        ).n;
        const history = (
          db.prepare("select count(*) as n from imports where file_name = 'kill.csv'").get() as {
            n: number;
          }
        ).n;
        console.log(`kill ${delayMs} ms into the commit: ${outcome}, ${imported} rows`);
        expect([0, ROWS]).toContain(imported);
        // The history row is in the same transaction as the rows.
        expect(history).toBe(imported === ROWS ? 1 : 0);
        expect(db.pragma("integrity_check", { simple: true })).toBe("ok");
        expect(db.pragma("foreign_key_check")).toEqual([]);
      } finally {
        db.close();
      }
    },
    120_000,
  );

  it("killed at least one run before it answered (else the runs above tested a finished import)", () => {
    expect(outcomes).toContain("connection dropped");
  });
});
