import { Suspense, type ReactNode } from "react";
import { DossierReport } from "@/components/dossiers/dossier-report";
import { DossierSkeleton } from "@/components/dossiers/dossier-skeleton";
import { PrintButton } from "@/components/dossiers/print-button";
import { MethodLink } from "@/components/results/method-link";
import type { CaseEvidence } from "@/components/results/reliance-note";
import { buttonClass } from "@/components/ui/button";
import { PageHeader, Panel } from "@/components/ui/panel";
import { buildDossier } from "@/lib/dossier";
import type { EvidenceIndex } from "@/lib/evidence/subjects";
import type { RelianceAudience } from "@/lib/results/headline-reliance";
import { ENGINE_VERSION, type CaseInput, type ParsedCase } from "@/lib/engine";
import { StoredInputError } from "@/lib/errors";
import { parseFrozenInput } from "@/lib/results/stored-input-problems";

/**
 * A paid dossier as the vendor's people and the customer's reviewer both read it: built from the
 * frozen input through the engine, with the workbook download and the print button. `evidence`
 * is the recorded sources of the frozen figures, read by the page in the reader's scope (the
 * vendor's case, the reviewer's proposal: db/queries/evidence.ts). `children`
 * come after the report (the vendor's ranges form). The header is sent at once; the report,
 * whose draws take a second or more on a large case, streams in behind a skeleton of its shape.
 */
export function PaidDossierView({
  proposalId,
  title,
  crumbs,
  proposal,
  settings,
  evidence,
  methodHref,
  children,
}: {
  proposalId: number;
  title: string;
  crumbs: ReactNode;
  proposal: {
    input: CaseInput;
    accountName: string;
    siteName: string;
    caseId: number;
    version: number;
  };
  settings: Parameters<typeof buildDossier>[1];
  evidence: { index: EvidenceIndex; audience: RelianceAudience };
  /** The method page of the reader's shell. */
  methodHref: string;
  children?: ReactNode;
}) {
  let input: ParsedCase;
  try {
    input = parseFrozenInput(proposal);
  } catch (error) {
    if (!(error instanceof StoredInputError)) throw error;
    // Frozen before a bound it breaks existed: say what and where, rather than fail the page.
    return (
      <div className="space-y-6">
        <div className="print:hidden">{crumbs}</div>
        <PageHeader title={title} lead={`${proposal.accountName} · ${proposal.siteName}`} />
        <Panel title="This dossier cannot be built">
          <div role="alert" className="space-y-2 text-steel-800">
            <p>
              Proposal version {proposal.version} was frozen with{" "}
              {error.problems.length === 1 ? "a value" : `${error.problems.length} values`} outside
              the ranges the engine accepts now, so its dossier cannot be computed:
            </p>
            <ul className="list-disc space-y-1 pl-5">
              {error.problems.map((p) => (
                <li key={p.path}>{p.text}</li>
              ))}
            </ul>
            <p>
              The frozen version stays as it is: after the correction, freeze a new version from the
              case.
            </p>
          </div>
        </Panel>
        {children}
      </div>
    );
  }
  return (
    <div className="space-y-6 dossier-report">
      <div className="print:hidden">{crumbs}</div>
      <PageHeader
        title={title}
        lead={`${proposal.accountName} · ${proposal.siteName} · engine ${ENGINE_VERSION} · seed ${settings.seed} · amounts in ${input.currency}`}
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
      <Suspense fallback={<DossierSkeleton />}>
        <ComputedDossier
          input={input}
          settings={settings}
          evidence={{ caseId: proposal.caseId, ...evidence }}
        />
      </Suspense>
      {children}
    </div>
  );
}

/** The report itself: computed after the page's first bytes have left (see PaidDossierView). */
async function ComputedDossier({
  input,
  settings,
  evidence,
}: {
  input: ParsedCase;
  settings: Parameters<typeof buildDossier>[1];
  evidence: CaseEvidence;
}) {
  // The draws are synchronous work: yielding once lets React send the shell and the skeleton
  // before the event loop is busy with them.
  await new Promise((resolve) => setImmediate(resolve));
  return (
    <DossierReport dossier={buildDossier(input, settings)} input={input} evidence={evidence} />
  );
}
