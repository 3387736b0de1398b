import { NextResponse } from "next/server";
import { listProposalsFor } from "@/db/queries/proposals";
import { withApi } from "@/server/api/handler";
import { requireUser } from "@/server/auth";

// The proposals the caller may see, newest first: a reviewer only those sent to their account.
export const GET = withApi(async () => {
  const caller = await requireUser();
  return NextResponse.json({ proposals: listProposalsFor(caller) });
});
