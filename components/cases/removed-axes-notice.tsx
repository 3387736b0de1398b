import type { SessionUser } from "@/lib/auth/session-user";
import { removedAxesOfCase } from "@/server/installed-base/removed-axes";

const WITH = {
  axis: "deleted on its own",
  machine: "deleted with the machine",
  site: "deleted with the site",
} as const;

// Axes taken out of this case by a delete of the installed base since the case was built
// (db/queries/installed-base-delete.ts writes the lines). Renders nothing when there are none.
export function RemovedAxesNotice({ user, caseId }: { user: SessionUser; caseId: number }) {
  const removed = removedAxesOfCase(user, caseId);
  if (removed.length === 0) return null;
  return (
    <section
      aria-labelledby="removed-axes-title"
      className="rounded-panel border border-caution-600 bg-caution-50 p-4 text-small text-steel-900"
    >
      <h2 id="removed-axes-title" className="font-bold">
        Removed from the installed base since this case was built
      </h2>
      <ul className="mt-2 list-disc space-y-1 pl-5">
        {removed.map((r) => (
          <li key={r.id}>
            {r.axisLabel} on {r.machineName} ({WITH[r.removedWith]}), by{" "}
            {r.removedByName ?? "a removed user"}, {r.removedAt.slice(0, 10)}
          </li>
        ))}
      </ul>
    </section>
  );
}
