import { NextResponse } from "next/server";
import { z } from "zod";
import { listSites } from "@/db/queries/sites";
import { withApi } from "@/server/api/handler";
import { requireRole } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

const query = z.object({
  accountId: z.coerce
    .number()
    .int()
    .positive("accountId must be a positive whole number")
    .optional(),
});

export const GET = withApi(async (request: Request) => {
  const caller = await requireRole(...VENDOR_ROLES);
  const { accountId } = query.parse(Object.fromEntries(new URL(request.url).searchParams));
  return NextResponse.json({ sites: listSites(caller, accountId) });
});
