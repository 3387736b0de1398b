import { NextResponse } from "next/server";
import { listAccounts } from "@/db/queries/accounts";
import { withApi } from "@/lib/api/handler";
import { requireRole } from "@/lib/auth";

export const GET = withApi(async () => {
  const caller = await requireRole("engineer", "manager", "admin");
  return NextResponse.json({ accounts: listAccounts(caller) });
});
