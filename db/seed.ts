import { count, eq } from "drizzle-orm";
import { openDatabase, type Db } from "./client";
import { migrateDatabase } from "./migrate";
import { hashPassword } from "../lib/auth/password";
import { DEMO_PASSWORD, DEMO_USERS } from "./demo/users";
import { DEMO_KITS, DEMO_MOTORS } from "./demo/catalogue";
import { DEMO_SITES, demoAxesFor, seededRandom } from "./demo/installed-base";
import { seedDemoCases } from "./demo/cases";
import { accounts, accountShares, axes, kits, machines, motors, sites, users } from "./schema";

export const DEMO_ACCOUNTS = [
  { name: "Cartonia Packaging Plant", owner: "engineer@example.com" },
  { name: "Pipetteworks Lab Automation", owner: "engineer2@example.com" },
  { name: "Webline Print Finishing", owner: "engineer@example.com" },
];

export function isEmpty(db: Db): boolean {
  const [row] = db.select({ n: count() }).from(users).all();
  return row.n === 0;
}

// Seeds the demo scenario into an empty database; does nothing when any user exists.
export function seedDatabase(db: Db): boolean {
  if (!isEmpty(db)) return false;
  const hashes = DEMO_USERS.map(() => hashPassword(DEMO_PASSWORD));
  db.transaction((tx) => {
    const ids = new Map<string, number>();
    DEMO_USERS.forEach((u, i) => {
      const [row] = tx
        .insert(users)
        .values({ email: u.email, name: u.name, role: u.role, passwordHash: hashes[i] })
        .returning({ id: users.id })
        .all();
      ids.set(u.email, row.id);
    });
    const accountIds = DEMO_ACCOUNTS.map((a) => {
      const [row] = tx
        .insert(accounts)
        .values({ name: a.name, ownerId: ids.get(a.owner)! })
        .returning({ id: accounts.id })
        .all();
      return row.id;
    });
    // The reviewer is the finance reviewer of the first demo account.
    tx.update(users)
      .set({ accountId: accountIds[0] })
      .where(eq(users.email, "reviewer@example.com"))
      .run();
    // The second engineer helps on the print finisher's account.
    tx.insert(accountShares)
      .values({ accountId: accountIds[2], userId: ids.get("engineer2@example.com")! })
      .run();
    seedCatalogueAndInstalledBase(
      tx,
      new Map(DEMO_ACCOUNTS.map((a, i) => [a.name, accountIds[i]])),
    );
    seedDemoCases(tx);
  });
  return true;
}

type Tx = Parameters<Parameters<Db["transaction"]>[0]>[0];

function seedCatalogueAndInstalledBase(tx: Tx, accountIds: Map<string, number>) {
  const motorIds = new Map<string, number>();
  for (const m of DEMO_MOTORS) {
    const [row] = tx.insert(motors).values(m).returning({ id: motors.id }).all();
    motorIds.set(m.code, row.id);
  }
  for (const { motorCode, ...k } of DEMO_KITS) {
    tx.insert(kits)
      .values({ ...k, motorId: motorCode ? motorIds.get(motorCode)! : null })
      .run();
  }
  const random = seededRandom(20261201);
  for (const s of DEMO_SITES) {
    const { machines: groups, account, ...site } = s;
    const [siteRow] = tx
      .insert(sites)
      .values({ ...site, accountId: accountIds.get(account)! })
      .returning({ id: sites.id })
      .all();
    for (const group of groups) {
      for (let n = 1; n <= group.count; n++) {
        const [machineRow] = tx
          .insert(machines)
          .values({
            siteId: siteRow.id,
            name: `${group.kind.kind} ${String(n).padStart(2, "0")}`,
            line: `${group.kind.line} ${1 + ((n - 1) % 3)}`,
            downtimeHours: group.kind.downtimeHours,
            throughputGainPct: group.throughputGainPct ?? 0,
            marginPerOutputHour: group.marginPerOutputHour ?? "0",
          })
          .returning({ id: machines.id })
          .all();
        const rows = demoAxesFor(group.kind, site.hoursPerYear, site.ambientC, random).map(
          ({ motorCode, ...a }) => ({
            ...a,
            siteId: siteRow.id,
            machineId: machineRow.id,
            referenceMotorId: motorIds.get(motorCode) ?? null,
          }),
        );
        tx.insert(axes).values(rows).run();
      }
    }
  }
}

if (require.main === module) {
  const db = openDatabase();
  migrateDatabase(db);
  console.log(seedDatabase(db) ? "Demo data seeded." : "Database already has users; seed skipped.");
}
