import "../support/node-async-storage";
import { describe, expect, it } from "vitest";
import AccountPage from "@/app/(app)/(installed-base)/accounts/[accountId]/page";
import MachinePage from "@/app/(app)/(installed-base)/machines/[machineId]/page";
import { RemovedAxesNotice } from "@/components/cases/removed-axes-notice";
import { createAxis } from "@/db/queries/axes";
import { createCase } from "@/db/queries/cases";
import { setCaseAxes } from "@/db/queries/case-axes";
import { createMachine } from "@/db/queries/machines";
import { deleteAxis, deleteSite, undoDeletion } from "@/db/queries/installed-base-delete";
import { createSite, listSites } from "@/db/queries/sites";
import {
  deleteAxisAction,
  deleteSiteAction,
  duplicateMachineAction,
  undoDeletionAction,
} from "@/server/installed-base/delete-actions";
import { axisInputSchema, siteInputSchema } from "@/lib/validations/installed-base";
import { caller } from "../support/callers";
import { asRequestOf } from "../support/next-request";
import { renderPageAs, renderWithRouter } from "../support/render-page";

const engineer = () => caller("engineer@example.com");
const reviewer = () => caller("reviewer@example.com");

const axisValues = (machineId: number, label: string) =>
  axisInputSchema.parse({
    machineId,
    label,
    holdingTorqueNm: 1.2,
    ratedCurrentA: 2.8,
    phaseResistanceOhm: 0.9,
    phaseInductanceMh: 3.2,
    busVoltageV: 48,
    currentSettingA: 2.8,
    hoursPerYear: 4000,
    movePct: 40,
    holdPct: 40,
    speedRpm: 300,
    loadTorqueNm: 0.25,
    peakTorqueNm: 0.45,
  });

function setUp(name: string) {
  const accountId = listSites(engineer())[0].accountId;
  const site = createSite(
    engineer(),
    accountId,
    siteInputSchema.parse({
      name,
      currency: "EUR",
      tariffPerKWh: "0.2",
      ambientC: 25,
      hoursPerYear: 4000,
    }),
  );
  const machine = createMachine(engineer(), site.id, {
    name: `${name} press`,
    line: "Line 1",
    downtimeHours: 2,
    throughputGainPct: 0,
    marginPerOutputHour: "0",
  });
  const axisIds = [1, 2].map(
    (i) => createAxis(engineer(), axisValues(machine.id, `${name} axis ${i}`)).id,
  );
  const draft = createCase(engineer(), { siteId: site.id, name: `${name} case` });
  setCaseAxes(engineer(), draft.id, axisIds);
  return { accountId, site, machine, axisIds, draft };
}

describe("the installed-base screens", () => {
  it("the machine page shows its figures, links its axes and says what a delete takes", async () => {
    const { machine, axisIds } = setUp("Page machine");
    const out = await renderPageAs(engineer(), () =>
      MachinePage({
        params: Promise.resolve({ machineId: String(machine.id) }),
        searchParams: Promise.resolve({}),
      }),
    );
    expect(out).toContain(machine.name);
    expect(out).toContain("Axis rows");
    for (const id of axisIds) expect(out).toContain(`href="/axes/${id}"`);
    expect(out).toContain("Delete machine");
    expect(out).toContain(
      `Deleting machine ${machine.name} removes its 2 axes. 1 open case uses 2 of them and will list them as removed.`,
    );
    expect(out).toContain("Duplicate machine");
    expect(out).toContain("New machine name");
    expect(out).toContain("Page 1 of 1");
  });

  it("actions: a reviewer is refused; an engineer deletes, the case lists the axis, undo restores it", async () => {
    const { machine, axisIds, draft } = setUp("Action axis");
    const refused = await asRequestOf(reviewer(), () => deleteAxisAction(axisIds[0]));
    expect(refused).toMatchObject({ ok: false });
    // A successful action revalidates Next's cache, which only next start provides: the query
    // it runs is called directly here.
    const done = { data: deleteAxis(engineer(), axisIds[0]) };
    const notYours = await asRequestOf(caller("manager@example.com"), () =>
      undoDeletionAction(done.data.undoId),
    );
    expect(notYours).toMatchObject({
      ok: false,
      message: "Nothing to undo: the deletion has expired or was undone",
    });
    const notice = renderWithRouter(RemovedAxesNotice({ user: engineer(), caseId: draft.id }));
    expect(notice).toContain("Removed from the installed base since this case was built");
    expect(notice).toContain(
      `Action axis axis 1 on ${machine.name} (deleted on its own), by ${engineer().name}, ${new Date().toISOString().slice(0, 10)}`,
    );
    expect(undoDeletion(engineer(), done.data.undoId)).toMatchObject({ kind: "axis" });
    expect(renderWithRouter(RemovedAxesNotice({ user: engineer(), caseId: draft.id }))).toBe("");
  });

  it("duplicate names the field when the name is missing or taken", async () => {
    const { machine } = setUp("Action duplicate");
    const empty = await asRequestOf(engineer(), () =>
      duplicateMachineAction(machine.id, { name: "" }),
    );
    expect(empty).toMatchObject({
      ok: false,
      fieldErrors: { name: "Enter the new machine's name" },
    });
    const taken = await asRequestOf(engineer(), () =>
      duplicateMachineAction(machine.id, { name: machine.name }),
    );
    expect(taken).toMatchObject({
      ok: false,
      message: `This site already has a machine named "${machine.name}"`,
    });
    const refused = await asRequestOf(reviewer(), () =>
      duplicateMachineAction(machine.id, { name: `${machine.name} 2` }),
    );
    expect(refused).toMatchObject({ ok: false });
  });

  it("the account page lists its sites by page and shows the undo of a deleted site", async () => {
    const { accountId, site } = setUp("Action site");
    expect(await asRequestOf(reviewer(), () => deleteSiteAction(site.id))).toMatchObject({
      ok: false,
    });
    const done = { data: deleteSite(engineer(), site.id) };
    const out = await renderPageAs(engineer(), () =>
      AccountPage({
        params: Promise.resolve({ accountId: String(accountId) }),
        searchParams: Promise.resolve({ deleted: String(done.data.undoId), q: "Action" }),
      }),
    );
    expect(out).toContain(`Deleted site ${site.name}.`);
    expect(out).toContain(">Undo<");
    expect(out).not.toContain(`>${site.name}<`);
    expect(out).toContain("Site name contains");
  });
});
