"use client";

import { useMemo } from "react";
import { Badge } from "@/components/ui/badge";
import { Button } from "@/components/ui/button";
import { Panel, Skeleton } from "@/components/ui/panel";
import type { CaseResult, ParsedCase } from "@/lib/engine";
import {
  CaseRequestError,
  useCaseResult,
  type CaseId,
  type StoredProblemView,
} from "@/lib/hooks/use-case-result";
import { parseCaseInput } from "@/lib/results/case-view";
import { AxisResultsTable } from "./axis-results-table";
import { BreakEvenPanel } from "./break-even-panel";
import { CashFlowChart } from "./cash-flow-chart";
import { CautionsPanel } from "./cautions-panel";
import { EnergyByMachineChart } from "./energy-by-machine-chart";
import { EvidenceSources } from "./evidence-sources";
import { HeadlineCards, type CaseEvidence } from "./headline-cards";
import { MethodLink } from "./method-link";
import { MotionTable } from "./motion-table";
import { TornadoChart } from "./tornado-chart";
import { TorqueSpeedChart } from "./torque-speed-chart";
import { ValueBySourceChart } from "./value-by-source-chart";
import { ValueByMachineTable } from "./value-by-machine-table";
import { ValueBySourceTable } from "./value-by-source-table";
import { WarningsPanel } from "./warnings-panel";
import { WindingTemperatureChart } from "./winding-temperature-chart";

/**
 * The live results of a case. While an edit recomputes, the last result stays on screen under
 * an "Updating…" badge, so the reader sees the numbers move instead of a blank page.
 */
export function CaseResults({
  caseId,
  methodHref,
  evidence,
}: {
  caseId: CaseId;
  methodHref: string;
  /** The sources recorded for the case's typed figures: the headline weighs them. */
  evidence?: CaseEvidence;
}) {
  const resultQuery = useCaseResult(caseId);
  const rawInput = resultQuery.data?.input;
  const input = useMemo(() => parseCaseInput(rawInput), [rawInput]);

  if (resultQuery.data === undefined) {
    if (resultQuery.isError) {
      return <ResultsError error={resultQuery.error} onRetry={() => void resultQuery.refetch()} />;
    }
    return <CaseResultsSkeleton />;
  }

  return (
    <CaseResultsView
      result={resultQuery.data.result}
      input={input}
      methodHref={methodHref}
      evidence={evidence}
      updating={resultQuery.isFetching}
      inputState={input ? "ready" : "failed"}
      staleError={resultQuery.isError ? resultQuery.error : null}
      onRetry={() => void resultQuery.refetch()}
    />
  );
}

/** The results themselves, from a result and its input; also what a frozen proposal shows. */
export function CaseResultsView({
  result,
  input,
  methodHref,
  updating = false,
  inputState = "ready",
  staleError = null,
  onRetry,
  evidence,
}: {
  result: CaseResult;
  input: ParsedCase | null;
  /** The method page of the caller's shell. */
  methodHref: string;
  evidence?: CaseEvidence;
  updating?: boolean;
  inputState?: "loading" | "ready" | "failed";
  staleError?: Error | null;
  onRetry?: () => void;
}) {
  return (
    <div className="space-y-6" aria-busy={updating}>
      <div className="flex min-h-7 flex-wrap items-center justify-between gap-3">
        <p aria-live="polite" role="status" className="flex items-center gap-2">
          {updating ? <Badge tone="caution">Updating…</Badge> : null}
          <span className="text-caption text-steel-600">
            Computed by engine {result.engineVersion} · amounts in {result.currency}
          </span>
        </p>
        <MethodLink href={methodHref} />
        {staleError ? (
          <p role="alert" className="flex items-center gap-2 text-small text-danger-700">
            The latest change could not be computed; these are the last results.
            {onRetry ? (
              <Button variant="secondary" size="sm" onClick={onRetry}>
                Try again
              </Button>
            ) : null}
          </p>
        ) : null}
      </div>

      <HeadlineCards result={result} input={input} evidence={evidence} />
      <BreakEvenPanel result={result} input={input} />

      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        {input ? (
          <TorqueSpeedChart result={result} input={input} />
        ) : (
          <InputPending title="Torque against speed" state={inputState} onRetry={onRetry} />
        )}
        <CashFlowChart result={result} input={input} />
        {/* Full width: its table has a column per scenario, plain and discounted. */}
        <div className="min-w-0 xl:col-span-2">
          <ValueBySourceChart result={result} input={input} />
        </div>
        <EnergyByMachineChart result={result} input={input} />
        <TornadoChart result={result} input={input} />
        <WindingTemperatureChart result={result} input={input} />
        <CautionsPanel result={result} input={input} />
      </div>

      <ValueBySourceTable result={result} />
      <ValueByMachineTable result={result} input={input} />
      {evidence && input ? (
        <EvidenceSources
          result={result}
          input={input}
          caseId={evidence.caseId}
          index={evidence.index}
        />
      ) : null}
      <MotionTable result={result} input={input} />
      <WarningsPanel result={result} input={input} />
      <AxisResultsTable result={result} input={input} />
    </div>
  );
}

