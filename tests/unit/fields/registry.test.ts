import fs from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import type { z } from "zod";
import { AXIS_COLUMNS as TABLE_COLUMNS } from "@/components/installed-base/axis-columns";
import { axisInputOf, DEFAULT_RETROFIT_TERMS } from "@/db/queries/case-input";
import type { Axis } from "@/db/schema";
import { axisInputSchema as engineAxisSchema } from "@/lib/engine/schema";
import {
  AXIS_FIELDS,
  boundOf,
  EVENT_FIELDS,
  KIT_FIELDS,
  MOTION_FIELDS,
  registeredFields,
  type FieldSpec,
} from "@/lib/fields";
import { RECORD_KEY_HEADER } from "@/lib/glossary";
import { IMPORT_FIELDS } from "@/lib/import/fields";
import {
  kitInputSchema as kitFormSchema,
  motorInputSchema as motorFormSchema,
} from "@/lib/validations/catalogue";
import { axisFieldsSchema } from "@/lib/validations/installed-base";
import { AXIS_INPUT_COLUMNS } from "@/lib/workbook/axes-input-columns";
import { AXIS_MOTION_COLUMNS } from "@/lib/workbook/axes-motion-columns";

type Schema = z.ZodType;
type Def = { innerType?: Schema; in?: Schema; shape?: Record<string, Schema> };
const defOf = (schema: Schema) => (schema as unknown as { _zod: { def: Def } })._zod.def;

/** The object schema inside optional, default, prefault and refinements. */
function shapeOf(schema: Schema): Record<string, Schema> {
  let current = schema;
  for (;;) {
    const def = defOf(current);
    if (def.shape) return def.shape;
    const inner = def.innerType ?? def.in;
    if (!inner) throw new Error("not an object schema");
    current = inner;
  }
}

/** The engine's schema of a field from its path in AxisInput ("drive.efficiencyPct"). */
function engineSchemaAt(fieldPath: string): Schema | undefined {
  const parts = fieldPath.split(".");
  let schema: Schema = engineAxisSchema;
  for (const part of parts) {
    const next = shapeOf(schema)[part];
    if (!next) return undefined;
    schema = next;
  }
  return schema;
}

const ALL = registeredFields();

/** A value just outside each end of the field's range (relative steps so that 1e-9 stays meaningful). */
function outside(spec: FieldSpec) {
  const bound = boundOf(spec.range!);
  const step = (v: number) => Math.max(Math.abs(v) * 1e-3, 1e-12);
  return {
    below: bound.minExclusive ? bound.min : bound.min - step(bound.min),
    above: bound.max + step(bound.max),
    inside: [bound.minExclusive ? bound.min + step(bound.min) : bound.min, bound.max],
  };
}

/** Checks a schema against a field's range and default, as every schema derived from it must hold. */
function expectHoldsField(schema: Schema, spec: FieldSpec, where: string) {
  if (spec.range !== undefined) {
    const { below, above, inside } = outside(spec);
    for (const v of inside) expect(schema.safeParse(v).success, `${where} accepts ${v}`).toBe(true);
    expect(schema.safeParse(below).success, `${where} refuses ${below}`).toBe(false);
    expect(schema.safeParse(above).success, `${where} refuses ${above}`).toBe(false);
  }
  if (spec.choices) {
    for (const choice of spec.choices)
      expect(schema.safeParse(choice).success, `${where} takes ${choice}`).toBe(true);
    expect(schema.safeParse("not-a-choice").success, where).toBe(false);
  }
}

