"use client";

import { useRouter } from "next/navigation";
import { useId, useRef, useState } from "react";
import { Button } from "@/components/ui/button";
import {
  deleteAxisAction,
  deleteMachineAction,
  deleteSiteAction,
} from "@/server/installed-base/delete-actions";

const ACTIONS = { site: deleteSiteAction, machine: deleteMachineAction, axis: deleteAxisAction };

// "Delete machine" opens a native dialog (keyboard: Tab between the buttons, Escape closes) that
// says what goes with it, counted on the server (db/queries/installed-base-impact.ts). After the
// delete, the page named by `afterHref` shows "Deleted … Undo" for the undo's short life.
export function DeleteDialog({
  kind,
  id,
  name,
  impact,
  blocked = false,
  afterHref,
}: {
  kind: keyof typeof ACTIONS;
  id: number;
  name: string;
  impact: string;
  blocked?: boolean;
  afterHref: string;
}) {
  const dialog = useRef<HTMLDialogElement>(null);
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const titleId = useId();
  const textId = useId();

  async function confirm() {
    setBusy(true);
    setError(null);
    const result = await ACTIONS[kind](id);
    setBusy(false);
    if (!result.ok) {
      setError(result.message);
      return;
    }
    dialog.current?.close();
    const join = afterHref.includes("?") ? "&" : "?";
    router.push(`${afterHref}${join}deleted=${result.data.undoId}`);
  }

  return (
    <>
      <Button variant="danger" onClick={() => dialog.current?.showModal()}>
        Delete {kind}
      </Button>
      {/* m-auto: the base styles zero every margin, which would pin the modal to the corner. */}
      <dialog
        ref={dialog}
        aria-labelledby={titleId}
        aria-describedby={textId}
        className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-panel border border-steel-200 p-5 shadow-panel backdrop:bg-steel-950/40"
      >
        <h2 id={titleId} className="text-lead font-bold text-steel-900">
          Delete {kind} {name}?
        </h2>
        <p id={textId} className="mt-3 text-body text-steel-800">
          {impact}
        </p>
        {error ? (
          <p role="alert" className="mt-3 text-small font-bold text-danger-700">
            {error}
          </p>
        ) : null}
        <div className="mt-5 flex flex-wrap justify-end gap-3">
          <Button variant="secondary" onClick={() => dialog.current?.close()} autoFocus>
            Cancel
          </Button>
          {blocked ? null : (
            <Button variant="danger" onClick={confirm} disabled={busy}>
              {busy ? "Deleting…" : `Yes, delete ${kind} ${name}`}
            </Button>
          )}
        </div>
      </dialog>
    </>
  );
}
