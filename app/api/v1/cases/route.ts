import { NextResponse } from "next/server";
import { listCases } from "@/db/queries/cases";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// The cases of the accounts the caller may work on, most recently changed first.
export const GET = withApi(async () => {
  const caller = await requireRole(...VENDOR_ROLES);
  return NextResponse.json({ cases: listCases(caller) });
});
