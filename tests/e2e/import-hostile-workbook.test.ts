import http from "node:http";
import Database from "better-sqlite3";
import { afterAll, describe, expect, inject, it } from "vitest";
import { hostileWorkbook } from "../../lib/cli/hostile-workbook";
import { templateCsv } from "../../lib/import/template";
import { baseUrl, request, signInOverHttp, type CookieJar } from "./support/http";

// Issue 13, finding 4: an 8.9 MB workbook that unpacks to 195 MB (lib/cli/hostile-workbook.ts)
// once stalled the server. Three of them uploaded at once must each be refused with a message
// that says why, write nothing, and leave the server answering everyone else meanwhile: the
// files are read in worker threads, capped while they stream.
const database = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
afterAll(() => database.close());

const count = (table: string) =>
  (database.prepare(`select count(*) as n from ${table}`).get() as { n: number }).n;

/**
 * Posts a multipart upload over a raw HTTP request, so that the test knows when the whole body
 * has been handed to the socket (`sent`) apart from when the answer comes (`answered`).
 */
async function upload(jar: CookieJar, path: string, file: File) {
  const form = new FormData();
  form.set("file", file);
  const encoded = new Request("http://localhost/", { method: "POST", body: form });
  const body = Buffer.from(await encoded.arrayBuffer());
  const url = new URL(path, baseUrl());
  let markSent!: () => void;
  const sent = new Promise<void>((resolve) => (markSent = resolve));
  const answered = new Promise<{ status: number; body: { error?: string } }>((resolve, reject) => {
    const req = http.request(
      url,
      {
        method: "POST",
        headers: {
          cookie: jar.header(),
          origin: url.origin,
          "content-type": encoded.headers.get("content-type")!,
          "content-length": String(body.length),
        },
      },
      (res) => {
        const chunks: Buffer[] = [];
        res.on("data", (c: Buffer) => chunks.push(c));
        res.on("end", () =>
          resolve({
            status: res.statusCode!,
            body: JSON.parse(Buffer.concat(chunks).toString("utf8")),
          }),
        );
      },
    );
    req.on("error", reject);
    req.end(body, markSent);
  });
  return { sent, answered };
}

describe("three hostile workbooks uploaded at once", () => {
  it("are each refused with a clear message, write nothing, and another user is answered meanwhile", async () => {
    // Made before any connection is open: the seconds it blocks this thread would outlast the
    // server's keep-alive, and a request on a socket the server has closed fails.
    const bytes = hostileWorkbook();
    const { jar: uploader, error } = await signInOverHttp("manager@example.com", "loopshift-demo");
    expect(error).toBeNull();
    const { jar: other } = await signInOverHttp("engineer@example.com", "loopshift-demo");
    const siteId = (
      database.prepare("select id from sites order by id limit 1").get() as { id: number }
    ).id;
    const before = { axes: count("axes"), machines: count("machines"), imports: count("imports") };

    expect(bytes.length).toBeLessThan(10 * 1024 * 1024); // under the upload limit: it is read
    const order: string[] = [];
    const uploads = await Promise.all(
      [1, 2, 3].map((n) =>
        upload(
          uploader,
          `/api/v1/sites/${siteId}/imports`,
          new File([new Uint8Array(bytes)], `hostile-${n}.xlsx`),
        ),
      ),
    );
    const answers = uploads.map((u, i) =>
      u.answered.then((answer) => {
        order.push(`upload ${i + 1}`);
        return answer;
      }),
    );
    // Every byte of the three files is on its way before the other user asks for anything.
    await Promise.all(uploads.map((u) => u.sent));
    const sites = await request(other, "/api/v1/sites");
    order.push("other user");
    expect(sites.status).toBe(200);
    expect(((await sites.json()) as { sites: unknown[] }).sites.length).toBeGreaterThan(0);

    const results = await Promise.all(answers);
    // The other user's request was answered while all three files were still being read.
    expect(order[0]).toBe("other user");
    expect(order).toHaveLength(4);
    results.forEach((result, i) => {
      expect(result.status).toBe(422);
      expect(result.body.error).toBe(
        `Sheet "Axes" of "hostile-${i + 1}.xlsx" has more than 20,000 rows; the limit is 20,000 — split the file`,
      );
    });
    expect({ axes: count("axes"), machines: count("machines"), imports: count("imports") }).toEqual(
      before,
    );

    // The workers are free again: an ordinary file is read as before.
    const form = new FormData();
    form.set("file", new File([templateCsv()], "template.csv"));
    form.set("dryRun", "true");
    const dryRun = await request(uploader, `/api/v1/sites/${siteId}/imports`, {
      method: "POST",
      body: form,
    });
    expect(dryRun.status).toBe(200);
    expect((await dryRun.json()) as { errors: unknown[] }).toMatchObject({ errors: [] });
  }, 180_000);
});
