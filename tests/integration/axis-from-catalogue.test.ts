import { describe, expect, it } from "vitest";
import { createAxis, getAxisOrThrow, updateAxis } from "@/db/queries/axes";
import { listMotors } from "@/db/queries/catalogue";
import { listMachines } from "@/db/queries/machines";
import { listSites } from "@/db/queries/sites";
import { axisToFormValues, newAxisFormValues } from "@/components/installed-base/axis-form-values";
import {
  CATALOGUE_MOTOR_FIELDS,
  fieldsFromCatalogue,
  motorToAxisFormValues,
} from "@/lib/catalogue/motor-form-values";
import { NotFoundError } from "@/lib/errors";
import { AXIS_FIELDS } from "@/lib/fields";
import { axisInputSchema } from "@/lib/validations/installed-base";
import { caller } from "../support/callers";

const engineer = () => caller("engineer@example.com");

function newAxisValues() {
  const site = listSites(engineer())[0];
  const machine = listMachines(engineer(), site.id)[0];
  return {
    ...newAxisFormValues(machine.id, site),
    label: "Catalogue filled",
    busVoltageV: 48,
    currentSettingA: 2,
    movePct: 30,
    holdPct: 50,
    speedRpm: 300,
    loadTorqueNm: { value: 0.2, unit: "N·m" },
    peakTorqueNm: { value: 0.4, unit: "N·m" },
  };
}

describe("filling an axis's motor figures from a catalogue motor", () => {
  it("fills exactly the registry's motor fields", () => {
    const motorGroup = Object.entries(AXIS_FIELDS)
      .filter(([, spec]) => spec.group === "motor")
      .map(([key]) => key);
    expect([...CATALOGUE_MOTOR_FIELDS]).toEqual(motorGroup);
  });

  it("maps a stored catalogue motor onto the form, and the saved axis holds its figures and names it", () => {
    const motors = listMotors(engineer());
    expect(motors.length).toBeGreaterThan(0);
    for (const motor of motors) {
      const filled = motorToAxisFormValues(motor);
      expect(filled.referenceMotorId).toBe(motor.id);
      expect(filled.holdingTorqueNm).toEqual({ value: motor.holdingTorqueNm, unit: "N·m" });
      expect(filled.ratedCurrentA).toBe(motor.ratedCurrentA);
      expect(filled.insulationClass).toBe(motor.insulationClass);
      expect(filled.thermalResistanceKPerW).toBe(motor.thermalResistanceKPerW ?? "");
      const values = { ...newAxisValues(), ...filled };
      // Untouched, every motor field reads as the catalogue's.
      expect(fieldsFromCatalogue(motor, values)).toEqual([...CATALOGUE_MOTOR_FIELDS]);

      const parsed = axisInputSchema.parse(values);
      const saved = getAxisOrThrow(engineer(), createAxis(engineer(), parsed).id);
      expect(saved.referenceMotorId).toBe(motor.id);
      for (const key of CATALOGUE_MOTOR_FIELDS)
        expect(saved[key], `${motor.code} ${key}`).toBe(motor[key]);
      // Opened again in the form, the figures still read as the catalogue motor's.
      expect(fieldsFromCatalogue(motor, axisToFormValues(saved))).toEqual([
        ...CATALOGUE_MOTOR_FIELDS,
      ]);
    }
  });

  it("marks a field the user changed as theirs, keeping the others as the catalogue's", () => {
    const motor = listMotors(engineer())[0];
    const values = {
      ...motorToAxisFormValues(motor),
      ratedCurrentA: motor.ratedCurrentA + 0.5,
      holdingTorqueNm: { value: motor.holdingTorqueNm * 141.6119, unit: "ozf·in" },
    };
    const from = fieldsFromCatalogue(motor, values);
    expect(from).not.toContain("ratedCurrentA");
    expect(from).not.toContain("holdingTorqueNm");
    expect(from).toContain("phaseResistanceOhm");
    expect(from).toHaveLength(CATALOGUE_MOTOR_FIELDS.length - 2);
  });

  it("keeps the reference motor when a save leaves it out, clears it when blank, and refuses an unknown one", () => {
    const motor = listMotors(engineer())[0];
    const created = createAxis(
      engineer(),
      axisInputSchema.parse({ ...newAxisValues(), ...motorToAxisFormValues(motor) }),
    );
    const { referenceMotorId: _omit, ...withoutRef } = axisToFormValues(
      getAxisOrThrow(engineer(), created.id),
    );
    updateAxis(engineer(), created.id, axisInputSchema.parse(withoutRef));
    expect(getAxisOrThrow(engineer(), created.id).referenceMotorId).toBe(motor.id);
    updateAxis(
      engineer(),
      created.id,
      axisInputSchema.parse({ ...withoutRef, referenceMotorId: "" }),
    );
    expect(getAxisOrThrow(engineer(), created.id).referenceMotorId).toBeNull();
    expect(() =>
      createAxis(
        engineer(),
        axisInputSchema.parse({
          ...newAxisValues(),
          ...motorToAxisFormValues(motor),
          referenceMotorId: 999999,
        }),
      ),
    ).toThrow(NotFoundError);
    const bad = axisInputSchema.safeParse({
      ...newAxisValues(),
      ...motorToAxisFormValues(motor),
      referenceMotorId: "abc",
    });
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0]).toMatchObject({
      path: ["referenceMotorId"],
      message: "Choose a motor from the catalogue, or none",
    });
  });
});