describe("the field registry (lib/fields)", () => {
  it("gives every field a label, help, a unit (or null) and a range consistent with its default", () => {
    for (const { path: p, spec } of ALL) {
      expect(spec.label.trim(), p).not.toBe("");
      expect(spec.help.trim(), p).not.toBe("");
      expect(spec.unit === null || spec.unit.length > 0, p).toBe(true);
      if (spec.kind === "number" || spec.kind === "int")
        expect(spec.range, `${p} has a range`).toBeDefined();
      if (spec.kind === "enum") expect(spec.choices?.length, p).toBeGreaterThan(0);
      if (spec.default !== undefined) {
        expect(spec.optional, `${p}: a default and optional at once`).toBeUndefined();
        if (spec.range !== undefined) {
          const bound = boundOf(spec.range);
          const d = spec.default as number;
          expect(bound.minExclusive ? d > bound.min : d >= bound.min, p).toBe(true);
          expect(d <= bound.max, p).toBe(true);
        }
        if (spec.choices) expect(spec.choices, p).toContain(spec.default);
      }
    }
  });

  it("has one label per field: no two fields of the axis, its motion and its event share one", () => {
    const labels = [AXIS_FIELDS, MOTION_FIELDS, EVENT_FIELDS].flatMap((fields) =>
      Object.values(fields as Record<string, FieldSpec>).map((f) => f.label),
    );
    expect(new Set(labels).size).toBe(labels.length);
  });

  it("writes its words in British English", () => {
    const american = /\b(labor|color|center|energized|behavior|analyze|catalog)\b/i;
    for (const { path: p, spec } of ALL) {
      expect(spec.label, p).not.toMatch(american);
      expect(spec.help, p).not.toMatch(american);
    }
  });
});

describe("the engine's schema is derived from the registry", () => {
  it("has a schema at every registered path", () => {
    for (const { path: p } of ALL) expect(engineSchemaAt(p), p).toBeDefined();
  });

  it("holds no field of the registered groups that the registry does not name", () => {
    // Structure, not fields: ids and names, the nested objects, the measured curve, the kit's motor and price.
    const NOT_FIELDS = ["id", "machineId", "motor", "drive", "duty", "reliability", "retrofit"];
    const groups: Record<string, string[]> = {
      "": [...NOT_FIELDS],
      motor: ["pullOutCurve"],
      drive: ["resonance"],
      duty: ["motion"],
      reliability: ["event"],
      "duty.motion": [],
      "reliability.event": [],
      "retrofit.kit": ["id", "name", "price", "motor"],
    };
    const registered = new Set(ALL.map((f) => f.path));
    for (const [group, structural] of Object.entries(groups)) {
      const schema = group === "" ? engineAxisSchema : engineSchemaAt(group)!;
      for (const key of Object.keys(shapeOf(schema))) {
        const fieldPath = group === "" ? key : `${group}.${key}`;
        if (structural.includes(key)) continue;
        expect(registered.has(fieldPath), `${fieldPath} is in the registry`).toBe(true);
      }
    }
  });

  it("takes each field's default, presence, range and choices from it", () => {
    for (const { path: p, spec } of ALL) {
      const schema = engineSchemaAt(p)!;
      expectHoldsField(schema, spec, `engine ${p}`);
      const absent = schema.safeParse(undefined);
      // The engine leaves these out when a mechanism derives them, or builds the cost from an event.
      const absentMeansDerived = spec.requiredUnlessMotion || p === "reliability.costPerEvent";
      if (spec.default !== undefined && !absentMeansDerived)
        expect(absent.data, `engine default of ${p}`).toEqual(spec.default);
      else if (spec.optional || absentMeansDerived)
        expect(absent.success && absent.data === undefined, `${p} optional`).toBe(true);
      else expect(absent.success, `${p} required`).toBe(false);
    }
  });
});

