import { NextResponse } from "next/server";
import { z } from "zod";
import { listAxesForExport } from "@/db/queries/axes";
import { withApi } from "@/lib/api/handler";
import { requireRole } from "@/lib/auth";
import { idFromRoute } from "@/lib/api/params";

const query = z.object({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(5000, "limit must be at most 5000").default(1000),
});

// A site's axes with every field in SI units (N·m, A, Ω, mH, V, rpm), in pages of up to 5,000.
export const GET = withApi(
  async (request: Request, context: { params: Promise<{ siteId: string }> }) => {
    const caller = await requireRole("engineer", "manager", "admin");
    const siteId = idFromRoute((await context.params).siteId);
    const { offset, limit } = query.parse(Object.fromEntries(new URL(request.url).searchParams));
    return NextResponse.json(listAxesForExport(caller, siteId, offset, limit));
  },
);
