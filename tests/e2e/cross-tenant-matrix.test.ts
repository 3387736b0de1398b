import fs from "node:fs";
import path from "node:path";
import Database from "better-sqlite3";
import { beforeAll, describe, expect, inject, it } from "vitest";
import { request, signInOverHttp, type CookieJar } from "./support/http";

// What an attacker signed in to another customer's account tries: every route handler under
// app/api/v1 and every server action, called with the ids of an account that is not theirs.
// The routes and actions are discovered from the source tree at test time; one without an entry
// in the tables below fails the suite, so a new route or action cannot ship without its probe.
//
// The other tenant is the seeded Pipetteworks account (engineer2's): its site, machine, axis,
// case and proposal. engineer@example.com owns the other two accounts; reviewer@example.com
// reviews Cartonia's proposals only. "Not yours" must answer exactly what "does not exist"
// answers (README: any id outside the caller's scope is 404), and write nothing.
const database = new Database(inject("databasePath"), { readonly: true, fileMustExist: true });
// Bumped whenever another connection (the server) commits to the file: the cheapest proof that
// a refused call wrote nothing at all, in any table.
const dataVersion = () => database.pragma("data_version", { simple: true }) as number;

interface Ids {
  account: number;
  site: number;
  machine: number;
  axis: number;
  case: number;
  proposal: number;
}
const MISSING: Ids = {
  account: 999_999,
  site: 999_999,
  machine: 999_999,
  axis: 999_999,
  case: 999_999,
  proposal: 999_999,
};
let foreign: Ids;

type Caller = "engineer" | "reviewer" | "manager" | "admin" | "anonymous";
const jars = new Map<Caller, CookieJar | null>();

// ---- route handlers ------------------------------------------------------------------------

// How a route answers each caller when aimed at the other tenant:
//  "scoped"   404, and the same status for an id that does not exist;
//  404 / 403 / 401 / 200: that status (403 = the role may never use the route, whatever the id);
//  "lists"    200 and none of the other tenant's ids in the answer;
//  "skip"     not called (a manager's or administrator's write would really change the shared
//             e2e database: their reach over every account is probed by the reads).
type Expect = "scoped" | "lists" | "skip" | 200 | 401 | 403 | 404;
interface RouteProbe {
  path: (ids: Ids) => string;
  body?: (ids: Ids) => unknown;
  engineer: Expect;
  reviewer: Expect;
  manager: Expect;
  admin: Expect;
  /** For "lists": the ids of the other tenant that must not appear. */
  listed?: (ids: Ids, body: unknown) => boolean;
}

const containsId = (key: string, id: number) => (_ids: Ids, body: unknown) =>
  new RegExp(`"${key}":${id}[,}]`).test(JSON.stringify(body));

const vendorRead = { engineer: "scoped", reviewer: 403, manager: 200, admin: 200 } as const;
const vendorWrite = { engineer: "scoped", reviewer: 403, manager: "skip", admin: "skip" } as const;

