import type { Metadata } from "next";
import Link from "next/link";
import { NewCaseForm } from "@/components/cases/new-case-form";
import { StageBadge } from "@/components/cases/stage-badge";
import { EmptyState, PageHeader, Panel } from "@/components/ui/panel";
import { Table, Td, Th } from "@/components/ui/table";
import { listCases } from "@/db/queries/cases";
import { listOpenSites } from "@/db/queries/sites";
import { requirePageUser } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";

export const metadata: Metadata = { title: "Cases" };

export default async function CasesPage() {
  const user = await requirePageUser(...VENDOR_ROLES);
  const cases = listCases(user);
  const sites = listOpenSites(user);
  return (
    <div className="space-y-6">
      <PageHeader
        title="Business cases"
        lead="Axes of a site mapped to closed-loop kits, with the payback the engine computes for them."
      />
      <Panel title="Cases">
        {cases.length === 0 ? (
          <EmptyState title="No cases yet">
            Create one below from a site of your accounts.
          </EmptyState>
        ) : (
          <Table caption="Business cases">
            <thead>
              <tr>
                <Th>Case</Th>
                <Th>Account and site</Th>
                <Th>Stage</Th>
                <Th className="text-right">Axes</Th>
                <Th>Owner</Th>
                <Th className="text-right">Proposal</Th>
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {cases.map((c) => (
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
                  <Td className="text-right tabular-nums">
                    {c.latestVersion ? `v${c.latestVersion}` : "—"}
                  </Td>
                </tr>
              ))}
            </tbody>
          </Table>
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
