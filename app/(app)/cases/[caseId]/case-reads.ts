import "server-only";
import { cache } from "react";
import { getCaseOrThrow } from "@/db/queries/cases";
import type { SessionUser } from "@/lib/auth/session-user";
import { orNotFound } from "@/lib/pages";

/**
 * The case a page and its layout both read, looked up once per render. React's cache keys on
 * the arguments' identity: getSessionUser is cached too, so the layout and the page pass the
 * same caller object. A case outside the caller's accounts is the not-found page.
 */
export const readCase = cache((caller: SessionUser, caseId: number) =>
  orNotFound(() => getCaseOrThrow(caller, caseId)),
);
