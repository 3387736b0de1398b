"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { useForm } from "react-hook-form";
import { sendProposalAction } from "@/server/proposals/actions";
import { Field, Input } from "@/components/ui/field";
import { sendProposalSchema, type SendProposalInput } from "@/lib/validations/pipeline";
import { SubmitRow, type FormMessage } from "@/components/ui/submit-row";

type Reviewer = { id: number; name: string; email: string };

/** Sends the proposal to the customer's reviewer, inviting them when they are new. */
export function SendForm({
  proposalId,
  accountName,
  reviewers,
  resend,
}: {
  proposalId: number;
  accountName: string;
  reviewers: Reviewer[];
  resend: boolean;
}) {
  const [message, setMessage] = useState<FormMessage>(null);
  const {
    register,
    handleSubmit,
    setValue,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SendProposalInput>({
    resolver: zodResolver(sendProposalSchema),
    defaultValues: { email: reviewers[0]?.email ?? "", name: reviewers[0]?.name ?? "" },
  });

  async function onSubmit(values: SendProposalInput) {
    setMessage(null);
    const result = await sendProposalAction(proposalId, values);
    if (!result.ok) {
      for (const [field, text] of Object.entries(result.fieldErrors))
        if (field === "email" || field === "name") setError(field, { message: text });
      return setMessage({ tone: "error", text: result.message });
    }
    const { reviewer, mail } = result.data;
    const who = `${reviewer.name} <${reviewer.email}>`;
    setMessage(
      mail.status === "queued"
        ? {
            tone: "caution",
            text: `Sent to ${who}: the stage is now "With the customer". ${mail.notice}`,
          }
        : {
            tone: "ok",
            text: reviewer.invited
              ? `Sent to ${who} with an invitation to choose a password (valid 7 days).`
              : `Sent to ${who}; they review it in their portal.`,
          },
    );
  }

  return (
    <form
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      aria-label="Send to the reviewer"
      className="space-y-4"
    >
      <p className="text-small text-steel-700">
        The reviewer is the finance person at {accountName} who decides on the payback. A new
        address gets a reviewer account for {accountName} and a single-use link to choose a
        password.
      </p>
      {reviewers.length > 1 ? (
        <div className="flex flex-wrap gap-2 text-small">
          <span className="text-steel-700">Reviewers of this account:</span>
          {reviewers.map((r) => (
            <button
              key={r.id}
              type="button"
              className="font-bold text-flux-700 hover:underline"
              onClick={() => {
                setValue("email", r.email);
                setValue("name", r.name);
              }}
            >
              {r.name}
            </button>
          ))}
        </div>
      ) : null}
      <div className="grid gap-4 md:grid-cols-2">
        <Field id="send-email" label="Reviewer's e-mail" error={errors.email?.message}>
          <Input
            id="send-email"
            type="email"
            autoComplete="off"
            invalid={!!errors.email}
            {...register("email")}
          />
        </Field>
        <Field id="send-name" label="Reviewer's name" error={errors.name?.message}>
          <Input id="send-name" autoComplete="off" invalid={!!errors.name} {...register("name")} />
        </Field>
      </div>
      <SubmitRow
        label={resend ? "Send again" : "Send the proposal"}
        pending={isSubmitting}
        pendingLabel="Sending…"
        message={message}
      />
    </form>
  );
}
