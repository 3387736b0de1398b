import type { ReactNode } from "react";
import { DossierReport } from "@/components/dossiers/dossier-report";
import { PrintButton } from "@/components/dossiers/print-button";
import { MethodLink } from "@/components/results/method-link";
import { buttonClass } from "@/components/ui/button";
import { PageHeader } from "@/components/ui/panel";
import { buildDossier } from "@/lib/dossier";
import { caseInputSchema, type CaseInput } from "@/lib/engine";

/**
 * A paid dossier as the vendor's people and the customer's reviewer both read it: built from the
 * frozen input through the engine, with the workbook download and the print button. `children`
 * come after the report (the vendor's ranges form).
 */
export function PaidDossierView({
  proposalId,
  title,
  crumbs,
  proposal,
  settings,
  methodHref,
  children,
}: {
  proposalId: number;
  title: string;
  crumbs: ReactNode;
  proposal: { input: CaseInput; accountName: string; siteName: string };
  settings: Parameters<typeof buildDossier>[1];
  /** The method page of the reader's shell. */
  methodHref: string;
  children?: ReactNode;
}) {
  const input = caseInputSchema.parse(proposal.input);
  const dossier = buildDossier(input, settings);
  const { result } = dossier;
  return (
    <div className="space-y-6 dossier-report">
      <div className="print:hidden">{crumbs}</div>
      <PageHeader
        title={title}
        lead={`${proposal.accountName} · ${proposal.siteName} · engine ${result.engineVersion} · seed ${settings.seed} · amounts in ${result.currency}`}
        actions={
          <div className="flex flex-wrap gap-2 print:hidden">
            <a href={`/api/v1/proposals/${proposalId}/dossier`} className={buttonClass("primary")}>
              Download the workbook (.xlsx)
            </a>
            <PrintButton />
          </div>
        }
      />
      <p className="print:hidden">
        <MethodLink href={methodHref} />
      </p>
      <DossierReport dossier={dossier} input={input} />
      {children}
    </div>
  );
}
