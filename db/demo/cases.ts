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
import { dateAfterDays, openQuoteFor } from "../queries/quote-open";
import { CARTONER_CASE_SOURCES, seedDemoEvidence, type DemoEvidence } from "./evidence";
import {
  accounts,
  axes,
  caseAxes,
  cases,
  kits,
  machines,
  motors,
  proposalComments,
  proposals,
  sites,
  users,
  type CaseStage,
  type QuoteStage,
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
  // Machines of that kind to pass over first, so that two cases of a site take different ones.
  machineOffset?: number;
  // Frozen as version 1, with its quote where the pipeline has it (days relative to seeding).
  quote?: DemoQuote;
  // Sources of its typed figures; the cases without any show the headline's warning.
  evidence?: DemoEvidence;
};

type DemoQuote = {
  stage: QuoteStage;
  frozenDaysAgo: number;
  closeInDays: number;
  sentDaysAgo?: number;
  decidedDaysAgo?: number;
  // Sent through the portal to this reviewer (the others were sent before it existed).
  sentTo?: string;
  comments?: {
    author: string;
    body: string;
    decision?: "accept" | "changes" | "decline";
    daysAgo: number;
  }[];
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
    // The proposal under review: what reviewer@example.com finds on signing in.
    quote: {
      stage: "sent",
      frozenDaysAgo: 6,
      sentDaysAgo: 5,
      closeInDays: 25,
      sentTo: "reviewer@example.com",
    },
    evidence: CARTONER_CASE_SOURCES,
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
    quote: {
      stage: "declined",
      frozenDaysAgo: 120,
      sentDaysAgo: 115,
      decidedDaysAgo: 90,
      closeInDays: -85,
    },
  },
  {
    account: "Webline Print Finishing",
    site: "Finishing works",
    owner: "engineer@example.com",
    name: "Web press register and infeed",
    stage: "won",
    machineKind: "Web press",
    machineCount: 4,
    finance: { laborRatePerHour: "72", downtimeCostPerHour: "400", projectOneTimeCost: "3000" },
    terms: {
      discountPct: 10,
      installHours: 2,
      commissioningCost: "80",
      maintenanceSavingPerYear: "30",
    },
    quote: {
      stage: "accepted",
      frozenDaysAgo: 75,
      sentDaysAgo: 70,
      decidedDaysAgo: 30,
      closeInDays: -30,
    },
  },
  {
    account: "Cartonia Packaging Plant",
    site: "South hall",
    owner: "engineer@example.com",
    name: "South hall cartoners",
    stage: "proposed",
    machineKind: "Cartoner",
    machineCount: 6,
    finance: { laborRatePerHour: "68", downtimeCostPerHour: "150", projectOneTimeCost: "1800" },
    // Above the default 15 % threshold: waits for a manager's approval before it can be sent.
    terms: {
      discountPct: 18,
      installHours: 1.5,
      commissioningCost: "35",
      maintenanceSavingPerYear: "18",
    },
    quote: { stage: "ready", frozenDaysAgo: 2, closeInDays: 75 },
  },
  {
    account: "Cartonia Packaging Plant",
    site: "North hall",
    owner: "engineer@example.com",
    name: "North hall labellers",
    stage: "proposed",
    machineKind: "Labeler",
    machineCount: 4,
    finance: { laborRatePerHour: "68", downtimeCostPerHour: "90", projectOneTimeCost: "900" },
    terms: {
      discountPct: 8,
      installHours: 1,
      commissioningCost: "25",
      maintenanceSavingPerYear: "0",
    },
    quote: {
      stage: "changes",
      frozenDaysAgo: 20,
      sentDaysAgo: 18,
      closeInDays: 45,
      sentTo: "reviewer@example.com",
      comments: [
        {
          author: "reviewer@example.com",
          decision: "changes",
          body: "Please show the figures at our contracted tariff from next year, 0.24 EUR/kWh, and over six years: our board compares every project over six.",
          daysAgo: 12,
        },
        {
          author: "engineer@example.com",
          body: "Understood. A second version at 0.24 EUR/kWh over six years follows next week.",
          daysAgo: 11,
        },
      ],
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
      .slice(demo.machineOffset ?? 0, (demo.machineOffset ?? 0) + demo.machineCount);
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
    if (demo.evidence)
      seedDemoEvidence(tx, demo.evidence, {
        accountId: site.accountId,
        caseId: caseRow.id,
        ownerId,
        axes: caseAxisRows,
        machines: siteMachines,
      });

    if (demo.quote)
      seedQuote(tx, demo.quote, {
        caseId: caseRow.id,
        ownerId,
        userIds,
        site,
        assumptions,
        siteMachines,
        picked,
        terms: demo.terms,
      });
  }
}

const daysAgo = (days: number) => new Date(Date.now() - days * 24 * 3600 * 1000).toISOString();

// Version 1 of a demo case, frozen some days ago, and where its quote stands now.
function seedQuote(
  tx: Tx,
  quote: DemoQuote,
  c: {
    caseId: number;
    ownerId: number;
    userIds: Map<string, number>;
    site: { currency: string };
    assumptions: Parameters<typeof assembleCaseInput>[1];
    siteMachines: Parameters<typeof assembleCaseInput>[2];
    picked: {
      axis: Parameters<typeof assembleCaseInput>[3][number]["axis"];
      kit: { input: Parameters<typeof assembleCaseInput>[3][number]["kit"] };
    }[];
    terms: RetrofitTerms;
  },
) {
  const input = assembleCaseInput(
    c.site.currency,
    c.assumptions,
    c.siteMachines,
    c.picked.map(({ axis, kit }) => ({ axis, kit: kit.input, terms: c.terms })),
  );
  const [proposal] = tx
    .insert(proposals)
    .values({
      caseId: c.caseId,
      version: 1,
      input,
      result: evaluateCase(input),
      engineVersion: ENGINE_VERSION,
      createdById: c.ownerId,
      createdAt: daysAgo(quote.frozenDaysAgo),
    })
    .returning()
    .all();
  openQuoteFor(tx, proposal, c.ownerId, {
    stage: quote.stage,
    expectedCloseOn: dateAfterDays(quote.closeInDays),
    sentAt: quote.sentDaysAgo === undefined ? null : daysAgo(quote.sentDaysAgo),
    sentToId: quote.sentTo ? c.userIds.get(quote.sentTo)! : null,
    decidedAt: quote.decidedDaysAgo === undefined ? null : daysAgo(quote.decidedDaysAgo),
    updatedAt: daysAgo(quote.decidedDaysAgo ?? quote.sentDaysAgo ?? quote.frozenDaysAgo),
  });
  for (const comment of quote.comments ?? [])
    tx.insert(proposalComments)
      .values({
        proposalId: proposal.id,
        authorId: c.userIds.get(comment.author)!,
        body: comment.body,
        decision: comment.decision ?? null,
        createdAt: daysAgo(comment.daysAgo),
      })
      .run();
}
