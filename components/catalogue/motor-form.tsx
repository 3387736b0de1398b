"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type DefaultValues, type Resolver } from "react-hook-form";
import type { z } from "zod";
import { saveMotorAction } from "@/server/catalogue/actions";
import type { Motor } from "@/db/schema/catalogue";
import type { TorqueUnit } from "@/lib/engine/units";
import { motorInputSchema, type MotorCatalogueInput } from "@/lib/validations/catalogue";
import {
  FormFooter,
  FormSection,
  NumberField,
  SelectField,
  TextField,
  TorqueField,
  asNumber,
} from "@/components/ui/form-fields";
import { AXIS_FIELDS as A, labelWithUnit } from "@/lib/fields";

// The form always sends the torque with its unit; the schema also takes a bare N·m number,
// which the form never produces.
type MotorFormValues = Omit<z.input<typeof motorInputSchema>, "holdingTorqueNm"> & {
  holdingTorqueNm: { value: number; unit: TorqueUnit };
};

// A new motor starts with the schema defaults filled in and its datasheet values empty.
// A new motor starts from the registry's defaults (lib/fields/axis.ts).
function defaults(motor?: Motor): DefaultValues<MotorFormValues> {
  if (!motor) {
    return {
      code: "",
      name: "",
      frameSize: undefined,
      rotorTeeth: A.rotorTeeth.default,
      holdingTorqueNm: { value: undefined, unit: "N·m" },
      ratedCurrentA: undefined,
      phaseResistanceOhm: undefined,
      phaseInductanceMh: undefined,
      thermalResistanceKPerW: undefined,
      ratedTempRiseK: A.ratedTempRiseK.default,
      insulationClass: A.insulationClass.default,
      hysteresisWPerHz: A.hysteresisWPerHz.default,
      eddyWPerHz2: A.eddyWPerHz2.default,
    };
  }
  return {
    code: motor.code,
    name: motor.name,
    frameSize: motor.frameSize,
    rotorTeeth: motor.rotorTeeth,
    holdingTorqueNm: { value: motor.holdingTorqueNm, unit: "N·m" },
    ratedCurrentA: motor.ratedCurrentA,
    phaseResistanceOhm: motor.phaseResistanceOhm,
    phaseInductanceMh: motor.phaseInductanceMh,
    thermalResistanceKPerW: motor.thermalResistanceKPerW ?? undefined,
    ratedTempRiseK: motor.ratedTempRiseK,
    insulationClass: motor.insulationClass,
    hysteresisWPerHz: motor.hysteresisWPerHz,
    eddyWPerHz2: motor.eddyWPerHz2,
  };
}