const ROUTES: Record<string, RouteProbe> = {
  "GET accounts": {
    path: () => "/api/v1/accounts",
    engineer: "lists",
    reviewer: 403,
    manager: 200,
    admin: 200,
    listed: (ids, body) => containsId("id", ids.account)(ids, body),
  },
  "GET admin/outbox": {
    path: () => "/api/v1/admin/outbox",
    engineer: 403,
    reviewer: 403,
    manager: 403,
    admin: 200,
  },
  "GET axes/[axisId]": { path: (i) => `/api/v1/axes/${i.axis}`, ...vendorRead },
  "PUT axes/[axisId]": { path: (i) => `/api/v1/axes/${i.axis}`, body: () => ({}), ...vendorWrite },
  "GET cases/[caseId]/proposals": {
    path: (i) => `/api/v1/cases/${i.case}/proposals`,
    ...vendorRead,
  },
  "POST cases/[caseId]/proposals": {
    path: (i) => `/api/v1/cases/${i.case}/proposals`,
    body: () => ({}),
    ...vendorWrite,
  },
  "GET cases/[caseId]/result": { path: (i) => `/api/v1/cases/${i.case}/result`, ...vendorRead },
  "GET cases/[caseId]": { path: (i) => `/api/v1/cases/${i.case}`, ...vendorRead },
  "GET cases/[caseId]/workbook": { path: (i) => `/api/v1/cases/${i.case}/workbook`, ...vendorRead },
  "GET cases": {
    path: () => "/api/v1/cases",
    engineer: "lists",
    reviewer: 403,
    manager: 200,
    admin: 200,
    listed: (ids, body) => containsId("id", ids.case)(ids, body),
  },
  // The engine on a posted case: no stored data, so no tenant; only the signed-out are refused.
  "POST evaluate": {
    path: () => "/api/v1/evaluate",
    body: () =>
      JSON.parse(fs.readFileSync(path.resolve("tests/fixtures/engine-case.json"), "utf8")),
    engineer: 200,
    reviewer: 200,
    manager: 200,
    admin: 200,
  },
  // The import template: the same file for the vendor's people; reviewers import nothing.
  "GET imports/[file]": {
    path: () => "/api/v1/imports/template.csv",
    engineer: 200,
    reviewer: 403,
    manager: 200,
    admin: 200,
  },
  "POST payments/checkout": {
    path: () => "/api/v1/payments/checkout",
    body: (i) => ({ proposalId: i.proposal }),
    ...vendorWrite,
  },
  "GET pipeline": {
    path: () => "/api/v1/pipeline",
    engineer: "lists",
    reviewer: 403,
    manager: 200,
    admin: 403,
    listed: (ids, body) => containsId("id", ids.proposal)(ids, body),
  },
  "GET proposals/[proposalId]/comments": {
    path: (i) => `/api/v1/proposals/${i.proposal}/comments`,
    engineer: "scoped",
    reviewer: "scoped",
    manager: 200,
    admin: 200,
  },
  "POST proposals/[proposalId]/comments": {
    path: (i) => `/api/v1/proposals/${i.proposal}/comments`,
    body: () => ({ body: "probe from another account" }),
    engineer: "scoped",
    reviewer: "scoped",
    manager: "skip",
    admin: "skip",
  },
  "POST proposals/[proposalId]/decision": {
    path: (i) => `/api/v1/proposals/${i.proposal}/decision`,
    body: () => ({ decision: "accept", comment: "" }),
    engineer: 403,
    reviewer: "scoped",
    manager: 403,
    admin: 403,
  },
  "POST proposals/[proposalId]/discount-approval": {
    path: (i) => `/api/v1/proposals/${i.proposal}/discount-approval`,
    body: () => ({}),
    engineer: 403,
    reviewer: 403,
    manager: "skip",
    admin: 403,
  },
  "GET proposals/[proposalId]/dossier": {
    path: (i) => `/api/v1/proposals/${i.proposal}/dossier`,
    engineer: "scoped",
    reviewer: "scoped",
    // Unpaid: the manager reaches it and is asked to pay.
    manager: "skip",
    admin: "skip",
  },
  "GET proposals/[proposalId]": {
    path: (i) => `/api/v1/proposals/${i.proposal}`,
    engineer: "scoped",
    reviewer: "scoped",
    manager: 200,
    admin: 200,
  },
  "PATCH proposals/[proposalId]": {
    path: (i) => `/api/v1/proposals/${i.proposal}`,
    body: () => ({ stage: "declined" }),
    engineer: 403,
    reviewer: 403,
    manager: "skip",
    admin: 403,
  },
  "POST proposals/[proposalId]/send": {
    path: (i) => `/api/v1/proposals/${i.proposal}/send`,
    body: () => ({ email: "probe@example.invalid", name: "Probe" }),
    ...vendorWrite,
  },
  "POST proposals/[proposalId]/what-if": {
    path: (i) => `/api/v1/proposals/${i.proposal}/what-if`,
    body: () => ({ horizonYears: 6 }),
    engineer: "scoped",
    reviewer: "scoped",
    manager: 200,
    admin: 200,
  },
  "GET proposals/[proposalId]/workbook": {
    path: (i) => `/api/v1/proposals/${i.proposal}/workbook`,
    engineer: "scoped",
    reviewer: "scoped",
    manager: 200,
    admin: 200,
  },
  "GET proposals": {
    path: () => "/api/v1/proposals",
    engineer: "lists",
    reviewer: "lists",
    manager: 200,
    admin: 200,
    listed: (ids, body) => containsId("id", ids.proposal)(ids, body),
  },
  "GET sites/[siteId]/axes": { path: (i) => `/api/v1/sites/${i.site}/axes`, ...vendorRead },
  "POST sites/[siteId]/axes": {
    path: (i) => `/api/v1/sites/${i.site}/axes`,
    body: () => ({}),
    ...vendorWrite,
  },
  "POST sites/[siteId]/imports": {
    path: (i) => `/api/v1/sites/${i.site}/imports`,
    body: () => ({}),
    ...vendorWrite,
  },
  "GET sites": {
    path: () => "/api/v1/sites",
    engineer: "lists",
    reviewer: 403,
    manager: 200,
    admin: 200,
    listed: (ids, body) => containsId("id", ids.site)(ids, body),
  },
};

