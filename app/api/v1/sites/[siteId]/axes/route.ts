import { NextResponse } from "next/server";
import { z } from "zod";
import { createAxis, listAxesForExport } from "@/db/queries/axes";
import { getMachineOrThrow } from "@/db/queries/machines";
import { getSiteOrThrow } from "@/db/queries/sites";
import { readJsonBody, withApi } from "@/server/api/handler";
import { invalidBody } from "@/server/api/invalid";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { NotFoundError } from "@/lib/errors";
import { axisApiSchema, MAX_AXIS_BYTES } from "@/lib/validations/installed-base";
import { VENDOR_ROLES } from "@/lib/auth/roles";

const query = z.object({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(5000, "limit must be at most 5000").default(1000),
});

type Context = { params: Promise<{ siteId: string }> };

// A site's axes with every field in SI units (N·m, A, Ω, mH, V, rpm, kg·m²), in pages of up to 5,000.
export const GET = withApi(async (request: Request, context: Context) => {
  const caller = await requireRole(...VENDOR_ROLES);
  const siteId = idFromRoute((await context.params).siteId);
  const { offset, limit } = query.parse(Object.fromEntries(new URL(request.url).searchParams));
  return NextResponse.json(listAxesForExport(caller, siteId, offset, limit));
});

// A new axis on one of the site's machines; `motion`, `event` and `resonance` as in the engine's
// CaseInput (docs/model.md). Answers 201 with the stored axis.
export const POST = withApi(async (request: Request, context: Context) => {
  const caller = await requireRole(...VENDOR_ROLES);
  const siteId = idFromRoute((await context.params).siteId);
  getSiteOrThrow(caller, siteId);
  const parsed = axisApiSchema.safeParse(await readJsonBody(request, MAX_AXIS_BYTES));
  if (!parsed.success) return invalidBody(parsed.error);
  // A machine of another site (or out of scope) is not found, like a missing one.
  if (getMachineOrThrow(caller, parsed.data.machineId).siteId !== siteId)
    throw new NotFoundError("No such machine on this site");
  return NextResponse.json(createAxis(caller, parsed.data), { status: 201 });
});
