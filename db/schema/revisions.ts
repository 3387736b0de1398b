import { integer, sqliteTable } from "drizzle-orm/sqlite-core";

// One row whose counter goes up with every write to a table that a case's engine input is built
// from (cases, case_axes, axes, machines, sites, kits, motors): triggers in the migration bump it.
// A cached case result tagged with the counter is current exactly while the counter has not
// moved, which one indexed read tells without building the input again.
export const inputRevision = sqliteTable("input_revision", {
  id: integer("id").primaryKey(),
  revision: integer("revision").notNull().default(0),
});
