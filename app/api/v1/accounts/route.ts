import { NextResponse } from "next/server";
import { listAccounts } from "@/db/queries/accounts";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const GET = withApi(async () => {
  const caller = await requireRole(...VENDOR_ROLES);
  return NextResponse.json({ accounts: listAccounts(caller) });
});
