import { sql } from "drizzle-orm";
import { index, integer, sqliteTable, text } from "drizzle-orm/sqlite-core";
import { proposals } from "./cases";
import { users } from "./users";

const now = sql`(strftime('%Y-%m-%dT%H:%M:%fZ','now'))`;

// A single-use link that lets a newly invited reviewer set their password. Only a SHA-256 hash
// of the token is kept, so a copy of the database does not hand out working links.
export const invitations = sqliteTable(
  "invitations",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    userId: integer("user_id")
      .notNull()
      .references(() => users.id, { onDelete: "cascade" }),
    proposalId: integer("proposal_id").references(() => proposals.id, { onDelete: "set null" }),
    tokenHash: text("token_hash").notNull().unique(),
    expiresAt: text("expires_at").notNull(),
    usedAt: text("used_at"),
    // Set when a newer invitation of the same user replaces this one, or another one was used.
    revokedAt: text("revoked_at"),
    createdById: integer("created_by_id").references(() => users.id, { onDelete: "set null" }),
    createdAt: text("created_at").notNull().default(now),
  },
  (t) => [index("invitations_user_idx").on(t.userId)],
);

// The conversation about one proposal between the customer's reviewer and the vendor's people.
export const proposalComments = sqliteTable(
  "proposal_comments",
  {
    id: integer("id").primaryKey({ autoIncrement: true }),
    proposalId: integer("proposal_id")
      .notNull()
      .references(() => proposals.id, { onDelete: "cascade" }),
    authorId: integer("author_id")
      .notNull()
      .references(() => users.id),
    body: text("body").notNull(),
    // Set when the comment came with the reviewer's decision, so the thread shows both together.
    decision: text("decision", { enum: ["accept", "changes", "decline"] }),
    createdAt: text("created_at").notNull().default(now),
  },
  (t) => [index("proposal_comments_proposal_idx").on(t.proposalId, t.createdAt)],
);

export type Invitation = typeof invitations.$inferSelect;
export type ProposalComment = typeof proposalComments.$inferSelect;