export function MotorForm({ motor }: { motor?: Motor }) {
  const router = useRouter();
  const [status, setStatus] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<MotorFormValues, unknown, MotorCatalogueInput>({
    // The form's torque is the { value, unit } branch of the schema's input, so the resolver
    // built for the whole input type fits this narrower one.
    resolver: zodResolver(motorInputSchema) as unknown as Resolver<
      MotorFormValues,
      unknown,
      MotorCatalogueInput
    >,
    defaultValues: defaults(motor),
  });
  const num = { setValueAs: asNumber };

  async function onSubmit(values: MotorCatalogueInput) {
    setStatus(null);
    // The server parses the raw form values again: what reaches the database is what it checked.
    const result = await saveMotorAction(values, motor?.id);
    if (result.ok) {
      router.push("/catalogue");
      return;
    }
    for (const [field, message] of Object.entries(result.fieldErrors)) {
      setError(field as keyof MotorFormValues, { message });
    }
    setStatus(result.message);
  }

  const torqueError =
    errors.holdingTorqueNm?.value?.message ??
    errors.holdingTorqueNm?.unit?.message ??
    errors.holdingTorqueNm?.message;

  return (
    <form
      aria-label={motor ? `Edit motor ${motor.code}` : "Add a motor"}
      onSubmit={handleSubmit(onSubmit, () => setStatus("Check the highlighted fields."))}
      noValidate
      className="space-y-6"
    >
      <FormSection legend="Motor">
        <TextField
          id="motor-code"
          label="Code"
          hint="Short and unique: letters, digits, dot, dash or underscore."
          error={errors.code?.message}
          registration={register("code")}
        />
        <TextField
          id="motor-name"
          label="Name"
          hint="How engineers will recognise it in a case."
          error={errors.name?.message}
          registration={register("name")}
        />
        <NumberField
          id="motor-frame"
          label="Frame size (NEMA)"
          hint="The NEMA flange size, e.g. 23 for a flange of about 2.3 in."
          step="1"
          error={errors.frameSize?.message}
          registration={register("frameSize", num)}
        />
        <NumberField
          id="motor-teeth"
          label={A.rotorTeeth.label}
          hint="50 on a 1.8° motor (200 full steps a revolution), 100 on a 0.9° motor."
          step="1"
          error={errors.rotorTeeth?.message}
          registration={register("rotorTeeth", num)}
        />
      </FormSection>

      <FormSection legend="Datasheet values">
        <TorqueField
          id="motor-holding"
          label={A.holdingTorqueNm.label}
          hint="Torque with both phases at rated current, from the datasheet; saved in N·m."
          error={torqueError}
          value={register("holdingTorqueNm.value", num)}
          unit={register("holdingTorqueNm.unit")}
        />
        <NumberField
          id="motor-current"
          label={labelWithUnit(A.ratedCurrentA, "()")}
          hint="Per phase, as the datasheet rates it."
          error={errors.ratedCurrentA?.message}
          registration={register("ratedCurrentA", num)}
        />
        <NumberField
          id="motor-resistance"
          label={labelWithUnit(A.phaseResistanceOhm, "()")}
          hint="Of one phase winding at 20 °C."
          error={errors.phaseResistanceOhm?.message}
          registration={register("phaseResistanceOhm", num)}
        />
        <NumberField
          id="motor-inductance"
          label={labelWithUnit(A.phaseInductanceMh, "()")}
          hint="Of one phase winding; it limits how fast the current rises at speed."
          error={errors.phaseInductanceMh?.message}
          registration={register("phaseInductanceMh", num)}
        />
        <SelectField
          id="motor-insulation"
          label={A.insulationClass.label}
          hint="The winding’s temperature limit (IEC 60085): B 130 °C, F 155 °C, H 180 °C."
          error={errors.insulationClass?.message}
          registration={register("insulationClass")}
        >
          <option value="B">B (130 °C)</option>
          <option value="F">F (155 °C)</option>
          <option value="H">H (180 °C)</option>
        </SelectField>
      </FormSection>

      <FormSection legend="Heat and iron loss">
        <NumberField
          id="motor-rth"
          label={labelWithUnit(A.thermalResistanceKPerW, "()")}
          hint="Winding to ambient, mounted. Left blank, it follows from the rated temperature rise at rated current (common practice)."
          error={errors.thermalResistanceKPerW?.message}
          registration={register("thermalResistanceKPerW", num)}
        />
        <NumberField
          id="motor-rise"
          label={labelWithUnit(A.ratedTempRiseK, "()")}
          hint="Winding rise over ambient at rated current; 80 K is common practice when the datasheet is silent."
          error={errors.ratedTempRiseK?.message}
          registration={register("ratedTempRiseK", num)}
        />
        <NumberField
          id="motor-hysteresis"
          label={labelWithUnit(A.hysteresisWPerHz, "()")}
          hint="Iron loss proportional to the electrical frequency; 0 when unknown."
          error={errors.hysteresisWPerHz?.message}
          registration={register("hysteresisWPerHz", num)}
        />
        <NumberField
          id="motor-eddy"
          label={labelWithUnit(A.eddyWPerHz2, "()")}
          hint="Iron loss proportional to the square of the electrical frequency; 0 when unknown."
          error={errors.eddyWPerHz2?.message}
          registration={register("eddyWPerHz2", num)}
        />
      </FormSection>

      <FormFooter
        submitting={isSubmitting}
        label={motor ? "Save motor" : "Add motor"}
        status={status}
      />
    </form>
  );
}
