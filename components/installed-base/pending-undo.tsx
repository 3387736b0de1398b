import type { getPendingUndo } from "@/db/queries/installed-base-delete";
import { UndoNotice } from "./undo-notice";

// The "Deleted X. Undo" line of the page a delete lands on, when the caller's undo still lasts.
export function PendingUndo({ pending }: { pending: ReturnType<typeof getPendingUndo> }) {
  if (!pending) return null;
  return <UndoNotice undoId={pending.id} label={pending.label} expiresAt={pending.expiresAt} />;
}
