import type { Metadata } from "next";
import Link from "next/link";
import { CasesFilter } from "@/components/cases/cases-filter";
import { NewCaseForm } from "@/components/cases/new-case-form";
import { StageBadge } from "@/components/cases/stage-badge";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { Pager } from "@/components/ui/pager";
import { SortHeader, Table, Td, Th } from "@/components/ui/table";
import { listCasesPage } from "@/db/queries/case-list";
import { listOpenSites } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { flatParams, listHref } from "@/lib/lists/list-params";
import { caseListParamsSchema } from "@/lib/validations/case-lists";

export const metadata: Metadata = { title: "Cases" };

// Filter, sort and page are in the URL and done in SQL (db/queries/case-list.ts).
export default async function CasesPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const current = flatParams(await searchParams);
  const params = caseListParamsSchema.parse(current);
  const result = listCasesPage(user, params);
  const sites = listOpenSites(user);
  const filtered = Boolean(params.q || params.stage);
  const href = (changes: Record<string, string | number | undefined>) =>
    listHref("/cases", current, changes);
  const sortHref = (column: string, dir: "asc" | "desc") => href({ sort: column, dir });
  const sortProps = { sort: params.sort, dir: params.dir, href: sortHref };
  return (
    <div className="space-y-6">
      <PageHeader
        title="Business cases"
        lead="Axes of a site mapped to closed-loop kits, with the payback the engine computes for them."
      />
      <Panel title="Cases">
        <CasesFilter params={params} />
        {result.total === 0 ? (
          filtered ? (
            <EmptyState title="No case matches">
              Change the filter, or <Link href="/cases">show all cases</Link>.
            </EmptyState>
          ) : (
            <EmptyState title="No cases yet">
              Create one below from a site of your accounts.
            </EmptyState>
          )
        ) : (
          <>
            <Table caption="Business cases">
              <thead>
                <tr>
                  <SortHeader label="Case" column="name" {...sortProps} />
                  <SortHeader label="Account and site" column="account" {...sortProps} />
                  <SortHeader label="Stage" column="stage" {...sortProps} />
                  <SortHeader label="Axes" column="axes" {...sortProps} />
                  <SortHeader label="Owner" column="owner" {...sortProps} />
                  <SortHeader label="Last changed (UTC)" column="updated" {...sortProps} />
                  <Th className="text-right">Proposal</Th>
                </tr>
              </thead>
              <tbody className="divide-y divide-steel-100">
                {result.rows.map((c) => (
                  <tr key={c.id}>
                    <Td className="font-bold">
                      <Link href={`/cases/${c.id}`} className="text-flux-700 hover:underline">
                        {c.name}
                      </Link>
                    </Td>
                    <Td>
                      {c.accountName} · {c.siteName}
                    </Td>
                    <Td>
                      <StageBadge stage={c.stage} />
                    </Td>
                    <Td className="text-right tabular-nums">{c.axisCount}</Td>
                    <Td>{c.ownerName}</Td>
                    <Td className="whitespace-nowrap tabular-nums">
                      {c.updatedAt.replace("T", " ").slice(0, 16)}
                    </Td>
                    <Td className="text-right tabular-nums">
                      {c.latestVersion ? `v${c.latestVersion}` : "—"}
                    </Td>
                  </tr>
                ))}
              </tbody>
            </Table>
            <Pager
              page={result.page}
              pageCount={result.pageCount}
              total={result.total}
              noun={["case", "cases"]}
              href={(page) => href({ page })}
            />
          </>
        )}
      </Panel>
      {sites.length ? (
        <Panel title="New case">
          <NewCaseForm
            sites={sites.map((s) => ({ id: s.id, name: s.name, accountName: s.accountName }))}
          />
        </Panel>
      ) : null}
    </div>
  );
}
