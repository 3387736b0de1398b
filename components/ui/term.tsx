import type { ReactNode } from "react";
import type { TermKind } from "@/lib/glossary";

/**
 * A glossary term as printed on a page, marked with its kind so that tests/e2e/glossary.test.ts
 * can check each one against lib/glossary.
 */
export function Term({ kind, children }: { kind: TermKind; children: ReactNode }) {
  return <span data-term={kind}>{children}</span>;
}
