// First: Next.js reads the request scope's storage from globalThis when its modules load.
import "../support/node-async-storage";
import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { POST as evaluateRoute } from "@/app/api/v1/evaluate/route";
import { GET as caseRoute } from "@/app/api/v1/cases/[caseId]/route";
import { POST as importRoute } from "@/app/api/v1/sites/[siteId]/imports/route";
import { setActiveAction } from "@/server/admin/actions";
import { updateSiteAction } from "@/server/installed-base/actions";
import { setAxisRetrofitAction, suggestKitsAction } from "@/server/cases/actions";
import { listAxesForExport } from "@/db/queries/axes";
import { listCases } from "@/db/queries/cases";
import { listSites } from "@/db/queries/sites";
import { findUserForSignIn } from "@/db/queries/users";
import { parseId } from "@/lib/validations/ids";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";

const engineer = () => caller("engineer@example.com");

// Issue 13, finding 6: ids parsed strictly, a null body refused, never a driver exception.
describe("strict ids", () => {
  it("takes a positive safe integer from a number or a string of digits, nothing else", () => {
    expect(parseId(7)).toBe(7);
    expect(parseId("42")).toBe(42);
    for (const bad of [
      true,
      [2],
      "",
      " 7",
      "7 ",
      "1e3",
      "0x10",
      "07",
      0,
      -1,
      1.5,
      "9007199254740993",
      null,
      {},
      NaN,
      Infinity,
    ]) {
      expect(parseId(bad), JSON.stringify(bad)).toBeNull();
    }
  });

  it("answers 404 for a route id that only looks like a number", async () => {
    // The control: the signed-in engineer reaches their case by its plain id.
    const own = String(listCases(engineer())[0].id);
    const ok = await asRequestOf(engineer(), () =>
      caseRoute(new Request("http://localhost/api/v1/cases/x"), {
        params: Promise.resolve({ caseId: own }),
      }),
    );
    expect(ok.status).toBe(200);
    for (const id of ["1e0", "0x1", " 1", "1.0", "+1"]) {
      const res = await asRequestOf(engineer(), () =>
        caseRoute(new Request("http://localhost/api/v1/cases/x"), {
          params: Promise.resolve({ caseId: id }),
        }),
      );
      expect(res.status, id).toBe(404);
    }
  });

  it("gives an action's message, not a driver exception, for ids that are not ids", async () => {
    const caseId = listCases(engineer())[0].id;
    for (const bad of [true, [2], "", { id: 1 }, 1.5, -3, "1e3"] as unknown[]) {
      const site = await asRequestOf(engineer(), () =>
        updateSiteAction(bad as number, {
          name: "Any hall",
          currency: "EUR",
          tariffPerKWh: "0.2",
          hoursPerYear: 4000,
        }),
      );
      expect(site, JSON.stringify(bad)).toMatchObject({ ok: false, message: "Not found" });
      const retrofit = await asRequestOf(engineer(), () =>
        setAxisRetrofitAction(caseId, bad as number, { kitId: 1 }),
      );
      expect(retrofit).toMatchObject({ ok: false });
      const suggest = await asRequestOf(engineer(), () => suggestKitsAction(bad as number));
      expect(suggest).toMatchObject({ ok: false });
    }
  });
});

describe("POST /api/v1/evaluate", () => {
  it("answers 422, not 500, for a JSON body that is not an object", async () => {
    for (const body of ["null", "1", '"x"', "[]", "true"]) {
      const res = await asRequestOf(engineer(), () =>
        evaluateRoute(
          new Request("http://localhost/api/v1/evaluate", {
            method: "POST",
            headers: { "content-type": "application/json" },
            body,
          }),
        ),
      );
      expect(res.status, body).toBe(422);
    }
  });
});

describe("POST /api/v1/sites/{id}/imports", () => {
  it("takes dryRun as true or false only, and imports nothing on any other value", async () => {
    const site = listSites(engineer())[0];
    const before = listAxesForExport(engineer(), site.id, 0, 100000).axes.length;
    const csv = fs.readFileSync(path.resolve("tests/fixtures/import/clean.csv"));
    const send = (dryRun: string) => {
      const form = new FormData();
      form.set("file", new File([csv], "clean.csv", { type: "text/csv" }));
      form.set("dryRun", dryRun);
      return asRequestOf(engineer(), () =>
        importRoute(new Request("http://localhost/x", { method: "POST", body: form }), {
          params: Promise.resolve({ siteId: String(site.id) }),
        }),
      );
    };
    for (const bad of ["yes", "1", "TRUE", "", "on"]) {
      const res = await send(bad);
      expect(res.status, bad).toBe(422);
      expect(await res.json()).toEqual({ error: 'dryRun must be "true" or "false"' });
    }
    expect((await send("true")).status).toBe(200);
    expect(listAxesForExport(engineer(), site.id, 0, 100000).axes.length).toBe(before);
  });
});

describe("setActiveAction", () => {
  it("refuses an active flag that is neither true nor false instead of deactivating", async () => {
    const target = caller("engineer2@example.com");
    for (const active of ["yes", 0, null, "no"]) {
      const result = await asRequestOf(caller("admin@example.com"), () =>
        setActiveAction({ userId: target.id, active }),
      );
      expect(result, String(active)).toMatchObject({ ok: false });
    }
    expect(findUserForSignIn(target.email)?.active).toBe(true);
  });
});
