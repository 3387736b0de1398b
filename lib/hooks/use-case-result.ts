import {
  keepPreviousData,
  useQuery,
  useQueryClient,
  type QueryClient,
} from "@tanstack/react-query";
import { useCallback, useEffect, useRef } from "react";
import type { CaseInput, CaseResult } from "@/lib/engine";

/** Case ids are numbers in the database and strings in a URL; the keys use one form. */
export type CaseId = string | number;

/** One key factory for a case: invalidating `detail(id)` refreshes the case and its result. */
export const caseKeys = {
  all: ["cases"] as const,
  detail: (caseId: CaseId) => [...caseKeys.all, String(caseId)] as const,
  result: (caseId: CaseId) => [...caseKeys.detail(caseId), "result"] as const,
};

/** What `GET /api/v1/cases/{id}/result?include=input` answers: the result and the input it came from. */
export interface CaseInputAndResult {
  input: CaseInput;
  result: CaseResult;
}

/** A failed request, with its status so that the view can tell "not found" from "try again". */
export class CaseRequestError extends Error {
  constructor(
    readonly status: number,
    message: string,
    /** 409: the stored values the engine refuses, each with the page to fix it on. */
    readonly problems: readonly StoredProblemView[] = [],
  ) {
    super(message);
    this.name = "CaseRequestError";
  }
}

/** What the view needs of a StoredInputProblem (lib/results/stored-input-problems.ts). */
export interface StoredProblemView {
  text: string;
  fixAt: { href: string; what: string };
}

async function getJson<T>(url: string, signal: AbortSignal): Promise<T> {
  const response = await fetch(url, { signal, headers: { accept: "application/json" } });
  if (response.status === 409) {
    // The case's stored values conflict with the engine's bounds: the body says which and where.
    const body = (await response.json().catch(() => ({}))) as {
      error?: string;
      issues?: StoredProblemView[];
    };
    throw new CaseRequestError(409, body.error ?? "The result could not be computed.", body.issues);
  }
  if (!response.ok) {
    throw new CaseRequestError(
      response.status,
      response.status === 404
        ? "This case does not exist or is not shared with you."
        : "The result could not be loaded.",
    );
  }
  return (await response.json()) as T;
}

const casePath = (caseId: CaseId) => `/api/v1/cases/${encodeURIComponent(String(caseId))}`;

// A missing case will not appear on a second try; anything else may be a passing hiccup.
const retry = (failures: number, error: Error) =>
  !(
    error instanceof CaseRequestError &&
    (error.status === 404 || error.status === 403 || error.status === 409)
  ) && failures < 2;

/**
 * The engine's result of a case with the input it was computed from, in one request (so an edit
 * costs one GET, not one for the case and one for its result). `keepPreviousData` leaves the
 * last result on screen while an edit is recomputed, so the charts do not blank between keystrokes.
 */
export function useCaseResult(caseId: CaseId) {
  return useQuery({
    queryKey: caseKeys.result(caseId),
    queryFn: ({ signal }) =>
      getJson<CaseInputAndResult>(`${casePath(caseId)}/result?include=input`, signal),
    placeholderData: keepPreviousData,
    retry,
  });
}

/** After an edit: refetch everything under the case's key (on the case page: its one result query). */
export function invalidateCase(queryClient: QueryClient, caseId: CaseId) {
  return queryClient.invalidateQueries({ queryKey: caseKeys.detail(caseId) });
}

export const INVALIDATE_DEBOUNCE_MS = 400;

/**
 * A callback for the case forms: each call restarts a 400 ms timer, so a burst of edits asks
 * the server for one recomputation instead of one per keystroke. A pending refresh still runs
 * when the form unmounts, so the last edit is never left unshown.
 */
export function useDebouncedInvalidate(caseId: CaseId, delayMs = INVALIDATE_DEBOUNCE_MS) {
  const queryClient = useQueryClient();
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);

  useEffect(
    () => () => {
      if (timer.current !== null) {
        clearTimeout(timer.current);
        timer.current = null;
        void invalidateCase(queryClient, caseId);
      }
    },
    [queryClient, caseId],
  );

  return useCallback(() => {
    if (timer.current !== null) clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      timer.current = null;
      void invalidateCase(queryClient, caseId);
    }, delayMs);
  }, [queryClient, caseId, delayMs]);
}
