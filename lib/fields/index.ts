import { FIELD_BOUNDS, type FieldBound } from "./bounds";
import { AXIS_FIELDS, type AxisFieldSpec } from "./axis";
import { EVENT_FIELDS } from "./event";
import { KIT_FIELDS } from "./kit";
import { MOTION_FIELDS } from "./motion";
import type { FieldRange, FieldSpec } from "./types";

export * from "./axis";
export * from "./bounds";
export * from "./event";
export * from "./kit";
export * from "./motion";
export * from "./types";

/** A share of a whole: 0–100 %, worded without a unit ("must be at most 100"). */
export const SHARE_BOUND: FieldBound = { min: 0, max: 100, unit: "" };

/** The bound a range names. */
export function boundOf(range: FieldRange): FieldBound {
  return range === "share" ? SHARE_BOUND : FIELD_BOUNDS[range];
}

/**
 * Every registered field with its path in the engine's AxisInput or KitInput (docs/model.md):
 * what the registry test walks to check that each schema, list and sheet holds exactly these.
 */
export function registeredFields(): { path: string; key: string; spec: FieldSpec }[] {
  const axis = Object.entries(AXIS_FIELDS as Record<string, AxisFieldSpec>).map(([key, spec]) => ({
    key,
    spec,
    path: spec.group === "axis" ? key : `${spec.group}.${spec.engineKey ?? key}`,
  }));
  const nested = (prefix: string, fields: Record<string, FieldSpec>) =>
    Object.entries(fields).map(([key, spec]) => ({ key, spec, path: `${prefix}.${key}` }));
  return [
    ...axis,
    ...nested("duty.motion", MOTION_FIELDS),
    ...nested("reliability.event", EVENT_FIELDS),
    ...nested("retrofit.kit", KIT_FIELDS),
  ];
}

/** The keys of the optional text fields among `fields` (tags and notes, no arithmetic). */
export function optionalTextKeys(fields: Record<string, FieldSpec>): string[] {
  return Object.entries(fields)
    .filter(([, spec]) => spec.kind === "text" && spec.optional === true)
    .map(([key]) => key);
}