function discoverRoutes(): string[] {
  const root = path.resolve("app/api/v1");
  const found: string[] = [];
  for (const file of fs.readdirSync(root, { recursive: true, encoding: "utf8" })) {
    if (path.basename(file) !== "route.ts") continue;
    const dir = path.dirname(file).split(path.sep).join("/");
    const source = fs.readFileSync(path.join(root, file), "utf8");
    for (const m of source.matchAll(
      /^export (?:const|async function|function) (GET|POST|PUT|PATCH|DELETE)\b/gm,
    ))
      found.push(`${m[1]} ${dir}`);
  }
  return found.sort();
}

async function callRoute(who: Caller, method: string, probe: RouteProbe, ids: Ids) {
  const body = probe.body?.(ids);
  return request(jars.get(who) ?? null, probe.path(ids), {
    method,
    headers: body === undefined ? {} : { "content-type": "application/json" },
    body: body === undefined ? undefined : JSON.stringify(body),
  });
}

// ---- server actions ------------------------------------------------------------------------

// Each action is called over HTTP as the browser calls it: a POST to a page that uses it, with
// its id from the build's server-reference manifest and its arguments as JSON.
interface ActionProbe {
  args: (ids: Ids) => unknown[];
  /** A form action that returns nothing: refusals answer the not-found page (status 404). */
  void?: true;
  /** "scoped": refused with the not-found message, as for an id that does not exist;
   * "role": refused for the role (the action is another role's); "public": needs no session. */
  engineer: "scoped" | "role";
  reviewer: "scoped" | "role";
}

const site = { name: "Probe site", currency: "EUR", tariffPerKWh: "0.2", hoursPerYear: 4000 };