describe("the forms, the import list, the table and the workbook cover exactly the registry's fields", () => {
  const axisKeys = Object.keys(AXIS_FIELDS);

  it("axis form: the registry's axis fields, with their ranges and defaults", () => {
    expect(Object.keys(axisFieldsSchema.shape).sort()).toEqual([...axisKeys].sort());
    for (const [key, spec] of Object.entries(AXIS_FIELDS as Record<string, FieldSpec>)) {
      const schema = axisFieldsSchema.shape[key as keyof typeof axisFieldsSchema.shape] as Schema;
      expectHoldsField(schema, spec, `form ${key}`);
      if (spec.default !== undefined)
        expect(schema.safeParse(undefined).data, `form default of ${key}`).toEqual(spec.default);
    }
  });

  it("catalogue forms: the motor fields of an axis and the kit fields", () => {
    const motorKeys = Object.entries(AXIS_FIELDS as Record<string, { group: string }>)
      .filter(([, spec]) => spec.group === "motor")
      .map(([key]) => key);
    const motorForm = Object.keys(motorFormSchema.shape).filter(
      (k) => !["code", "name", "frameSize"].includes(k),
    );
    expect(motorForm.sort()).toEqual(motorKeys.sort());
    const kitForm = Object.keys(kitFormSchema.shape).filter(
      (k) => !["code", "name", "price", "currency", "motorId"].includes(k),
    );
    expect(kitForm.sort()).toEqual(Object.keys(KIT_FIELDS).sort());
    for (const [key, spec] of Object.entries(KIT_FIELDS as Record<string, FieldSpec>))
      expectHoldsField(
        kitFormSchema.shape[key as keyof typeof kitFormSchema.shape] as Schema,
        spec,
        `kit form ${key}`,
      );
  });

  it("import list: the machine, then every axis, motion and event field with its label", () => {
    const expected = [
      "machine",
      ...axisKeys,
      ...Object.keys(MOTION_FIELDS).map((k) => `motion.${k}`),
      ...Object.keys(EVENT_FIELDS).map((k) => `event.${k}`),
    ];
    expect(IMPORT_FIELDS.map((f) => f.key)).toEqual(expected);
    for (const field of IMPORT_FIELDS.slice(1)) {
      const [group, name] = field.key.includes(".") ? field.key.split(".") : ["", field.key];
      const fields = (
        group === "motion" ? MOTION_FIELDS : group === "event" ? EVENT_FIELDS : AXIS_FIELDS
      ) as Record<string, FieldSpec>;
      expect(field.label, field.key).toBe(fields[name].label);
      expect(field.help, field.key).toBe(fields[name].help);
    }
  });

  it("axes table: every axis field but the label (which heads the row) in some column", () => {
    const shown = TABLE_COLUMNS.flatMap((c) => c.fields);
    expect(new Set(shown).size).toBe(shown.length);
    expect([...shown].sort()).toEqual(axisKeys.filter((k) => k !== "label").sort());
    for (const column of TABLE_COLUMNS.filter((c) => c.fields.length === 1))
      expect(column.label.startsWith(AXIS_FIELDS[column.fields[0]].label), column.key).toBe(true);
  });

  it("workbook Axes sheet: one input column per axis and event field, one per motion input, headed by its label", () => {
    const NOT_FIELDS = [
      RECORD_KEY_HEADER.axis,
      RECORD_KEY_HEADER.machine,
      "Machine",
      "Pull-out curve",
      "Cost of one event (formula)",
    ];
    const inputs = AXIS_INPUT_COLUMNS.filter(
      (c) => c.group !== "Retrofit" && !NOT_FIELDS.includes(c.header),
    );
    const labels = [
      ...Object.values(AXIS_FIELDS as Record<string, FieldSpec>),
      ...Object.values(EVENT_FIELDS as Record<string, FieldSpec>),
    ].map((f) => f.label);
    expect(inputs).toHaveLength(labels.length);
    for (const label of labels)
      expect(
        inputs.filter((c) => c.header.startsWith(label)),
        label,
      ).toHaveLength(1);
    for (const [key, spec] of Object.entries(MOTION_FIELDS as Record<string, FieldSpec>)) {
      if (key === "mechanism") continue; // "Sized from": the mechanism, or "typed duty"
      const own = (header: string) => header === spec.label || header.startsWith(`${spec.label} (`);
      expect(
        AXIS_MOTION_COLUMNS.filter((c) => own(c.header)),
        key,
      ).toHaveLength(1);
    }
  });
});

