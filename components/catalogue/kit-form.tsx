"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, type DefaultValues } from "react-hook-form";
import { saveKitAction } from "@/server/catalogue/actions";
import type { Kit } from "@/db/schema/catalogue";
import type { z } from "zod";
import { kitInputSchema, type KitCatalogueInput } from "@/lib/validations/catalogue";
import {
  FormFooter,
  FormSection,
  NumberField,
  SelectField,
  TextField,
  asNumber,
} from "@/components/ui/form-fields";
import { KIT_FIELDS as K, labelWithUnit } from "@/lib/fields";

type KitFormValues = z.input<typeof kitInputSchema>;

export type KitMotorOption = { id: number; code: string; name: string; active: boolean };

// A new kit starts with the schema defaults (docs/model.md KitInput) filled in.
// A new kit starts from the registry's defaults (lib/fields/kit.ts).
function defaults(kit?: Kit): DefaultValues<KitFormValues> {
  if (!kit) {
    return {
      code: "",
      name: "",
      price: "",
      currency: "EUR",
      sensing: K.sensing.default,
      motorId: "",
      maxCurrentPeakA: undefined,
      busVoltageV: undefined,
      efficiencyPct: K.efficiencyPct.default,
      standbyW: K.standbyW.default,
      encoderW: undefined,
      minCurrentPct: K.minCurrentPct.default,
      sensorlessMinRpm: K.sensorlessMinRpm.default,
    };
  }
  return {
    code: kit.code,
    name: kit.name,
    price: kit.price,
    currency: kit.currency,
    sensing: kit.sensing,
    motorId: kit.motorId == null ? "" : String(kit.motorId),
    maxCurrentPeakA: kit.maxCurrentPeakA ?? undefined,
    busVoltageV: kit.busVoltageV ?? undefined,
    efficiencyPct: kit.efficiencyPct,
    standbyW: kit.standbyW,
    encoderW: kit.encoderW ?? undefined,
    minCurrentPct: kit.minCurrentPct,
    sensorlessMinRpm: kit.sensorlessMinRpm,
  };
}

export function KitForm({ kit, motors }: { kit?: Kit; motors: KitMotorOption[] }) {
  const router = useRouter();
  const [status, setStatus] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<KitFormValues, unknown, KitCatalogueInput>({
    resolver: zodResolver(kitInputSchema),
    defaultValues: defaults(kit),
  });
  const num = { setValueAs: asNumber };

  async function onSubmit(values: KitCatalogueInput) {
    setStatus(null);
    // The server parses the values again: what reaches the database is what it checked.
    const result = await saveKitAction(values, kit?.id);
    if (result.ok) {
      router.push("/catalogue");
      return;
    }
    for (const [field, message] of Object.entries(result.fieldErrors)) {
      setError(field as keyof KitFormValues, { message });
    }
    setStatus(result.message);
  }

  return (
    <form
      aria-label={kit ? `Edit kit ${kit.code}` : "Add a kit"}
      onSubmit={handleSubmit(onSubmit, () => setStatus("Check the highlighted fields."))}
      noValidate
      className="space-y-6"
    >
      <FormSection legend="Kit and price">
        <TextField
          id="kit-code"
          label="Code"
          hint="Short and unique: letters, digits, dot, dash or underscore."
          error={errors.code?.message}
          registration={register("code")}
        />
        <TextField
          id="kit-name"
          label="Name"
          hint="How engineers and customers will see it in a proposal."
          error={errors.name?.message}
          registration={register("name")}
        />
        <TextField
          id="kit-price"
          label="Price per axis"
          hint="List price of one kit before the case's discount, e.g. 189.00; kept exact."
          inputMode="decimal"
          error={errors.price?.message}
          registration={register("price")}
        />
        <TextField
          id="kit-currency"
          label="Currency"
          hint="Three-letter ISO 4217 code, e.g. EUR."
          error={errors.currency?.message}
          registration={register("currency")}
        />
      </FormSection>

      <FormSection legend="Drive and motor">
        <SelectField
          id="kit-sensing"
          label={K.sensing.label}
          hint="Sensorless estimates the rotor position from the back-EMF, so it runs open loop at low speed."
          error={errors.sensing?.message}
          registration={register("sensing")}
        >
          <option value="encoder">Encoder</option>
          <option value="sensorless">Sensorless</option>
        </SelectField>
        <SelectField
          id="kit-motor"
          label="Kit motor"
          hint="A new closed-loop motor that replaces the axis motor, or none to drive the motor already on the axis."
          error={errors.motorId?.message}
          registration={register("motorId")}
        >
          <option value="">None: keeps the axis motor</option>
          {motors.map((m) => (
            <option key={m.id} value={String(m.id)}>
              {m.name} ({m.code}){m.active ? "" : ", retired"}
            </option>
          ))}
        </SelectField>
        <NumberField
          id="kit-max-current"
          label={labelWithUnit(K.maxCurrentPeakA, "()")}
          hint="Peak current per phase the drive may give. Left blank: √2 × the rated current of the motor the kit drives."
          error={errors.maxCurrentPeakA?.message}
          registration={register("maxCurrentPeakA", num)}
        />
        <NumberField
          id="kit-bus"
          label={labelWithUnit(K.busVoltageV, "()")}
          hint="Supply voltage of the kit's drive; it limits the current at speed. Left blank: the axis drive's."
          error={errors.busVoltageV?.message}
          registration={register("busVoltageV", num)}
        />
      </FormSection>

      <FormSection legend="Power and control">
        <NumberField
          id="kit-efficiency"
          label={labelWithUnit(K.efficiencyPct, "()")}
          hint="Of the kit's drive electronics; the loss heats the cabinet."
          error={errors.efficiencyPct?.message}
          registration={register("efficiencyPct", num)}
        />
        <NumberField
          id="kit-standby"
          label={labelWithUnit(K.standbyW, "()")}
          hint="What the drive draws whenever it is powered, moving or not."
          error={errors.standbyW?.message}
          registration={register("standbyW", num)}
        />
        <NumberField
          id="kit-encoder"
          label={labelWithUnit(K.encoderW, "()")}
          hint="Added to standby. Left blank: 0.5 W with an encoder, 0 when sensorless."
          error={errors.encoderW?.message}
          registration={register("encoderW", num)}
        />
        <NumberField
          id="kit-min-current"
          label={labelWithUnit(K.minCurrentPct, "()")}
          hint="Floor of the torque current, so a lightly loaded axis still holds its position."
          error={errors.minCurrentPct?.message}
          registration={register("minCurrentPct", num)}
        />
        <NumberField
          id="kit-sensorless-rpm"
          label={labelWithUnit(K.sensorlessMinRpm, "()")}
          hint="Sensorless kits only: below this speed the drive runs open loop at max current."
          error={errors.sensorlessMinRpm?.message}
          registration={register("sensorlessMinRpm", num)}
        />
      </FormSection>

      <FormFooter submitting={isSubmitting} label={kit ? "Save kit" : "Add kit"} status={status} />
    </form>
  );
}
