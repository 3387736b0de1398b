import { NextResponse } from "next/server";
import { listAccounts } from "@/db/queries/accounts";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";

export const GET = withApi(async () => {
  const caller = await requireRole("engineer", "manager", "admin");
  return NextResponse.json({ accounts: listAccounts(caller) });
});