const ACTIONS: Record<string, ActionProbe> = {
  "(app)/(installed-base) createSiteAction": {
    args: (i) => [i.account, site],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/(installed-base) updateSiteAction": {
    args: (i) => [i.site, site],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/(installed-base) createMachineAction": {
    args: (i) => [i.site, { name: "Probe machine" }],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/(installed-base) updateMachineAction": {
    args: (i) => [i.machine, { name: "Probe machine" }],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/(installed-base) saveAxisAction": {
    args: (i) => [i.axis, axisValues],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/admin createUserAction": { args: () => [{}], engineer: "role", reviewer: "role" },
  "(app)/admin changeRoleAction": { args: () => [{}], engineer: "role", reviewer: "role" },
  "(app)/admin setActiveAction": { args: () => [{}], engineer: "role", reviewer: "role" },
  "(app)/admin saveSalesSettingsAction": { args: () => [{}], engineer: "role", reviewer: "role" },
  "(app)/cases createCaseAction": {
    args: (i) => [{ name: "Probe case", siteId: i.site }],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/cases updateAssumptionsAction": {
    args: (i) => [i.case, assumptionValues],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/cases setCaseAxesAction": {
    args: (i) => [i.case, { axisIds: [i.axis] }],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/cases setAxisRetrofitAction": {
    args: (i) => [i.case, i.axis, { kitId: 1 }],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/cases suggestKitsAction": { args: (i) => [i.case], engineer: "scoped", reviewer: "role" },
  "(app)/cases freezeProposalAction": {
    args: (i) => [i.case],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/catalogue saveKitAction": { args: () => [{}, 1], engineer: "role", reviewer: "role" },
  "(app)/catalogue saveMotorAction": { args: () => [{}, 1], engineer: "role", reviewer: "role" },
  "(app)/catalogue setCatalogueActiveAction": {
    args: () => [{ kind: "kit", id: 1, active: false }],
    engineer: "role",
    reviewer: "role",
  },
  "(app)/dossiers saveDossierSettingsAction": {
    args: (i) => [i.proposal, { seed: 7, ...DEFAULT_RANGES }],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/dossiers setDossierPriceAction": {
    args: () => [{ amount: "1.00", currency: "EUR" }],
    engineer: "role",
    reviewer: "role",
  },
  "(app)/dossiers closeDossierCheckoutAction": {
    args: (i) => [i.proposal],
    void: true,
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/proposals sendProposalAction": {
    args: (i) => [i.proposal, { email: "probe@example.invalid", name: "Probe" }],
    engineer: "scoped",
    reviewer: "role",
  },
  "(app)/proposals approveDiscountAction": {
    args: (i) => [i.proposal],
    engineer: "role",
    reviewer: "role",
  },
  "(app)/proposals updateQuoteAction": {
    args: (i) => [i.proposal, { stage: "declined" }],
    engineer: "role",
    reviewer: "role",
  },
  "(app)/proposals addVendorCommentAction": {
    args: (i) => [i.proposal, { body: "probe from another account" }],
    engineer: "scoped",
    reviewer: "role",
  },
  "(review)/review decideAction": {
    args: (i) => [i.proposal, { decision: "accept", comment: "" }],
    engineer: "role",
    reviewer: "scoped",
  },
  "(review)/review addReviewerCommentAction": {
    args: (i) => [i.proposal, { body: "probe from another account" }],
    engineer: "role",
    reviewer: "scoped",
  },
};

// The invitation's token is its credential (no session, no tenant): a token that was never
// issued sets no password, whoever calls.
const PUBLIC_ACTIONS = new Set(["(auth)/invitation acceptInvitationAction"]);

const DEFAULT_RANGES = {
  tariff: { lowPct: -20, highPct: 30 },
  hoursPerYear: { lowPct: -25, highPct: 10 },
  loadTorque: { lowPct: -15, highPct: 15 },
  stepLossEvents: { lowPct: -50, highPct: 100 },
};
let axisValues: unknown;
let assumptionValues: unknown;

interface ManifestEntry {
  workers: Record<string, unknown>;
  filename: string;
  exportedName: string;
}
let manifest: Map<string, { id: string; page: string }>;

function readManifest() {
  const raw = JSON.parse(
    fs.readFileSync(path.resolve(".next/server/server-reference-manifest.json"), "utf8"),
  ) as { node: Record<string, ManifestEntry> };
  const map = new Map<string, { id: string; page: string }>();
  for (const [id, entry] of Object.entries(raw.node)) {
    const key = `${entry.filename.replace(/^app\//, "").replace(/\/actions\.ts$/, "")} ${entry.exportedName}`;
    // A page of the app that uses the action; its dynamic segments filled with 1 (the action
    // does not read the URL, but the page must exist for the request to reach it).
    const worker = Object.keys(entry.workers)[0]!;
    const page =
      worker
        .replace(/^app/, "")
        .replace(/\/page$/, "")
        .replace(/\/\([^)]+\)/g, "")
        .replace(/\[[^\]]+\]/g, "1") || "/";
    map.set(key, { id, page });
  }
  return map;
}

function discoverActions(): string[] {
  const found: string[] = [];
  for (const file of fs.readdirSync(path.resolve("app"), { recursive: true, encoding: "utf8" })) {
    if (path.basename(file) !== "actions.ts") continue;
    const dir = path.dirname(file).split(path.sep).join("/");
    const source = fs.readFileSync(path.resolve("app", file), "utf8");
    for (const m of source.matchAll(/^export (?:async function|const) (\w+)/gm))
      found.push(`${dir} ${m[1]}`);
  }
  return found.sort();
}

// ForbiddenError's message (lib/errors.ts).
const ROLE_REFUSAL = /Your role may not do this/;

type ActionOutcome = { status: number; result: { ok: boolean; message?: string } | null };

async function callAction(who: Caller, key: string, args: unknown[]): Promise<ActionOutcome> {
  const action = manifest.get(key);
  if (!action) throw new Error(`${key} is not in the build's server-reference manifest`);
  const res = await request(jars.get(who) ?? null, action.page, {
    method: "POST",
    headers: {
      accept: "text/x-component",
      "content-type": "text/plain;charset=UTF-8",
      "next-action": action.id,
    },
    body: JSON.stringify(args),
  });
  const text = await res.text();
  // The flight answer: one "row:json" line per chunk; the action's return value is the object
  // with "ok".
  let result: ActionOutcome["result"] = null;
  for (const line of text.split("\n")) {
    const json = line.slice(line.indexOf(":") + 1);
    if (!json.startsWith("{") || !json.includes('"ok"')) continue;
    try {
      result = JSON.parse(json) as ActionOutcome["result"];
    } catch {
      // not a plain JSON row
    }
  }
  return { status: res.status, result };
}

// ---- setup ---------------------------------------------------------------------------------

const one = <T>(sql: string, ...args: unknown[]) => database.prepare(sql).get(...args) as T;

beforeAll(async () => {
  const account = one<{ id: number }>(
    "select id from accounts where name = 'Pipetteworks Lab Automation'",
  ).id;
  const siteRow = one<{ id: number }>(
    "select id from sites where account_id = ? order by id",
    account,
  );
  foreign = {
    account,
    site: siteRow.id,
    machine: one<{ id: number }>(
      "select id from machines where site_id = ? order by id",
      siteRow.id,
    ).id,
    axis: one<{ id: number }>(
      "select a.id from axes a join machines m on m.id = a.machine_id where m.site_id = ? order by a.id",
      siteRow.id,
    ).id,
    case: one<{ id: number }>("select id from cases where account_id = ? order by id", account).id,
    proposal: one<{ id: number }>(
      "select p.id from proposals p join cases c on c.id = p.case_id where c.account_id = ? order by p.id",
      account,
    ).id,
  };
  jars.set("anonymous", null);
  for (const who of ["engineer", "reviewer", "manager", "admin"] as const) {
    const { jar, error } = await signInOverHttp(`${who}@example.com`, "loopshift-demo");
    expect(error).toBeNull();
    jars.set(who, jar);
  }
  manifest = readManifest();
  // Values the forms would send, taken from the other tenant's own rows (read by the manager),
  // so that a refusal is the scope's and not the form check's.
  const axis = await request(jars.get("manager")!, `/api/v1/axes/${foreign.axis}`);
  axisValues = await axis.json();
  const kase = (await (
    await request(jars.get("manager")!, `/api/v1/cases/${foreign.case}`)
  ).json()) as {
    input: Record<string, unknown>;
  };
  assumptionValues = kase.input;
});

// ---- the matrix ----------------------------------------------------------------------------

describe("every route and action has a cross-tenant probe", () => {
  it("lists each route handler of app/api/v1 in the probe table", () => {
    const routes = discoverRoutes();
    expect(routes.length).toBeGreaterThan(20);
    expect(
      routes.filter((r) => !(r in ROUTES)),
      "routes without a cross-tenant probe",
    ).toEqual([]);
    expect(
      Object.keys(ROUTES).filter((r) => !routes.includes(r)),
      "probes of removed routes",
    ).toEqual([]);
  });

  it("lists each server action in the probe table", () => {
    const actions = discoverActions();
    expect(actions.length).toBeGreaterThan(20);
    expect(
      actions.filter((a) => !(a in ACTIONS) && !PUBLIC_ACTIONS.has(a)),
      "actions without a cross-tenant probe",
    ).toEqual([]);
    expect(Object.keys(ACTIONS).filter((a) => !actions.includes(a))).toEqual([]);
  });
});

describe("an attacker signed in to another account, over HTTP", () => {
  const routeCases = Object.entries(ROUTES).flatMap(([key, probe]) =>
    (["engineer", "reviewer", "manager", "admin", "anonymous"] as const).map(
      (who) => [key, who, probe] as const,
    ),
  );

  it.each(routeCases)("%s as %s", async (key, who, probe) => {
    const method = key.split(" ")[0]!;
    const expected: Expect = who === "anonymous" ? 401 : probe[who];
    if (expected === "skip") return;
    const before = dataVersion();
    const res = await callRoute(who, method, probe, foreign);
    const write = method !== "GET";
    if (expected === "scoped") {
      expect(res.status, "another account's id").toBe(404);
      const missing = await callRoute(who, method, probe, MISSING);
      expect(missing.status, "an id that does not exist").toBe(404);
      expect(await res.json()).toEqual(await missing.json());
    } else if (expected === "lists") {
      expect(res.status).toBe(200);
      expect(probe.listed!(foreign, await res.json()), "the other tenant's id is listed").toBe(
        false,
      );
    } else {
      expect(res.status).toBe(expected);
      // The managers and administrators who may see every account get the other tenant's row.
      if (expected === 200 && probe.listed)
        expect(probe.listed(foreign, await res.json())).toBe(true);
    }
    if (write && expected !== 200) expect(dataVersion(), "nothing was written").toBe(before);
    if (!write && expected !== 200)
      expect(dataVersion(), "a refused read wrote nothing").toBe(before);
  });

  const actionCases = Object.entries(ACTIONS).flatMap(([key, probe]) =>
    (["engineer", "reviewer", "anonymous"] as const).map((who) => [key, who, probe] as const),
  );

  it.each(actionCases)("action %s as %s", async (key, who, probe) => {
    const before = dataVersion();
    const outcome = await callAction(who, key, probe.args(foreign));
    if (who === "anonymous") {
      // The proxy sends the signed-out to the sign-in page before any action runs.
      expect(outcome.status).toBe(307);
      expect(outcome.result).toBeNull();
    } else if (probe.void) {
      const missing = await callAction(who, key, probe.args(MISSING));
      expect(outcome.status).toBe(404);
      expect(missing.status, "not yours is answered as missing").toBe(404);
    } else if (probe[who] === "scoped") {
      const missing = await callAction(who, key, probe.args(MISSING));
      expect(outcome.result, JSON.stringify(outcome)).toMatchObject({ ok: false });
      // Refused by the scope: neither by the form check nor for the role.
      expect(outcome.result?.message).not.toBe("Check the highlighted fields.");
      expect(outcome.result?.message).not.toMatch(ROLE_REFUSAL);
      expect(outcome.result, "not yours is answered as missing").toEqual(missing.result);
    } else {
      expect(outcome.result, JSON.stringify(outcome)).toMatchObject({ ok: false });
      expect(outcome.result?.message).toMatch(ROLE_REFUSAL);
    }
    expect(dataVersion(), "nothing was written").toBe(before);
  });
});
