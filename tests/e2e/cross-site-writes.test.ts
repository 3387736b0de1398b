import Database from "better-sqlite3";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { z } from "zod";
import { launchBrowser, signInWithForm } from "./support/browser";
import { baseUrl, request, signInOverHttp, type CookieJar } from "./support/http";

// A page on another site makes the victim's browser send a write with the victim's session
// cookie (CSRF). Every /api/v1 write must refuse it, whatever the handler, and change nothing;
// the same write from our own pages still works.
const database = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
const count = (sql: string, ...args: unknown[]) =>
  (database.prepare(sql).get(...args) as { n: number }).n;

const EVIL = "https://attacker.example";
const refusalSchema = z.object({ error: z.string() });
const proposalsSchema = z.object({ proposals: z.array(z.object({ id: z.number().int() })) });
const checkoutSchema = z.object({ url: z.string().url(), sessionId: z.string() });

let engineer: CookieJar;
let manager: CookieJar;
let proposalId: number;

const comments = () =>
  count("select count(*) as n from proposal_comments where proposal_id = ?", proposalId);

// What the victim's browser sends: their cookie, the forging page's headers, a JSON body.
const send = (jar: CookieJar, method: string, path: string, headers: Record<string, string>) =>
  fetch(`${baseUrl()}${path}`, {
    method,
    redirect: "manual",
    headers: { cookie: jar.header(), "content-type": "application/json", ...headers },
    body: JSON.stringify({ body: "forged comment" }),
  });

beforeAll(async () => {
  [engineer, manager] = await Promise.all(
    ["engineer", "manager"].map(async (who) => {
      const { jar, error } = await signInOverHttp(`${who}@example.com`, "loopshift-demo");
      expect(error).toBeNull();
      return jar;
    }),
  );
  const res = await request(engineer, "/api/v1/proposals");
  expect(res.status).toBe(200);
  proposalId = proposalsSchema.parse(await res.json()).proposals[0]!.id;
});

afterAll(() => database.close());

describe("a write forged from another site with the victim's cookie", () => {
  it.each([
    ["a foreign Origin", { origin: EVIL }],
    ["the null Origin of a sandboxed frame", { origin: "null" }],
    ["our host on another port", { origin: "http://localhost:1" }],
    ["no Origin and Sec-Fetch-Site cross-site", { "sec-fetch-site": "cross-site" }],
    ["no Origin and Sec-Fetch-Site same-site", { "sec-fetch-site": "same-site" }],
    ["neither Origin nor Sec-Fetch-Site", {}],
    [
      "a foreign Origin despite Sec-Fetch-Site same-origin",
      { origin: EVIL, "sec-fetch-site": "same-origin" },
    ],
  ])("is refused with 403 and writes nothing: %s", async (_, headers) => {
    const before = comments();
    const res = await send(engineer, "POST", `/api/v1/proposals/${proposalId}/comments`, headers);
    expect(res.status).toBe(403);
    refusalSchema.parse(await res.json());
    expect(comments()).toBe(before);
  });

  it("is refused for PUT, PATCH and a checkout too, before the handler reads anything", async () => {
    const quote = () =>
      database.prepare("select * from quotes where proposal_id = ?").get(proposalId);
    const quoteBefore = quote();
    const patch = await fetch(`${baseUrl()}/api/v1/proposals/${proposalId}`, {
      method: "PATCH",
      headers: { cookie: manager.header(), origin: EVIL, "content-type": "application/json" },
      body: JSON.stringify({ stage: "declined" }),
    });
    expect(patch.status).toBe(403);
    expect(quote()).toEqual(quoteBefore);

    const axis = database.prepare("select * from axes order by id limit 1").get() as { id: number };
    const put = await fetch(`${baseUrl()}/api/v1/axes/${axis.id}`, {
      method: "PUT",
      headers: { cookie: engineer.header(), origin: EVIL, "content-type": "application/json" },
      body: "{}",
    });
    expect(put.status).toBe(403);
    expect(database.prepare("select * from axes where id = ?").get(axis.id)).toEqual(axis);

    const sessions = () => count("select count(*) as n from checkout_sessions");
    const before = sessions();
    const checkout = await fetch(`${baseUrl()}/api/v1/payments/checkout`, {
      method: "POST",
      headers: { cookie: engineer.header(), origin: EVIL, "content-type": "application/json" },
      body: JSON.stringify({ proposalId }),
    });
    expect(checkout.status).toBe(403);
    expect(sessions()).toBe(before);
  });
});

describe("the same write from our own pages", () => {
  it("works with our Origin", async () => {
    const before = comments();
    const res = await send(engineer, "POST", `/api/v1/proposals/${proposalId}/comments`, {
      origin: new URL(baseUrl()).origin,
    });
    expect(res.status).toBe(201);
    expect(comments()).toBe(before + 1);
  });

  it.each([["same-origin"], ["none"]])(
    "works without Origin when Sec-Fetch-Site is %s",
    async (site) => {
      const before = comments();
      const res = await send(engineer, "POST", `/api/v1/proposals/${proposalId}/comments`, {
        "sec-fetch-site": site,
      });
      expect(res.status).toBe(201);
      expect(comments()).toBe(before + 1);
    },
  );

  it("reads are not affected: a GET with a foreign Origin still answers", async () => {
    const res = await fetch(`${baseUrl()}/api/v1/proposals/${proposalId}/comments`, {
      headers: { cookie: engineer.header(), origin: EVIL },
    });
    expect(res.status).toBe(200);
  });

  it("the signed webhook, which carries no cookie, still reaches its signature check", async () => {
    const res = await fetch(`${baseUrl()}/api/webhooks/stripe`, {
      method: "POST",
      headers: { origin: EVIL, "content-type": "application/json", "stripe-signature": "t=1,v1=0" },
      body: "{}",
    });
    // 400 is the handler's own answer to a bad signature: the origin check did not stop it.
    expect(res.status).toBe(400);
  });
});

describe("the checkout's cancel page", () => {
  it("changes nothing when loaded (a link from anywhere leads there); its button closes the checkout", async () => {
    const created = await request(engineer, "/api/v1/payments/checkout", {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ proposalId }),
    });
    expect(created.status).toBe(201);
    const { sessionId } = checkoutSchema.parse(await created.json());
    const status = () =>
      (
        database.prepare("select status from checkout_sessions where id = ?").get(sessionId) as {
          status: string;
        }
      ).status;

    // A top-level navigation from another site, as a link or an <img> would make it.
    const page = await fetch(`${baseUrl()}/dossiers/${proposalId}/cancelled`, {
      headers: { cookie: engineer.header(), "sec-fetch-site": "cross-site", referer: EVIL },
      redirect: "manual",
    });
    expect(page.status).toBe(200);
    expect(await page.text()).toContain("Close the checkout");
    expect(status()).toBe("open");

    const browser = await launchBrowser();
    try {
      const context = await browser.newContext();
      const tab = await context.newPage();
      await signInWithForm(tab, "engineer@example.com");
      await tab.waitForURL(/\/accounts/);
      await tab.goto(`${baseUrl()}/dossiers/${proposalId}/cancelled`);
      expect(status()).toBe("open");
      await tab.getByRole("button", { name: "Close the checkout" }).click();
      await expect.poll(status, { timeout: 15_000 }).toBe("expired");
      await tab.getByRole("button", { name: "Close the checkout" }).waitFor({ state: "detached" });
    } finally {
      await browser.close();
    }
  });
});
