import { NextResponse } from "next/server";
import { getAxisOrThrow, updateAxis } from "@/db/queries/axes";
import { readJsonBody, withApi } from "@/server/api/handler";
import { invalidBody } from "@/server/api/invalid";
import { idFromRoute } from "@/lib/validations/ids";
import { requireRole } from "@/server/auth";
import { axisApiSchema, MAX_AXIS_BYTES } from "@/lib/validations/installed-base";
import { VENDOR_ROLES } from "@/lib/auth/roles";

type Context = { params: Promise<{ axisId: string }> };

// One axis with every stored field in SI units; outside the caller's scope it is not found.
export const GET = withApi(async (_request: Request, context: Context) => {
  const caller = await requireRole(...VENDOR_ROLES);
  return NextResponse.json(getAxisOrThrow(caller, idFromRoute((await context.params).axisId)));
});

// Replaces the axis with the body (the same fields as POST /api/v1/sites/{id}/axes): `motion`,
// `event` or `resonance` left out are removed. The machine must be on the axis's site.
export const PUT = withApi(async (request: Request, context: Context) => {
  const caller = await requireRole(...VENDOR_ROLES);
  const id = idFromRoute((await context.params).axisId);
  getAxisOrThrow(caller, id);
  const parsed = axisApiSchema.safeParse(await readJsonBody(request, MAX_AXIS_BYTES));
  if (!parsed.success) return invalidBody(parsed.error);
  updateAxis(caller, id, parsed.data);
  return NextResponse.json(getAxisOrThrow(caller, id));
});
