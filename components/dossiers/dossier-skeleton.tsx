import { Skeleton } from "@/components/ui/panel";

/**
 * What the reader sees while the dossier's draws run (a second or more for a large case): the
 * report's own outline — three headline cards, the uncertainty summary, two charts side by
 * side, the payback grid and the tables — so the page does not jump when the figures arrive.
 */
export function DossierSkeleton() {
  const card = (lines: number, key: number) => (
    <div key={key} className="space-y-3 rounded-panel border border-steel-200 bg-white p-5">
      <Skeleton className="h-5 w-40" />
      <Skeleton className="h-9 w-48" />
      {Array.from({ length: lines }, (_, j) => (
        <Skeleton key={j} className="h-4 w-full" />
      ))}
    </div>
  );
  const chart = (key: number) => (
    <div key={key} className="space-y-3 rounded-panel border border-steel-200 bg-white p-5">
      <Skeleton className="h-5 w-56" />
      <Skeleton className="h-64 w-full" />
    </div>
  );
  return (
    <div role="status" aria-label="Computing the dossier" className="space-y-6">
      <p className="text-small text-steel-700">
        Computing the dossier: the engine runs every draw of the uncertainty ranges. The report
        appears here when it is done.
      </p>
      <div className="grid gap-4 md:grid-cols-3">{[0, 1, 2].map((i) => card(5, i))}</div>
      {card(3, 3)}
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">{[0, 1].map(chart)}</div>
      {card(8, 4)}
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">{[2, 3, 4, 5].map(chart)}</div>
      {card(10, 5)}
    </div>
  );
}
