import type { Axis } from "@/db/schema";
import type { z } from "zod";
import { AXIS_FIELDS, EVENT_FIELDS, type AxisFieldSpec } from "@/lib/fields";
import type { axisInputSchema } from "@/lib/validations/installed-base";

type FormValues = z.input<typeof axisInputSchema>;

/** The event boxes of the axis form: what one step-loss event causes (lib/fields/event.ts). */
export interface EventFormValues {
  downtimeMinutes: number;
  scrapParts: number;
  scrapCostPerPart: string;
  restartLaborHours: number;
}

// Each event box's registry default: what a new axis, or one whose cost is typed, starts from.
export const EVENT_DEFAULTS: EventFormValues = {
  downtimeMinutes: EVENT_FIELDS.downtimeMinutes.default,
  scrapParts: EVENT_FIELDS.scrapParts.default,
  scrapCostPerPart: EVENT_FIELDS.scrapCostPerPart.default,
  restartLaborHours: EVENT_FIELDS.restartLaborHours.default,
};

const FIELDS = Object.entries(AXIS_FIELDS as Record<string, AxisFieldSpec>);

// A torque is edited as { value, unit }; the schema converts it back to N·m.
const asFormValue = (spec: AxisFieldSpec, value: unknown) =>
  spec.accepts === "torque" ? { value, unit: spec.unit } : value;

// A stored axis (SI units) as the axis form's values: torques as { value, unit: "N·m" }.
export function axisToFormValues(a: Axis): FormValues {
  const { id: _id, siteId: _site, createdAt: _created, pullOutCurve: _curve, ...rest } = a;
  const values: Record<string, unknown> = { ...rest };
  for (const [key, spec] of FIELDS)
    values[key] = asFormValue(spec, (a as Record<string, unknown>)[key]);
  // A stored event means the cost is built up; the boxes load what it holds.
  values.costMode = a.event ? "built" : "typed";
  values.event = a.event ?? EVENT_DEFAULTS;
  return values as FormValues;
}

/**
 * A new axis's form values: each field's registry default (lib/fields/axis.ts), the site's value
 * where the registry says so, empty where the field has no default.
 */
export function newAxisFormValues(
  machineId: number | undefined,
  site: { hoursPerYear: number; ambientC: number },
): FormValues {
  const values: Record<string, unknown> = {
    machineId,
    referenceMotorId: "",
    costMode: "typed",
    event: EVENT_DEFAULTS,
  };
  for (const [key, spec] of FIELDS) {
    const fallback = spec.siteDefault ? (site as Record<string, unknown>)[key] : spec.default;
    values[key] = spec.kind === "text" ? (fallback ?? "") : asFormValue(spec, fallback);
  }
  // Fields without a default stay empty until typed: the schema then says they are required.
  return values as FormValues;
}
