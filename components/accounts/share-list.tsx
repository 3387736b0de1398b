"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useState, useTransition } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod";
import { shareAccountAction, unshareAccountAction } from "@/server/accounts/actions";
import { StatusLine, useActionStatus } from "@/components/installed-base/use-action-form";
import { Button } from "@/components/ui/button";
import { Field, Select } from "@/components/ui/field";
import { shareAccountSchema } from "@/lib/validations/account";

type Person = { id: number; name: string };

// The engineers an account is shared with (they read and edit it like the owner), with a way to
// add one and to stop sharing, for the callers allowed to change it.
export function ShareList({
  accountId,
  shares,
  candidates,
  canShare,
}: {
  accountId: number;
  shares: (Person & { active: boolean })[];
  candidates: Person[];
  canShare: boolean;
}) {
  const {
    register,
    handleSubmit,
    setError,
    reset,
    formState: { errors, isSubmitting },
  } = useForm<z.input<typeof shareAccountSchema>, unknown, z.infer<typeof shareAccountSchema>>({
    resolver: zodResolver(shareAccountSchema),
    defaultValues: { accountId, userId: "" },
  });
  const { status, setStatus, apply } = useActionStatus(setError);
  const [pending, startTransition] = useTransition();
  const [removing, setRemoving] = useState<number | null>(null);

  async function onShare(values: z.infer<typeof shareAccountSchema>) {
    const name = candidates.find((c) => c.id === values.userId)?.name ?? "the engineer";
    if (apply(await shareAccountAction(values), `Shared with ${name}.`))
      reset({ accountId, userId: "" });
  }

  function stopSharing(person: Person) {
    setRemoving(person.id);
    startTransition(async () => {
      const result = await unshareAccountAction({ accountId, userId: person.id });
      setStatus(
        result.ok
          ? { tone: "ok", text: `No longer shared with ${person.name}.` }
          : { tone: "error", text: result.message },
      );
      setRemoving(null);
    });
  }

  return (
    <div className="space-y-3">
      {shares.length === 0 ? (
        <p className="text-steel-700">Not shared with any other engineer.</p>
      ) : (
        <ul aria-label="Shared with" className="divide-y divide-steel-100">
          {shares.map((s) => (
            <li key={s.id} className="flex flex-wrap items-center justify-between gap-2 py-2">
              <span>
                {s.name}
                {s.active ? null : <span className="text-steel-600"> (deactivated)</span>}
              </span>
              {canShare ? (
                <Button
                  variant="secondary"
                  size="sm"
                  aria-label={`Stop sharing with ${s.name}`}
                  disabled={pending && removing === s.id}
                  onClick={() => stopSharing(s)}
                >
                  Stop sharing
                </Button>
              ) : null}
            </li>
          ))}
        </ul>
      )}
      {canShare ? (
        <form
          aria-label="Share account"
          onSubmit={handleSubmit(onShare)}
          noValidate
          className="flex flex-wrap items-end gap-3"
        >
          <div className="w-full max-w-xs">
            <Field
              id="share-engineer"
              label="Engineer to share with"
              error={errors.userId?.message}
            >
              <Select id="share-engineer" invalid={!!errors.userId} {...register("userId")}>
                <option value="">Choose an engineer</option>
                {candidates.map((c) => (
                  <option key={c.id} value={c.id}>
                    {c.name}
                  </option>
                ))}
              </Select>
            </Field>
          </div>
          <Button type="submit" variant="secondary" disabled={isSubmitting}>
            Share
          </Button>
        </form>
      ) : null}
      <StatusLine status={status} />
    </div>
  );
}
