import { z } from "zod";

// The state of one server-side list, as it stands in the URL: a text filter, a sort column and
// direction, and a page. Bad or missing values fall back to the defaults instead of failing,
// because a hand-edited or stale link should still show the list.
export type ListParams<S extends string> = {
  q?: string;
  sort: S;
  dir: "asc" | "desc";
  page: number;
};

export function listParamsSchema<S extends string>(
  sorts: readonly [S, ...S[]],
  defaults: { sort: S; dir?: "asc" | "desc" },
) {
  return z.object({
    q: z.string().trim().max(100).optional().catch(undefined),
    sort: z.enum(sorts).catch(defaults.sort),
    dir: z.enum(["asc", "desc"]).catch(defaults.dir ?? "asc"),
    page: z.coerce.number().int().min(1).catch(1),
  });
}

// One page of rows and where it sits in the whole list.
export type ListPage<T> = {
  rows: T[];
  total: number;
  page: number;
  pageCount: number;
  pageSize: number;
};

// Clamps the asked page to the pages that exist and returns the LIMIT/OFFSET to read it with.
export function pageWindow(total: number, askedPage: number, pageSize: number) {
  const pageCount = Math.max(1, Math.ceil(total / pageSize));
  const page = Math.min(Math.max(1, askedPage), pageCount);
  return { page, pageCount, pageSize, limit: pageSize, offset: (page - 1) * pageSize };
}

// Builds the link for a change of list state, keeping every other query parameter (filters of
// the page, other lists on the same page) as it is. A changed filter or sort goes back to page 1.
export function listHref(
  path: string,
  current: Record<string, string | undefined>,
  changes: Record<string, string | number | undefined>,
): string {
  const qs = new URLSearchParams();
  for (const [k, v] of Object.entries(current)) if (v !== undefined && v !== "") qs.set(k, v);
  for (const [k, v] of Object.entries(changes)) {
    if (v === undefined || v === "") qs.delete(k);
    else qs.set(k, String(v));
  }
  if (!("page" in changes)) qs.delete("page");
  const s = qs.toString();
  return s ? `${path}?${s}` : path;
}

// The first value of each query parameter, as a plain record (Next hands repeats as arrays).
export function flatParams(raw: Record<string, string | string[] | undefined>) {
  const out: Record<string, string | undefined> = {};
  for (const [k, v] of Object.entries(raw)) out[k] = Array.isArray(v) ? v[0] : v;
  return out;
}
