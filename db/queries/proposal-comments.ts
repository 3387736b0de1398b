import { asc, eq } from "drizzle-orm";
import { db } from "@/db";
import { proposalComments, users } from "@/db/schema";
import type { SessionUser } from "@/lib/auth/session-user";
import { getVisibleQuoteOrThrow } from "./proposals";

// A proposal's conversation, oldest first, for whoever may see the proposal. Writing a comment
// also mails the other side: that is server/review/decisions.ts.
export type CommentRow = {
  id: number;
  body: string;
  decision: "accept" | "changes" | "decline" | null;
  createdAt: string;
  authorName: string;
  authorRole: SessionUser["role"];
};

export function listComments(caller: SessionUser, proposalId: number): CommentRow[] {
  getVisibleQuoteOrThrow(caller, proposalId);
  return db
    .select({
      id: proposalComments.id,
      body: proposalComments.body,
      decision: proposalComments.decision,
      createdAt: proposalComments.createdAt,
      authorName: users.name,
      authorRole: users.role,
    })
    .from(proposalComments)
    .innerJoin(users, eq(users.id, proposalComments.authorId))
    .where(eq(proposalComments.proposalId, proposalId))
    .orderBy(asc(proposalComments.createdAt), asc(proposalComments.id))
    .all();
}
