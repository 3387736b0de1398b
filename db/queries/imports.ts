import { desc, eq, sql } from "drizzle-orm";
import { db } from "@/db";
import { axes, imports, machines, users, type NewAxis } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { recordAudit } from "./audit";
import { getSiteOrThrow } from "./sites";

// One validated spreadsheet row: an axis in SI units and the name of its machine.
export type ImportedAxis = Omit<NewAxis, "id" | "siteId" | "machineId" | "createdAt"> & {
  machineName: string;
};

// SQLite caps the variables of one statement; ~40 columns × 200 rows stays well below it.
const INSERT_CHUNK = 200;

export function listImports(caller: SessionUser, siteId: number) {
  getSiteOrThrow(caller, siteId);
  return db
    .select({
      id: imports.id,
      fileName: imports.fileName,
      sizeBytes: imports.sizeBytes,
      rowsRead: imports.rowsRead,
      rowsImported: imports.rowsImported,
      errorCount: imports.errorCount,
      machinesCreated: imports.machinesCreated,
      at: imports.at,
      userEmail: users.email,
    })
    .from(imports)
    .leftJoin(users, eq(imports.userId, users.id))
    .where(eq(imports.siteId, siteId))
    .orderBy(desc(imports.at), desc(imports.id))
    .limit(50)
    .all();
}

// Machine names of the file that the site does not have yet (matched without regard to case).
export function machinesToCreate(caller: SessionUser, siteId: number, names: string[]): string[] {
  getSiteOrThrow(caller, siteId);
  if (!names.length) return [];
  const existing = new Set(
    db
      .select({ name: sql<string>`lower(${machines.name})` })
      .from(machines)
      .where(eq(machines.siteId, siteId))
      .all()
      .map((r) => r.name),
  );
  const seen = new Set<string>();
  return names.filter((n) => {
    const key = n.toLowerCase();
    if (existing.has(key) || seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

type FileFacts = { fileName: string; sizeBytes: number; rowsRead: number; errorCount: number };

// All or nothing: the machines it names, every axis and the history row land in one transaction.
export function commitImport(
  caller: SessionUser,
  siteId: number,
  file: FileFacts,
  rows: ImportedAxis[],
) {
  getSiteOrThrow(caller, siteId);
  const result = db.transaction((tx) => {
    const ids = new Map<string, number>();
    for (const m of tx
      .select({ id: machines.id, name: machines.name })
      .from(machines)
      .where(eq(machines.siteId, siteId))
      .all()) {
      ids.set(m.name.toLowerCase(), m.id);
    }
    let created = 0;
    for (const row of rows) {
      const key = row.machineName.toLowerCase();
      if (ids.has(key)) continue;
      const [m] = tx
        .insert(machines)
        .values({ siteId, name: row.machineName })
        .returning({ id: machines.id })
        .all();
      ids.set(key, m.id);
      created++;
    }
    for (let i = 0; i < rows.length; i += INSERT_CHUNK) {
      const chunk = rows.slice(i, i + INSERT_CHUNK).map(({ machineName, ...axis }) => ({
        ...axis,
        siteId,
        machineId: ids.get(machineName.toLowerCase())!,
      }));
      tx.insert(axes).values(chunk).run();
    }
    const [record] = tx
      .insert(imports)
      .values({
        siteId,
        userId: caller.id,
        ...file,
        rowsImported: rows.length,
        machinesCreated: created,
      })
      .returning({ id: imports.id })
      .all();
    return { importId: record.id, imported: rows.length, machinesCreated: created };
  });
  recordAudit({
    actor: caller,
    action: "import.commit",
    targetType: "site",
    targetId: siteId,
    detail: `${file.fileName}: ${rows.length} axes`,
  });
  return result;
}

// A refused file is kept in the history too, with its error count and nothing imported.
export function recordRefusedImport(caller: SessionUser, siteId: number, file: FileFacts) {
  getSiteOrThrow(caller, siteId);
  db.insert(imports)
    .values({ siteId, userId: caller.id, ...file, rowsImported: 0 })
    .run();
}
