import { NextResponse } from "next/server";
import { listOutbox } from "@/db/queries/outbox";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";

// What the local mail catcher received: [{ id, to, subject, text, html, createdAt }], newest first.
export const GET = withApi(async () => {
  const caller = await requireRole("admin");
  return NextResponse.json(listOutbox(caller));
});