function InputPending({
  title,
  state,
  onRetry,
}: {
  title: string;
  state: "loading" | "ready" | "failed";
  onRetry?: () => void;
}) {
  return (
    <Panel title={title}>
      {state === "failed" ? (
        <div role="alert" className="space-y-3">
          <p className="text-steel-700">
            The curves need the case&apos;s axes, which could not be loaded.
          </p>
          {onRetry ? (
            <Button variant="secondary" size="sm" onClick={onRetry}>
              Try again
            </Button>
          ) : null}
        </div>
      ) : (
        <Skeleton className="h-80 w-full" />
      )}
    </Panel>
  );
}

function ResultsError({ error, onRetry }: { error: Error; onRetry: () => void }) {
  const notFound = error instanceof CaseRequestError && error.status === 404;
  if (error instanceof CaseRequestError && error.status === 409 && error.problems.length > 0)
    return <StoredValuesError problems={error.problems} />;
  return (
    <div role="alert" className="rounded-panel border border-danger-600 bg-white p-6">
      <h2 className="text-title text-danger-700">
        {notFound ? "This case could not be found" : "The results could not be computed"}
      </h2>
      <p className="mt-2 text-steel-700">
        {notFound
          ? "It may have been removed, or it is not shared with you."
          : "Your inputs are saved. Try again; if it keeps failing, check the case's inputs for values the engine cannot use."}
      </p>
      {notFound ? null : (
        <Button className="mt-4" onClick={onRetry}>
          Try again
        </Button>
      )}
    </div>
  );
}

/**
 * Stored values the engine refuses (saved before its bounds): each named with its machine, axis,
 * field and allowed range, with a link to the page where it is corrected. Retrying cannot help.
 */
function StoredValuesError({ problems }: { problems: readonly StoredProblemView[] }) {
  return (
    <div role="alert" className="rounded-panel border border-danger-600 bg-white p-6">
      <h2 className="text-title text-danger-700">
        {problems.length === 1
          ? "One stored value is outside the range the engine accepts"
          : `${problems.length} stored values are outside the ranges the engine accepts`}
      </h2>
      <p className="mt-2 text-steel-700">
        They were saved before these ranges were checked and are kept as they are. Correct them and
        the results appear.
      </p>
      <ul className="mt-3 list-disc space-y-2 pl-5 text-steel-800">
        {problems.map((p, i) => (
          <li key={i}>
            {p.text}{" "}
            <a className="font-semibold text-flux-700 underline" href={p.fixAt.href}>
              Open it
            </a>
          </li>
        ))}
      </ul>
    </div>
  );
}

/** Grey stand-ins in the shape of the results, while the first result loads. */
export function CaseResultsSkeleton() {
  return (
    <div role="status" aria-busy="true" aria-label="Loading results" className="space-y-6">
      <div className="grid gap-4 md:grid-cols-3">
        {[0, 1, 2].map((i) => (
          <div key={i} className="space-y-3 rounded-panel border border-steel-200 bg-white p-5">
            <Skeleton className="h-5 w-40" />
            <Skeleton className="h-9 w-48" />
            {[0, 1, 2, 3, 4, 5].map((j) => (
              <Skeleton key={j} className="h-4 w-full" />
            ))}
          </div>
        ))}
      </div>
      <div className="grid grid-cols-1 gap-6 xl:grid-cols-2">
        {[0, 1, 2, 3].map((i) => (
          <div key={i} className="space-y-3 rounded-panel border border-steel-200 bg-white p-5">
            <Skeleton className="h-5 w-56" />
            <Skeleton className="h-72 w-full" />
          </div>
        ))}
      </div>
    </div>
  );
}
