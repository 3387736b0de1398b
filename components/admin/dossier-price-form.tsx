"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { setDossierPriceAction } from "@/server/dossiers/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { TextField } from "@/components/ui/form-fields";
import { dossierPriceSchema, type DossierPrice } from "@/lib/validations/dossier";

type Values = z.input<typeof dossierPriceSchema>;

/** The price every checkout of a dossier uses; the browser never names an amount. */
export function DossierPriceForm({ values }: { values: DossierPrice }) {
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<Values, unknown, DossierPrice>({
    resolver: zodResolver(dossierPriceSchema),
    defaultValues: values,
  });
  const { status, apply } = useActionStatus(setError);
  return (
    <form
      aria-label="Dossier price"
      noValidate
      onSubmit={handleSubmit(async (data) =>
        apply(await setDossierPriceAction(data), "Saved. New checkouts use this price."),
      )}
      className="space-y-3"
    >
      <div className="grid max-w-lg gap-4 sm:grid-cols-2">
        <TextField
          id="price-amount"
          label="Price per dossier"
          hint="Per proposal version, e.g. 490.00"
          inputMode="decimal"
          error={errors.amount?.message}
          registration={register("amount")}
        />
        <TextField
          id="price-currency"
          label="Currency"
          hint="ISO 4217 code, e.g. EUR"
          error={errors.currency?.message}
          registration={register("currency")}
        />
      </div>
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Saving…" : "Save the price"}
      </Button>
      <StatusLine status={status} />
    </form>
  );
}
