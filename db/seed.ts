import { count, eq } from "drizzle-orm";
import { openDatabase, type Db } from "./client";
import { migrateDatabase } from "./migrate";
import { hashPassword } from "../lib/auth/password";
import { DEMO_PASSWORD, DEMO_USERS } from "./demo-users";
import { accounts, accountShares, users } from "./schema";

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
  });
  return true;
}

if (require.main === module) {
  const db = openDatabase();
  migrateDatabase(db);
  console.log(seedDatabase(db) ? "Demo data seeded." : "Database already has users; seed skipped.");
}