describe("defaults exist once", () => {
  const ROOTS = ["app", "components", "lib", "db/schema", "db/queries", "server"];
  const files = ROOTS.flatMap((root) =>
    fs.existsSync(root)
      ? (fs.readdirSync(root, { recursive: true }) as string[])
          .filter((f) => /\.(ts|tsx)$/.test(f))
          .map((f) => path.join(root, f))
          // The registry itself; invented demo fleets; a payment's line item (its quantity is not an axis's).
          .filter(
            (f) =>
              !["lib/fields", "lib/cli", "lib/payments", "server/payments"].some((dir) =>
                f.startsWith(dir),
              ),
          )
      : [],
  );
  const sources = files.map((f) => ({ file: f, text: fs.readFileSync(f, "utf8") }));

  it("no file outside lib/fields writes a registry field's default beside its name", () => {
    const found: string[] = [];
    for (const { path: p, key, spec } of ALL) {
      if (spec.default === undefined || typeof spec.default === "boolean") continue;
      const value = typeof spec.default === "string" ? `"${spec.default}"` : String(spec.default);
      const escaped = value.replace(/[.*+?^${}()|[\]\\]/g, "\\$&");
      const beside = new RegExp(
        `\\b${key}\\b[^\\n]*?(:\\s*${escaped}\\s*[,}]|\\.default\\(\\s*${escaped}\\s*\\))`,
      );
      for (const { file, text } of sources)
        for (const line of text.split("\n"))
          if (beside.test(line)) found.push(`${p} in ${file}: ${line.trim()}`);
    }
    expect(found).toEqual([]);
  });

  it("the idle-current default is written once, in the registry", () => {
    const registry = fs.readFileSync("lib/fields/axis.ts", "utf8");
    const entry = registry.slice(registry.indexOf("idleCurrentPct: {"));
    expect(entry.slice(0, entry.indexOf("},")).match(/default: 50\b/g)).toHaveLength(1);
    expect(
      sources.filter(({ text }) => /idleCurrentPct[^\n]*\b50\b/.test(text)).map((s) => s.file),
    ).toEqual([]);
  });
});

describe("a field added to the registry only: the axis's asset tag", () => {
  it("reaches the form and the API with its length, the import template, the table and the workbook", () => {
    const tag = "X".repeat(40);
    expect(axisFieldsSchema.shape.assetTag.safeParse(tag).data).toBe(tag);
    expect(axisFieldsSchema.shape.assetTag.safeParse("  ").data).toBeNull();
    expect(axisFieldsSchema.shape.assetTag.safeParse(`${tag}X`).success).toBe(false);
    expect(engineSchemaAt("assetTag")?.safeParse(undefined).success).toBe(true);
    const column = IMPORT_FIELDS.find((f) => f.key === "assetTag");
    expect(column).toMatchObject({
      label: "Asset tag",
      type: "text",
      required: false,
      maxLength: 40,
    });
    expect(TABLE_COLUMNS.find((c) => c.key === "assetTag")?.label).toBe("Asset tag");
    expect(AXIS_INPUT_COLUMNS.find((c) => c.key === "assetTag")).toMatchObject({
      group: "Axis",
      header: "Asset tag",
    });
  });
});

describe("a stored axis reaches the engine field by field (db/queries/case-input.ts)", () => {
  it("carries every stored axis field to its registry path in AxisInput", () => {
    // A distinctive value per field, inside its range: a field mapped to the wrong path or left out shows.
    const stored: Record<string, unknown> = {
      id: 7,
      siteId: 1,
      machineId: 3,
      createdAt: "2026-01-01T00:00:00.000Z",
      referenceMotorId: null,
      pullOutCurve: null,
      resonance: null,
      motion: null,
      event: null,
    };
    // Each field its own share of its range (0.05 + 0.007 per place): two fields never take the same value.
    Object.entries(AXIS_FIELDS as Record<string, FieldSpec>).forEach(([key, spec], place) => {
      if (spec.kind === "enum") stored[key] = spec.choices!.at(-1);
      else if (spec.kind === "money") stored[key] = "12.5";
      else if (spec.kind === "text") stored[key] = `text of ${key}`.slice(0, spec.maxLength);
      else {
        const { min, max } = boundOf(spec.range!);
        const value = min + (Math.min(max, min + 100) - min) * (0.05 + 0.007 * place);
        stored[key] = spec.kind === "int" ? Math.max(Math.ceil(value), min) : value;
      }
    });
    const input = axisInputOf(
      stored as unknown as Axis,
      { id: "k", name: "Kit", price: "100" },
      DEFAULT_RETROFIT_TERMS,
    );
    const parsed = engineAxisSchema.parse(input) as unknown as Record<string, unknown>;
    for (const { path: p, key } of ALL.filter(
      (f) => !f.path.includes(".") || /^(motor|drive|duty|reliability)\.[^.]+$/.test(f.path),
    )) {
      const value = p
        .split(".")
        .reduce<unknown>((o, part) => (o as Record<string, unknown>)[part], parsed);
      const expected = key === "costPerEvent" ? "12.5" : stored[key];
      expect(value, p).toEqual(expected);
    }
  });
});
