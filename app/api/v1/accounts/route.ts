import { NextResponse } from "next/server";
import { listAccounts } from "@/db/queries/accounts";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

// Archived accounts are left out unless asked for with ?archived=show, like the accounts list.
export const GET = withApi(async (request: Request) => {
  const caller = await requireRole(...VENDOR_ROLES);
  const archived =
    new URL(request.url).searchParams.get("archived") === "show" ? "show" : undefined;
  return NextResponse.json({ accounts: listAccounts(caller, { archived }) });
});
