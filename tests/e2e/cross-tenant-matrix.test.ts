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
//  404 / 403 / 401 / 200 / 402: that status (403 = the role may never use the route, whatever
//             the id; 402 = a dossier not paid for);
//  "lists"    200 and none of the other tenant's ids in the answer;
//  { reaches } a write of a role whose reach is every account (docs/product.md: the manager, and the
//             administrator as the app grants it): sent to the other tenant's record with a body
//             the route refuses after its scope check — the answer is that refusal (422, 409),
//             not 404, and nothing is written — and sent to an id that does not exist: 404. So
//             the write is really sent as the role without changing the shared e2e database;
//  { missingOnly } such a write that no body can refuse short of writing (a freeze, a
//             checkout): sent to an id that does not exist (404, nothing written); its reach is
//             the one its reads show.
type Expect =
  "scoped" | "lists" | 200 | 401 | 402 | 403 | 404 | { reaches: 409 | 422 } | { missingOnly: true };
interface RouteProbe {
  path: (ids: Ids) => string;
  body?: (ids: Ids) => unknown;
  /** For { reaches }: a body the route refuses once the caller may reach the record. */
  refusedBody?: (ids: Ids) => unknown;
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
const reaches422 = { reaches: 422 } as const;
const missingOnly = { missingOnly: true } as const;
const vendorWrite = {
  engineer: "scoped",
  reviewer: 403,
  manager: reaches422,
  admin: reaches422,
} as const;
/** A read of a proposal, which its reviewer shares: scoped for the engineer and the reviewer. */
const proposalRead = { engineer: "scoped", reviewer: "scoped", manager: 200, admin: 200 } as const;
/** A list of the vendor's: the engineer's leaves out the other tenant's `record`, the manager's
 * and the administrator's hold it; reviewers have none. */
const vendorList = (url: string, record: keyof Ids): RouteProbe => ({
  path: () => url,
  engineer: "lists",
  reviewer: 403,
  manager: 200,
  admin: 200,
  listed: (ids, body) => containsId("id", ids[record])(ids, body),
});

const ROUTES: Record<string, RouteProbe> = {
  "GET accounts": vendorList("/api/v1/accounts", "account"),
  "GET admin/outbox": {
    path: () => "/api/v1/admin/outbox",
    engineer: 403,
    reviewer: 403,
    manager: 403,
    admin: 200,
  },
  "GET axes/[axisId]": { path: (i) => `/api/v1/axes/${i.axis}`, ...vendorRead },
  "PUT axes/[axisId]": {
    path: (i) => `/api/v1/axes/${i.axis}`,
    body: () => ({}),
    refusedBody: () => ({}),
    ...vendorWrite,
  },
  "GET cases/[caseId]/proposals": {
    path: (i) => `/api/v1/cases/${i.case}/proposals`,
    ...vendorRead,
  },
  "POST cases/[caseId]/proposals": {
    path: (i) => `/api/v1/cases/${i.case}/proposals`,
    body: () => ({}),
    ...vendorWrite,
    // A freeze takes no body to refuse: on the other tenant's case it would add a version.
    manager: missingOnly,
    admin: missingOnly,
  },
  "GET cases/[caseId]/result": { path: (i) => `/api/v1/cases/${i.case}/result`, ...vendorRead },
  "GET cases/[caseId]": { path: (i) => `/api/v1/cases/${i.case}`, ...vendorRead },
  "GET cases/[caseId]/workbook": { path: (i) => `/api/v1/cases/${i.case}/workbook`, ...vendorRead },
  "GET cases": vendorList("/api/v1/cases", "case"),
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
    // The id is in the body: a refused body names no record; a valid one opens a checkout.
    manager: missingOnly,
    admin: missingOnly,
  },
  "GET pipeline": { ...vendorList("/api/v1/pipeline", "proposal"), admin: 403 },
  // The same quotes as CSV: no ids in it, so the other tenant shows by its account's name.
  "GET pipeline.csv": {
    path: () => "/api/v1/pipeline.csv",
    engineer: "lists",
    reviewer: 403,
    manager: 200,
    admin: 403,
    listed: (_ids, body) => String(body).includes(FOREIGN_ACCOUNT),
  },
  "GET proposals/[proposalId]/comments": {
    path: (i) => `/api/v1/proposals/${i.proposal}/comments`,
    ...proposalRead,
  },
  "POST proposals/[proposalId]/comments": {
    path: (i) => `/api/v1/proposals/${i.proposal}/comments`,
    body: () => ({ body: "probe from another account" }),
    refusedBody: () => ({ body: "" }),
    engineer: "scoped",
    reviewer: "scoped",
    manager: reaches422,
    admin: reaches422,
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
    // The other tenant's proposal has no discount waiting: the manager reaches it, is refused.
    manager: { reaches: 409 },
    admin: 403,
  },
  "GET proposals/[proposalId]/dossier": {
    path: (i) => `/api/v1/proposals/${i.proposal}/dossier`,
    engineer: "scoped",
    reviewer: "scoped",
    // Unpaid: the manager and the administrator reach it and are asked to pay.
    manager: 402,
    admin: 402,
  },
  "GET proposals/[proposalId]": {
    path: (i) => `/api/v1/proposals/${i.proposal}`,
    ...proposalRead,
  },
  "PATCH proposals/[proposalId]": {
    path: (i) => `/api/v1/proposals/${i.proposal}`,
    body: () => ({ stage: "declined" }),
    refusedBody: () => ({ stage: "no such stage" }),
    engineer: 403,
    reviewer: 403,
    manager: reaches422,
    admin: 403,
  },
  "POST proposals/[proposalId]/send": {
    path: (i) => `/api/v1/proposals/${i.proposal}/send`,
    body: () => ({ email: "probe@example.invalid", name: "Probe" }),
    refusedBody: () => ({ email: "not an address", name: "Probe" }),
    ...vendorWrite,
  },
  "POST proposals/[proposalId]/what-if": {
    path: (i) => `/api/v1/proposals/${i.proposal}/what-if`,
    body: () => ({ horizonYears: 6 }),
    ...proposalRead,
  },
  "GET proposals/[proposalId]/workbook": {
    path: (i) => `/api/v1/proposals/${i.proposal}/workbook`,
    ...proposalRead,
  },
  "GET proposals": { ...vendorList("/api/v1/proposals", "proposal"), reviewer: "lists" },
  "GET sites/[siteId]/axes": { path: (i) => `/api/v1/sites/${i.site}/axes`, ...vendorRead },
  "POST sites/[siteId]/axes": {
    path: (i) => `/api/v1/sites/${i.site}/axes`,
    body: () => ({}),
    refusedBody: () => ({}),
    ...vendorWrite,
  },
  "POST sites/[siteId]/imports": {
    path: (i) => `/api/v1/sites/${i.site}/imports`,
    body: () => ({}),
    // Not multipart: refused once the site is reached.
    refusedBody: () => ({}),
    ...vendorWrite,
  },
  "GET sites": vendorList("/api/v1/sites", "site"),
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

async function callRoute(
  who: Caller,
  method: string,
  probe: RouteProbe,
  ids: Ids,
  body: unknown = probe.body?.(ids),
) {
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
  /** Arguments the action refuses (its form check) whoever may call it: for the roles below. */
  refusedArgs?: (ids: Ids) => unknown[];
  /** A form action that returns nothing: refusals answer the not-found page (status 404). */
  void?: true;
  /** "scoped": refused with the not-found message, as for an id that does not exist;
   * "role": refused for the role (the action is another role's); "public": needs no session. */
  engineer: "scoped" | "role";
  reviewer: "scoped" | "role";
  /**
   * The manager and the administrator (docs/product.md: the manager reaches every account; the app
   * lets the administrator do so too). Absent: "reaches" where the engineer is "scoped", else
   * "role". Each sends the write without changing the shared e2e database:
   *  "role"        refused for the role;
   *  "reaches"     with an id that does not exist, refused as missing; on the other tenant's
   *                record with refusedArgs, refused by the form check;
   *  "missingOnly" an action no argument can refuse short of writing (a freeze, a kit
   *                suggestion): only the id that does not exist, refused as missing;
   *  "form"        the role's own action without a record id: refusedArgs are refused.
   */
  manager?: ActionReach;
  admin?: ActionReach;
}
type ActionReach = "role" | "reaches" | "missingOnly" | "form";
const FORM_REFUSAL = "Check the highlighted fields.";

const site = { name: "Probe site", currency: "EUR", tariffPerKWh: "0.2", hoursPerYear: 4000 };

// The families of actions, each with one maker, so that a table row says only what is its own.

/** A vendor's write on a record: the engineer is scoped, the reviewer refused for the role, and
 * the manager and the administrator reach it (reachOf), probed with `refusedArgs`. */
const vendorAction = (
  args: ActionProbe["args"],
  refusedArgs: ActionProbe["args"],
): ActionProbe => ({ args, refusedArgs, engineer: "scoped", reviewer: "role" });

/** The source of a typed figure of one of the other tenant's records (server/evidence/actions.ts):
 * refused as a missing record; `refused` replaces what makes the arguments fail the form check. */
const evidenceAction = (
  subjectType: "axis" | "machine",
  field: string,
  source: Record<string, string>,
  refused: Record<string, string>,
): ActionProbe => {
  const subject = (i: Ids) => ({ subjectType, subjectId: i[subjectType], field });
  return vendorAction(
    (i) => [{ ...subject(i), ...source }],
    (i) => [{ ...subject(i), ...refused }],
  );
};

/** A vendor's action that takes a record's id alone (a delete, an undo, a freeze): no argument
 * can be refused short of writing, so the roles that reach every account are probed with the id
 * that does not exist only. */
const idOnlyAction = (record: keyof Ids, extra: Pick<ActionProbe, "void"> = {}): ActionProbe => ({
  args: (i) => [i[record]],
  ...extra,
  engineer: "scoped",
  reviewer: "role",
  manager: "missingOnly",
  admin: "missingOnly",
});

/** An administrator's own action, naming no record: every other role is refused for the role;
 * the administrator's `refusedArgs` are refused by the form check. */
const adminAction = (
  args: ActionProbe["args"] = () => [{}],
  refusedArgs: ActionProbe["args"] = args,
): ActionProbe => ({
  args,
  refusedArgs,
  engineer: "role",
  reviewer: "role",
  manager: "role",
  admin: "form",
});

/** The reviewer's answer on a proposal: scoped for the reviewer, refused to the vendor's roles. */
const reviewerAction = (args: ActionProbe["args"]): ActionProbe => ({
  args,
  engineer: "role",
  reviewer: "scoped",
});

const ACTIONS: Record<string, ActionProbe> = {
  "installed-base/actions createSiteAction": vendorAction(
    (i) => [i.account, site],
    (i) => [i.account, {}],
  ),
  "installed-base/actions updateSiteAction": vendorAction(
    (i) => [i.site, site],
    (i) => [i.site, {}],
  ),
  "installed-base/actions createMachineAction": vendorAction(
    (i) => [i.site, { name: "Probe machine" }],
    (i) => [i.site, {}],
  ),
  "installed-base/actions updateMachineAction": vendorAction(
    (i) => [i.machine, { name: "Probe machine" }],
    (i) => [i.machine, {}],
  ),
  "installed-base/actions saveAxisAction": vendorAction(
    (i) => [i.axis, axisValues],
    (i) => [i.axis, {}],
  ),
  // The source of a typed figure of the other tenant's axis: refused as a missing axis.
  "evidence/actions saveEvidenceAction": evidenceAction(
    "axis",
    "stepLossEventsPerYear",
    { note: "Probe note", givenOn: "2026-01-05", givenBy: "Probe" },
    { note: "" },
  ),
  "evidence/actions clearEvidenceAction": evidenceAction(
    "machine",
    "throughputGainPct",
    {},
    { field: "label" },
  ),
  // Creating an account names no record: a name the other tenant's account holds is refused
  // (names are unique across accounts) the same way whatever the ids, and nothing is written.
  "accounts/actions createAccountAction": {
    ...vendorAction(
      () => [{ name: "Pipetteworks Lab Automation" }],
      () => [{ name: "" }],
    ),
    manager: "form",
    admin: "form",
  },
  "accounts/actions renameAccountAction": vendorAction(
    (i) => [{ accountId: i.account, name: "Probe account" }],
    (i) => [{ accountId: i.account, name: "" }],
  ),
  "accounts/actions shareAccountAction": vendorAction(
    (i) => [{ accountId: i.account, userId: 1 }],
    (i) => [{ accountId: i.account, userId: "" }],
  ),
  "accounts/actions unshareAccountAction": vendorAction(
    (i) => [{ accountId: i.account, userId: 1 }],
    (i) => [{ accountId: i.account, userId: "" }],
  ),
  "accounts/actions reassignOwnerAction": {
    args: (i) => [{ accountId: i.account, ownerId: 1 }],
    refusedArgs: (i) => [{ accountId: i.account, ownerId: "" }],
    engineer: "role",
    reviewer: "role",
    manager: "reaches",
    admin: "reaches",
  },
  "accounts/actions archiveAccountAction": vendorAction(
    (i) => [{ accountId: i.account }],
    () => [{ accountId: "none" }],
  ),
  "accounts/actions restoreAccountAction": vendorAction(
    (i) => [{ accountId: i.account }],
    () => [{ accountId: "none" }],
  ),
  "installed-base/delete-actions deleteSiteAction": idOnlyAction("site"),
  "installed-base/delete-actions deleteMachineAction": idOnlyAction("machine"),
  "installed-base/delete-actions deleteAxisAction": idOnlyAction("axis"),
  // An undo belongs to whoever deleted: anyone else's, or none, is not found.
  "installed-base/delete-actions undoDeletionAction": idOnlyAction("axis"),
  "installed-base/delete-actions duplicateMachineAction": vendorAction(
    (i) => [i.machine, { name: "Probe machine copy" }],
    (i) => [i.machine, { name: "" }],
  ),
  "cases/actions setCaseAxesRetrofitAction": vendorAction(
    (i) => [i.case, { axisIds: [i.axis], discountPct: 12 }],
    (i) => [i.case, { axisIds: [] }],
  ),
  "cases/actions updateCaseDetailsAction": vendorAction(
    (i) => [i.case, { name: "Probe case", notes: "" }],
    (i) => [i.case, { name: "" }],
  ),
  "cases/actions duplicateCaseAction": vendorAction(
    (i) => [i.case, { name: "Probe case copy" }],
    (i) => [i.case, { name: "" }],
  ),
  "invitations/actions resendInvitationAction": adminAction(),
  "invitations/actions revokeInvitationAction": adminAction(),
  "admin/actions createUserAction": adminAction(),
  "admin/actions changeRoleAction": adminAction(),
  "admin/actions setActiveAction": adminAction(),
  "admin/actions saveSalesSettingsAction": adminAction(),
  "cases/actions createCaseAction": vendorAction(
    (i) => [{ name: "Probe case", siteId: i.site }],
    (i) => [{ name: "", siteId: i.site }],
  ),
  "cases/actions updateAssumptionsAction": vendorAction(
    (i) => [i.case, assumptionValues],
    (i) => [i.case, {}],
  ),
  "cases/actions setCaseAxesAction": vendorAction(
    (i) => [i.case, { axisIds: [i.axis] }],
    (i) => [i.case, { axisIds: "all" }],
  ),
  "cases/actions setAxisRetrofitAction": vendorAction(
    (i) => [i.case, i.axis, { kitId: 1 }],
    (i) => [i.case, i.axis, { kitId: "any" }],
  ),
  "cases/actions suggestKitsAction": idOnlyAction("case"),
  "cases/actions freezeProposalAction": idOnlyAction("case"),
  "catalogue/actions saveKitAction": adminAction(() => [{}, 1]),
  "catalogue/actions saveMotorAction": adminAction(() => [{}, 1]),
  "catalogue/actions setCatalogueActiveAction": adminAction(
    () => [{ kind: "kit", id: 1, active: false }],
    () => [{ kind: "kit", id: 1, active: "no" }],
  ),
  "dossiers/actions saveDossierSettingsAction": vendorAction(
    (i) => [i.proposal, { seed: 7, ...DEFAULT_RANGES }],
    (i) => [i.proposal, { seed: -1 }],
  ),
  "dossiers/actions setDossierPriceAction": adminAction(
    () => [{ amount: "1.00", currency: "EUR" }],
    () => [{ amount: "-1", currency: "EUR" }],
  ),
  "dossiers/actions closeDossierCheckoutAction": idOnlyAction("proposal", { void: true }),
  "proposals/actions sendProposalAction": vendorAction(
    (i) => [i.proposal, { email: "probe@example.invalid", name: "Probe" }],
    (i) => [i.proposal, { email: "not an address", name: "Probe" }],
  ),
  "proposals/actions approveDiscountAction": {
    args: (i) => [i.proposal],
    engineer: "role",
    reviewer: "role",
    manager: "missingOnly",
    admin: "role",
  },
  "proposals/actions updateQuoteAction": {
    args: (i) => [i.proposal, { stage: "declined" }],
    refusedArgs: (i) => [i.proposal, { stage: "no such stage" }],
    engineer: "role",
    reviewer: "role",
    manager: "reaches",
    admin: "role",
  },
  "proposals/actions addVendorCommentAction": vendorAction(
    (i) => [i.proposal, { body: "probe from another account" }],
    (i) => [i.proposal, { body: "" }],
  ),
  "review/actions decideAction": reviewerAction((i) => [
    i.proposal,
    { decision: "accept", comment: "" },
  ]),
  "review/actions addReviewerCommentAction": reviewerAction((i) => [
    i.proposal,
    { body: "probe from another account" },
  ]),
};

/** The manager's or administrator's expectation of an action (see ActionProbe). */
const reachOf = (probe: ActionProbe, who: "manager" | "admin"): ActionReach =>
  probe[who] ?? (probe.engineer === "scoped" ? "reaches" : "role");

// The invitation's token is its credential (no session, no tenant): a token that was never
// issued sets no password, whoever calls.
const PUBLIC_ACTIONS = new Set(["invitations/actions acceptInvitationAction"]);

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
    const key = `${entry.filename.replace(/^server\//, "").replace(/\.ts$/, "")} ${entry.exportedName}`;
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

// Every "use server" module under server/ (server/<feature>/actions.ts by convention, but any
// file that opens with the directive counts), keyed by its path there without ".ts".
function discoverActions(): string[] {
  const found: string[] = [];
  for (const file of fs.readdirSync(path.resolve("server"), {
    recursive: true,
    encoding: "utf8",
  })) {
    if (!/\.tsx?$/.test(file)) continue;
    const source = fs.readFileSync(path.resolve("server", file), "utf8");
    if (!/^\s*(?:\/\/.*\n\s*)*["']use server["']/.test(source)) continue;
    const moduleKey = file
      .split(path.sep)
      .join("/")
      .replace(/\.tsx?$/, "");
    for (const m of source.matchAll(/^export (?:async function|const) (\w+)/gm))
      found.push(`${moduleKey} ${m[1]}`);
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

const FOREIGN_ACCOUNT = "Pipetteworks Lab Automation";
/** A JSON answer parsed, any other (the CSV export) as its text. */
const bodyOf = async (res: Response): Promise<unknown> =>
  (res.headers.get("content-type") ?? "").includes("json") ? res.json() : res.text();

const one = <T>(sql: string, ...args: unknown[]) => database.prepare(sql).get(...args) as T;

beforeAll(async () => {
  const account = one<{ id: number }>("select id from accounts where name = ?", FOREIGN_ACCOUNT).id;
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
    const before = dataVersion();
    if (typeof expected === "object") {
      // A role that reaches every account: a write it may make, sent without a change.
      const missing = await callRoute(who, method, probe, MISSING);
      expect(missing.status, "an id that does not exist").toBe(404);
      if ("reaches" in expected) {
        const body = (probe.refusedBody ?? probe.body)?.(foreign);
        const res = await callRoute(who, method, probe, foreign, body);
        expect(res.status, "another account's record is reached, the body refused").toBe(
          expected.reaches,
        );
      }
      expect(dataVersion(), "nothing was written").toBe(before);
      return;
    }
    const res = await callRoute(who, method, probe, foreign);
    const write = method !== "GET";
    if (expected === "scoped") {
      expect(res.status, "another account's id").toBe(404);
      const missing = await callRoute(who, method, probe, MISSING);
      expect(missing.status, "an id that does not exist").toBe(404);
      expect(await res.json()).toEqual(await missing.json());
    } else if (expected === "lists") {
      expect(res.status).toBe(200);
      expect(probe.listed!(foreign, await bodyOf(res)), "the other tenant's id is listed").toBe(
        false,
      );
    } else {
      expect(res.status).toBe(expected);
      // The managers and administrators who may see every account get the other tenant's row.
      if (expected === 200 && probe.listed)
        expect(probe.listed(foreign, await bodyOf(res))).toBe(true);
    }
    if (write && expected !== 200) expect(dataVersion(), "nothing was written").toBe(before);
    if (!write && expected !== 200)
      expect(dataVersion(), "a refused read wrote nothing").toBe(before);
  });

  const actionCases = Object.entries(ACTIONS).flatMap(([key, probe]) =>
    (["engineer", "reviewer", "manager", "admin", "anonymous"] as const).map(
      (who) => [key, who, probe] as const,
    ),
  );

  it.each(actionCases)("action %s as %s", async (key, who, probe) => {
    const before = dataVersion();
    if (who === "manager" || who === "admin") {
      const reach = reachOf(probe, who);
      if (reach === "role") {
        const outcome = await callAction(who, key, probe.args(foreign));
        expect(outcome.result, JSON.stringify(outcome)).toMatchObject({ ok: false });
        expect(outcome.result?.message).toMatch(ROLE_REFUSAL);
      }
      if (reach === "reaches" || reach === "missingOnly") {
        // An id that does not exist is refused as missing, not for the role nor by the form.
        const missing = await callAction(who, key, probe.args(MISSING));
        if (probe.void) expect(missing.status).toBe(404);
        else {
          expect(missing.result, JSON.stringify(missing)).toMatchObject({ ok: false });
          expect(missing.result?.message).not.toBe(FORM_REFUSAL);
          expect(missing.result?.message).not.toMatch(ROLE_REFUSAL);
        }
      }
      if (reach === "reaches" || reach === "form") {
        expect(probe.refusedArgs, `${key} needs refusedArgs`).toBeDefined();
        const refused = await callAction(who, key, probe.refusedArgs!(foreign));
        expect(refused.result, JSON.stringify(refused)).toMatchObject({ ok: false });
        expect(refused.result?.message).not.toMatch(ROLE_REFUSAL);
      }
      expect(dataVersion(), "nothing was written").toBe(before);
      return;
    }
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
