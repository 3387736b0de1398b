"use client";

import { useState, useTransition } from "react";
import { resendInvitationAction, revokeInvitationAction } from "@/server/invitations/actions";
import { Button } from "@/components/ui/button";

type Result = { ok: true; data: unknown } | { ok: false; message: string };

// For a user still waiting to choose a password: send a new link, or revoke the open one. Revoking
// asks first, in place, because the user can then not sign in until invited again.
export function InvitationActions({
  user,
  linkOpen,
}: {
  user: { id: number; email: string; name: string; active: boolean };
  linkOpen: boolean;
}) {
  const [confirming, setConfirming] = useState(false);
  const [message, setMessage] = useState<{ text: string; ok: boolean } | null>(null);
  const [pending, startTransition] = useTransition();

  function run(action: () => Promise<Result>, done: (data: unknown) => string) {
    setMessage(null);
    startTransition(async () => {
      const result = await action();
      setConfirming(false);
      setMessage(
        result.ok ? { text: done(result.data), ok: true } : { text: result.message, ok: false },
      );
    });
  }

  return (
    <div className="mt-2 flex flex-wrap items-center gap-2">
      {user.active ? (
        <Button
          size="sm"
          variant="secondary"
          disabled={pending}
          onClick={() =>
            run(
              () => resendInvitationAction({ userId: user.id }),
              (data) => {
                const mail = (data as { mail: { status: string; notice?: string } }).mail;
                return mail.status === "sent"
                  ? `A new invitation link was sent to ${user.email}.`
                  : `A new invitation link for ${user.email} is queued. ${mail.notice ?? ""}`;
              },
            )
          }
        >
          Send invitation again
        </Button>
      ) : null}
      {linkOpen && !confirming ? (
        <Button size="sm" variant="danger" disabled={pending} onClick={() => setConfirming(true)}>
          Revoke invitation
        </Button>
      ) : null}
      {confirming ? (
        <div
          role="group"
          aria-label={`Revoke the invitation of ${user.email}`}
          className="flex flex-wrap items-center gap-2 rounded-md border border-danger-600 p-2"
        >
          <p className="text-caption text-steel-800">
            The link sent to {user.name} stops working at once. They stay in the list but cannot
            sign in until invited again.
          </p>
          <Button
            size="sm"
            variant="danger"
            disabled={pending}
            autoFocus
            onClick={() =>
              run(
                () => revokeInvitationAction({ userId: user.id }),
                () => `The invitation link of ${user.email} was revoked.`,
              )
            }
          >
            Yes, revoke the link
          </Button>
          <Button size="sm" variant="secondary" onClick={() => setConfirming(false)}>
            Keep the link
          </Button>
        </div>
      ) : null}
      <span
        aria-live="polite"
        className={`text-caption font-bold ${message?.ok ? "text-success-700" : "text-danger-700"}`}
      >
        {message?.text}
      </span>
    </div>
  );
}
