"use client";

import { usePathname, useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { Button } from "@/components/ui/button";
import { undoDeletionAction } from "@/server/installed-base/delete-actions";

// "Deleted machine Press 4. Undo", shown while the undo lasts (the server keeps the rows for
// UNDO_SECONDS, db/queries/installed-base-delete.ts); it goes away by itself when it expires.
export function UndoNotice({
  undoId,
  label,
  expiresAt,
}: {
  undoId: number;
  label: string;
  expiresAt: string;
}) {
  const router = useRouter();
  const pathname = usePathname();
  const [state, setState] = useState<"open" | "busy" | "done" | "gone">("open");
  const [message, setMessage] = useState<string | null>(null);

  useEffect(() => {
    const left = new Date(expiresAt).getTime() - Date.now();
    const timer = setTimeout(() => setState((s) => (s === "open" ? "gone" : s)), Math.max(0, left));
    return () => clearTimeout(timer);
  }, [expiresAt]);

  async function undo() {
    setState("busy");
    const result = await undoDeletionAction(undoId);
    if (result.ok) {
      setState("done");
      setMessage(`Restored ${label}.`);
      router.replace(pathname);
      router.refresh();
    } else {
      setState("open");
      setMessage(result.message);
    }
  }

  if (state === "gone" && !message) return null;
  return (
    <div
      role="status"
      aria-live="polite"
      className="flex flex-wrap items-center gap-3 rounded-panel border border-steel-300 bg-steel-50 px-4 py-3 text-small"
    >
      {state === "done" ? (
        <span className="font-bold text-success-700">{message}</span>
      ) : (
        <>
          <span>Deleted {label}.</span>
          {state !== "gone" ? (
            <Button size="sm" variant="secondary" onClick={undo} disabled={state === "busy"}>
              Undo
            </Button>
          ) : null}
          {message ? <span className="font-bold text-danger-700">{message}</span> : null}
        </>
      )}
    </div>
  );
}
