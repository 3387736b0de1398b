"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import type { ReactNode } from "react";
import { useForm, type FieldErrors } from "react-hook-form";
import type { z } from "zod";
import { saveAxisAction } from "@/server/installed-base/actions";
import { Button } from "@/components/ui/button";
import { Field, Input, Select } from "@/components/ui/field";
import { NumberField, TorqueField } from "@/components/ui/number-field";
import { axisInputSchema, type AxisInput } from "@/lib/validations/installed-base";
import { StatusLine, useActionStatus } from "./use-action-form";

type Values = z.input<typeof axisInputSchema>;
type TorqueKey = "holdingTorqueNm" | "loadTorqueNm" | "peakTorqueNm" | "holdTorqueNm";

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="rounded-panel border border-steel-200 p-4">
      <legend className="px-1 text-body font-bold text-flux-900">{title}</legend>
      <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-3">{children}</div>
    </fieldset>
  );
}

// A torque field's error may sit on the field or on its number ({ value, unit }).
function torqueError(errors: FieldErrors<Values>, key: TorqueKey): string | undefined {
  const e = errors[key] as
    { message?: string; value?: { message?: string }; unit?: { message?: string } } | undefined;
  return e?.message ?? e?.value?.message ?? e?.unit?.message;
}

export function AxisForm({
  siteId,
  machines,
  axis,
  defaults,
}: {
  siteId: number;
  machines: { id: number; name: string }[];
  axis?: { id: number; values: Values };
  defaults: { hoursPerYear: number; ambientC: number };
}) {
  const router = useRouter();
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, AxisInput>({
    resolver: zodResolver(axisInputSchema),
    defaultValues: axis?.values ?? {
      machineId: machines[0]?.id,
      label: "",
      quantity: 1,
      rotorTeeth: 50,
      holdingTorqueNm: { value: undefined as unknown as number, unit: "N·m" },
      loadTorqueNm: { value: undefined as unknown as number, unit: "N·m" },
      peakTorqueNm: { value: undefined as unknown as number, unit: "N·m" },
      holdTorqueNm: { value: 0, unit: "N·m" },
      ratedTempRiseK: 80,
      insulationClass: "B",
      hysteresisWPerHz: 0,
      eddyWPerHz2: 0,
      currentConvention: "peak",
      stepMode: "micro",
      microsteps: 16,
      idleCurrentPct: 50,
      driveEfficiencyPct: 90,
      driveStandbyW: 2,
      hoursPerYear: defaults.hoursPerYear,
      ambientC: defaults.ambientC,
      stepLossEventsPerYear: 0,
      costPerEvent: "0",
      avoidedPct: 90,
    },
  });
  const { status, apply } = useActionStatus(setError);
  const err = (k: keyof Values) => (errors[k] as { message?: string } | undefined)?.message;

  async function onSubmit(values: AxisInput) {
    const result = await saveAxisAction(axis?.id ?? null, values);
    if (apply(result, "Axis saved.")) router.push(`/sites/${siteId}`);
  }

  return (
    <form
      aria-label={axis ? "Edit axis" : "Add an axis"}
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="space-y-5"
    >
      <Group title="Axis">
        <Field
          id="f-label"
          label="Label"
          hint="How the customer names the axis, e.g. Gantry X"
          error={err("label")}
        >
          <Input id="f-label" invalid={!!errors.label} {...register("label")} />
        </Field>
        <Field id="f-machineId" label="Machine" error={err("machineId")}>
          <Select id="f-machineId" {...register("machineId")}>
            {machines.map((m) => (
              <option key={m.id} value={m.id}>
                {m.name}
              </option>
            ))}
          </Select>
        </Field>
        <NumberField
          register={register}
          name="quantity"
          label="Identical axes"
          step="1"
          hint="How many axes share these values"
          error={err("quantity")}
        />
      </Group>

      <Group title="Motor (from its datasheet)">
        <TorqueField
          register={register}
          name="holdingTorqueNm"
          label="Holding torque"
          hint="Torque with both phases at rated current, at standstill"
          error={torqueError(errors, "holdingTorqueNm")}
        />
        <NumberField
          register={register}
          name="ratedCurrentA"
          label="Rated current per phase"
          unit="A"
          error={err("ratedCurrentA")}
        />
        <NumberField
          register={register}
          name="phaseResistanceOhm"
          label="Phase resistance at 20 °C"
          unit="Ω"
          error={err("phaseResistanceOhm")}
        />
        <NumberField
          register={register}
          name="phaseInductanceMh"
          label="Phase inductance"
          unit="mH"
          error={err("phaseInductanceMh")}
        />
        <NumberField
          register={register}
          name="rotorTeeth"
          label="Rotor teeth"
          step="1"
          hint="50 for a 1.8° motor, 100 for 0.9°"
          error={err("rotorTeeth")}
        />
        <Field
          id="f-insulationClass"
          label="Insulation class"
          hint="IEC 60085: B 130 °C, F 155 °C, H 180 °C"
          error={err("insulationClass")}
        >
          <Select id="f-insulationClass" {...register("insulationClass")}>
            <option value="B">B (130 °C)</option>
            <option value="F">F (155 °C)</option>
            <option value="H">H (180 °C)</option>
          </Select>
        </Field>
        <NumberField
          register={register}
          name="ratedTempRiseK"
          label="Rated temperature rise"
          unit="K"
          hint="Winding rise at rated current; 80 K is common practice"
          error={err("ratedTempRiseK")}
        />
        <NumberField
          register={register}
          name="thermalResistanceKPerW"
          label="Thermal resistance, winding to ambient"
          unit="K/W"
          hint="Leave empty to derive it from the rated rise"
          error={err("thermalResistanceKPerW")}
        />
        <NumberField
          register={register}
          name="hysteresisWPerHz"
          label="Hysteresis loss coefficient"
          unit="W/Hz"
          hint="Iron loss per electrical hertz; 0 if unknown"
          error={err("hysteresisWPerHz")}
        />
        <NumberField
          register={register}
          name="eddyWPerHz2"
          label="Eddy-current loss coefficient"
          unit="W/Hz²"
          hint="0 if unknown"
          error={err("eddyWPerHz2")}
        />
      </Group>

      <Group title="Drive (as set today)">
        <NumberField
          register={register}
          name="busVoltageV"
          label="Bus voltage"
          unit="V"
          error={err("busVoltageV")}
        />
        <NumberField
          register={register}
          name="currentSettingA"
          label="Current setting per phase"
          unit="A"
          error={err("currentSettingA")}
        />
        <Field
          id="f-currentConvention"
          label="The setting is"
          hint="Peak or RMS; RMS applies to microstepping only"
          error={err("currentConvention")}
        >
          <Select id="f-currentConvention" {...register("currentConvention")}>
            <option value="peak">Peak</option>
            <option value="rms">RMS</option>
          </Select>
        </Field>
        <Field id="f-stepMode" label="Step mode" error={err("stepMode")}>
          <Select id="f-stepMode" {...register("stepMode")}>
            <option value="micro">Microstep</option>
            <option value="full">Full step (two phases on)</option>
            <option value="half">Half step</option>
            <option value="half-compensated">Half step, compensated</option>
          </Select>
        </Field>
        <NumberField
          register={register}
          name="microsteps"
          label="Microsteps per full step"
          step="1"
          error={err("microsteps")}
        />
        <NumberField
          register={register}
          name="idleCurrentPct"
          label="Standstill current"
          unit="% of setting"
          error={err("idleCurrentPct")}
        />
        <NumberField
          register={register}
          name="driveEfficiencyPct"
          label="Drive efficiency"
          unit="%"
          error={err("driveEfficiencyPct")}
        />
        <NumberField
          register={register}
          name="driveStandbyW"
          label="Drive standby power"
          unit="W"
          error={err("driveStandbyW")}
        />
      </Group>

      <Group title="Duty">
        <NumberField
          register={register}
          name="hoursPerYear"
          label="Running hours per year"
          unit="h"
          error={err("hoursPerYear")}
        />
        <NumberField
          register={register}
          name="movePct"
          label="Moving"
          unit="% of hours"
          error={err("movePct")}
        />
        <NumberField
          register={register}
          name="holdPct"
          label="Holding at standstill"
          unit="% of hours"
          hint="The rest of the hours the motor is off"
          error={err("holdPct")}
        />
        <NumberField
          register={register}
          name="speedRpm"
          label="Speed while moving"
          unit="rpm"
          error={err("speedRpm")}
        />
        <TorqueField
          register={register}
          name="loadTorqueNm"
          label="Load torque (RMS while moving)"
          hint="Friction, process force and the acceleration share"
          error={torqueError(errors, "loadTorqueNm")}
        />
        <TorqueField
          register={register}
          name="peakTorqueNm"
          label="Peak torque while moving"
          hint="The highest torque, usually while accelerating"
          error={torqueError(errors, "peakTorqueNm")}
        />
        <TorqueField
          register={register}
          name="holdTorqueNm"
          label="Load at standstill"
          hint="Gravity on a vertical axis, web tension; needs a brake and safe stop"
          error={torqueError(errors, "holdTorqueNm")}
        />
        <NumberField
          register={register}
          name="ambientC"
          label="Ambient"
          unit="°C"
          error={err("ambientC")}
        />
      </Group>

      <Group title="Reliability">
        <NumberField
          register={register}
          name="stepLossEventsPerYear"
          label="Lost-step events per year"
          error={err("stepLossEventsPerYear")}
        />
        <Field
          id="f-costPerEvent"
          label="Cost of one event"
          hint="Scrap, rework and downtime of one lost-step stop"
          error={err("costPerEvent")}
        >
          <Input
            id="f-costPerEvent"
            inputMode="decimal"
            invalid={!!errors.costPerEvent}
            {...register("costPerEvent")}
          />
        </Field>
        <NumberField
          register={register}
          name="avoidedPct"
          label="Events the closed loop avoids"
          unit="%"
          error={err("avoidedPct")}
        />
      </Group>

      <div className="flex items-center gap-4">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : "Save axis"}
        </Button>
        <StatusLine status={status} />
      </div>
    </form>
  );
}
