import { NextResponse } from "next/server";
import { listCases } from "@/db/queries/cases";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";

// The cases of the accounts the caller may work on, most recently changed first.
export const GET = withApi(async () => {
  const caller = await requireRole("engineer", "manager", "admin");
  return NextResponse.json({ cases: listCases(caller) });
});
