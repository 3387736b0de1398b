import { asc, eq } from "drizzle-orm";
import { ENGINE_VERSION, evaluateCase } from "../../lib/engine";
import type { CaseAssumptionsInput } from "../../lib/validations/case";
import { caseAssumptionsSchema } from "../../lib/validations/case";
import {
  assembleCaseInput,
  defaultAssumptions,
  kitOptions,
  suggestKitFor,
  type RetrofitTerms,
} from "../queries/case-input";
import type { Db } from "../client";
import {
  accounts,
  axes,
  caseAxes,
  cases,
  kits,
  machines,
  motors,
  proposals,
  sites,
  users,
  type CaseStage,
} from "../schema";

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

type DemoCase = {
  account: string;
  site: string;
  owner: string;
  name: string;
  stage: CaseStage;
  // Machines of the site whose axes the case takes, by name prefix, and how many of them.
  machineKind: string;
  machineCount: number;
  finance: Partial<CaseAssumptionsInput["finance"]>;
  terms: RetrofitTerms;
  frozen?: boolean;
};

// Invented business cases of the demo scenario, one per stage a newcomer meets first. Figures
// are plausible for a packaging or print plant and taken from no real customer.
export const DEMO_CASES: DemoCase[] = [
  {
    account: "Cartonia Packaging Plant",
    site: "North hall",
    owner: "engineer@example.com",
    name: "North hall cartoners, phase 1",
    stage: "proposed",
    machineKind: "Cartoner",
    machineCount: 6,
    finance: {
      tariffEscalationPct: 3,
      laborRatePerHour: "68",
      downtimeCostPerHour: "150",
      projectOneTimeCost: "2400",
      coolingCop: 3,
    },
    terms: {
      discountPct: 12,
      installHours: 1.5,
      commissioningCost: "35",
      maintenanceSavingPerYear: "18",
    },
    frozen: true,
  },
  {
    account: "Cartonia Packaging Plant",
    site: "South hall",
    owner: "engineer@example.com",
    name: "South hall labellers",
    stage: "modelled",
    machineKind: "Labeler",
    machineCount: 4,
    finance: { laborRatePerHour: "68", downtimeCostPerHour: "90", projectOneTimeCost: "900" },
    terms: {
      discountPct: 8,
      installHours: 1,
      commissioningCost: "25",
      maintenanceSavingPerYear: "0",
    },
  },
  {
    account: "Webline Print Finishing",
    site: "Finishing works",
    owner: "engineer@example.com",
    name: "Slitter knife and tension axes",
    stage: "draft",
    machineKind: "Slitter rewinder",
    machineCount: 4,
    finance: { laborRatePerHour: "72", horizonYears: 7 },
    terms: {
      discountPct: 0,
      installHours: 2,
      commissioningCost: "60",
      maintenanceSavingPerYear: "25",
    },
  },
  {
    account: "Pipetteworks Lab Automation",
    site: "Assembly and test",
    owner: "engineer2@example.com",
    name: "Gantry pilot",
    stage: "lost",
    machineKind: "Pipetting gantry",
    machineCount: 3,
    finance: { laborRatePerHour: "75", projectOneTimeCost: "1500" },
    terms: {
      discountPct: 5,
      installHours: 1.25,
      commissioningCost: "40",
      maintenanceSavingPerYear: "0",
    },
  },
];

const sitesColumns = {
  id: sites.id,
  accountId: sites.accountId,
  name: sites.name,
  currency: sites.currency,
  tariffPerKWh: sites.tariffPerKWh,
  gridKgCo2PerKWh: sites.gridKgCo2PerKWh,
};

/**
 * Seeds the demo cases with their axes, each on the kit the engine suggests (the cheapest
 * active kit when none keeps the margin), and freezes version 1 of the case marked frozen.
 */
export function seedDemoCases(tx: Tx) {
  const kitRows = tx.select().from(kits).all();
  const motorRows = tx.select().from(motors).all();
  const userIds = new Map(
    tx
      .select({ id: users.id, email: users.email })
      .from(users)
      .all()
      .map((u) => [u.email, u.id]),
  );
  for (const demo of DEMO_CASES) {
    const site = tx
      .select(sitesColumns)
      .from(sites)
      .innerJoin(accounts, eq(accounts.id, sites.accountId))
      .where(eq(accounts.name, demo.account))
      .all()
      .find((s) => s.name === demo.site)!;
    const siteMachines = tx
      .select()
      .from(machines)
      .where(eq(machines.siteId, site.id))
      .orderBy(asc(machines.name))
      .all()
      .filter((m) => m.name.startsWith(demo.machineKind))
      .slice(0, demo.machineCount);
    const machineIds = new Set(siteMachines.map((m) => m.id));
    const caseAxisRows = tx
      .select()
      .from(axes)
      .where(eq(axes.siteId, site.id))
      .orderBy(asc(axes.id))
      .all()
      .filter((a) => machineIds.has(a.machineId));

    const base = defaultAssumptions(site);
    const assumptions = caseAssumptionsSchema.parse({
      ...base,
      finance: { ...base.finance, ...demo.finance },
    });
    const options = kitOptions(site.currency, kitRows, motorRows);
    const ownerId = userIds.get(demo.owner)!;
    const [caseRow] = tx
      .insert(cases)
      .values({
        accountId: site.accountId,
        siteId: site.id,
        ownerId,
        name: demo.name,
        stage: demo.stage,
        assumptions,
      })
      .returning({ id: cases.id })
      .all();
    const picked = caseAxisRows.map((axis) => {
      const choice = suggestKitFor(axis, demo.terms, options, assumptions.margins);
      return { axis, kit: choice.kit ?? options[0] };
    });
    tx.insert(caseAxes)
      .values(
        picked.map(({ axis, kit }) => ({
          caseId: caseRow.id,
          axisId: axis.id,
          kitId: kit.row.id,
          ...demo.terms,
        })),
      )
      .run();

    if (demo.frozen) {
      const input = assembleCaseInput(
        site.currency,
        assumptions,
        siteMachines,
        picked.map(({ axis, kit }) => ({ axis, kit: kit.input, terms: demo.terms })),
      );
      tx.insert(proposals)
        .values({
          caseId: caseRow.id,
          version: 1,
          input,
          result: evaluateCase(input),
          engineVersion: ENGINE_VERSION,
          createdById: ownerId,
        })
        .run();
    }
  }
}
