"use client";

import { useEffect, useRef, useState, useTransition } from "react";
import { archiveAccountAction, restoreAccountAction } from "@/server/accounts/actions";
import { StatusLine } from "@/components/installed-base/use-action-form";
import { Button, buttonClass } from "@/components/ui/button";

// Archiving asks once more, in place, saying what it does; restoring needs no second step
// because it only brings the account back.
export function ArchiveControl({
  accountId,
  name,
  archived,
}: {
  accountId: number;
  name: string;
  archived: boolean;
}) {
  const [confirming, setConfirming] = useState(false);
  const [status, setStatus] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [pending, startTransition] = useTransition();
  const confirmRef = useRef<HTMLButtonElement>(null);
  const mainRef = useRef<HTMLButtonElement>(null);
  // The confirm step takes the focus when it opens; when it closes, or the account flips
  // between archived and restored, the focus goes to the button that replaced it (not the page).
  const moved = useRef(false);
  useEffect(() => {
    if (confirming) {
      confirmRef.current?.focus();
      moved.current = true;
    } else if (moved.current) {
      mainRef.current?.focus();
    }
  }, [confirming, archived]);

  function run(action: typeof archiveAccountAction, okText: string) {
    startTransition(async () => {
      const result = await action({ accountId });
      setStatus(result.ok ? { tone: "ok", text: okText } : { tone: "error", text: result.message });
      setConfirming(false);
    });
  }

  return (
    <div className="space-y-3">
      {archived ? (
        <button
          ref={mainRef}
          type="button"
          className={buttonClass("secondary")}
          disabled={pending}
          onClick={() => {
            moved.current = true;
            run(restoreAccountAction, `${name} is restored.`);
          }}
        >
          Restore account
        </button>
      ) : confirming ? (
        <div
          role="group"
          aria-label="Confirm archiving"
          className="space-y-3 rounded-md border border-caution-700 bg-caution-50 p-4"
        >
          <p className="text-steel-900">
            Archiving {name} takes it off the accounts list and out of the site choice for new
            cases, and no sites or cases can be added to it until it is restored. Nothing is
            deleted: its sites, cases, proposals and pipeline history stay readable here, and its
            engineers keep their access.
          </p>
          <div className="flex flex-wrap gap-3">
            <button
              ref={confirmRef}
              type="button"
              className={buttonClass("danger")}
              disabled={pending}
              onClick={() => run(archiveAccountAction, `${name} is archived.`)}
            >
              Yes, archive account
            </button>
            <Button variant="secondary" onClick={() => setConfirming(false)}>
              Keep account
            </Button>
          </div>
        </div>
      ) : (
        <button
          ref={mainRef}
          type="button"
          className={buttonClass("danger")}
          onClick={() => setConfirming(true)}
        >
          Archive account
        </button>
      )}
      <StatusLine status={status} />
    </div>
  );
}
