import Link from "next/link";
import { QuoteStageBadge } from "@/components/proposals/quote-stage-badge";
import type { ProposalSummary } from "@/db/queries/proposal-versions";
import { ListFilterForm } from "@/components/ui/list-filter-form";
import { Pager } from "@/components/ui/pager";
import { SortHeader, Table, Td, Th } from "@/components/ui/table";
import { listHref, type ListPage } from "@/lib/lists/list-params";
import { QUOTE_STAGES, STAGE_LABELS } from "@/lib/pipeline/stages";
import type { ProposalListParams } from "@/lib/validations/case-lists";
import { formatMoney, formatPayback } from "@/lib/results/format";
import { FINANCE_TERMS, SCENARIO_LABELS } from "@/lib/glossary";

const QUOTE_STAGE_OPTIONS = QUOTE_STAGES.map((s) => ({ value: s, label: STAGE_LABELS[s] }));

// Frozen versions, a page at a time (newest first unless sorted otherwise; filter, sort and page
// in the URL, done in SQL by db/queries/proposal-list.ts), each with its stage with the customer
// and what changed since the one before; the version opens the proposal's page.
export function ProposalsList({
  caseId,
  result,
  params,
  current,
}: {
  caseId: number;
  result: ListPage<ProposalSummary>;
  params: ProposalListParams;
  current: Record<string, string | undefined>;
}) {
  const path = `/cases/${caseId}`;
  const filtered = Boolean(params.q || params.stage);
  if (!result.total && !filtered)
    return (
      <p className="text-small text-steel-700">
        No proposal yet. Freeze the case when its figures are ready to send.
      </p>
    );
  const href = (changes: Record<string, string | number | undefined>) =>
    listHref(path, current, changes);
  const sortProps = {
    sort: params.sort,
    dir: params.dir,
    href: (column: string, dir: "asc" | "desc") => href({ sort: column, dir }),
  };
  return (
    <div className="space-y-3">
      <ListFilterForm
        action={path}
        label="Filter proposals"
        search={{
          id: "proposals-q",
          label: "Version or frozen by contains",
          value: params.q,
          width: "w-56",
        }}
        selects={[
          {
            id: "proposals-stage",
            name: "stage",
            label: "Proposal stage",
            value: params.stage,
            anyLabel: "All stages",
            options: QUOTE_STAGE_OPTIONS,
            width: "w-44",
          },
        ]}
        keep={{ sort: params.sort, dir: params.dir }}
        submitLabel="Filter proposals"
      />
      {result.total === 0 ? (
        <p className="text-small text-steel-700">
          No version matches. <Link href={path}>Show all versions</Link>.
        </p>
      ) : (
        <>
          <VersionsTable proposals={result.rows} sortProps={sortProps} />
          <Pager
            page={result.page}
            pageCount={result.pageCount}
            total={result.total}
            noun={["version", "versions"]}
            href={(page) => href({ page })}
          />
        </>
      )}
    </div>
  );
}

function VersionsTable({
  proposals,
  sortProps,
}: {
  proposals: ProposalSummary[];
  sortProps: {
    sort: string;
    dir: "asc" | "desc";
    href: (column: string, dir: "asc" | "desc") => string;
  };
}) {
  return (
    <Table caption="Proposal versions">
      <thead>
        <tr>
          <SortHeader label="Version" column="version" {...sortProps} />
          <SortHeader label="Stage" column="stage" {...sortProps} />
          <Th>Frozen (UTC)</Th>
          <SortHeader label="By" column="by" {...sortProps} />
          <Th className="text-right">{FINANCE_TERMS.upFrontCost}</Th>
          <Th className="text-right">NPV ({SCENARIO_LABELS.physics.toLowerCase()})</Th>
          <Th className="text-right">Payback</Th>
          <Th>What changed</Th>
          <Th>Workbook</Th>
          <Th>Dossier</Th>
        </tr>
      </thead>
      <tbody className="divide-y divide-steel-100">
        {proposals.map((p) => (
          <tr key={p.id}>
            <Td className="font-bold">
              <Link href={`/proposals/${p.id}`} className="text-flux-700 hover:underline">
                v{p.version}
              </Link>
            </Td>
            <Td>
              <QuoteStageBadge stage={p.stage} />
            </Td>
            <Td className="whitespace-nowrap tabular-nums">
              {p.createdAt.replace("T", " ").slice(0, 16)}
            </Td>
            <Td>{p.createdByName}</Td>
            <Td className="text-right tabular-nums">{formatMoney(p.capex, p.currency)}</Td>
            <Td className="text-right tabular-nums">{formatMoney(p.npv, p.currency)}</Td>
            <Td className="text-right tabular-nums">{formatPayback(p.paybackYears)}</Td>
            <Td>
              <ul className="list-disc pl-4 text-small">
                {p.changes.slice(0, 6).map((c, i) => (
                  <li key={i}>{c}</li>
                ))}
              </ul>
            </Td>
            <Td>
              <a
                href={`/api/v1/proposals/${p.id}/workbook`}
                className="font-bold text-flux-700 hover:underline"
              >
                .xlsx
              </a>
            </Td>
            <Td>
              <a href={`/dossiers/${p.id}`} className="font-bold text-flux-700 hover:underline">
                Dossier
              </a>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
