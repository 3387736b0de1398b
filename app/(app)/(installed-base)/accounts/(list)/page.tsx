import type { Metadata } from "next";
import Link from "next/link";
import { NewAccountForm } from "@/components/accounts/new-account-form";
import { Badge } from "@/components/ui/badge";
import { ListFilterForm } from "@/components/ui/list-filter-form";
import { Pager } from "@/components/ui/pager";
import { EmptyState, PageHeader } from "@/components/ui/panel";
import { SortHeader, Table, Td, Th } from "@/components/ui/table";
import { listAccountsPage, listActiveEngineers } from "@/db/queries/accounts";
import { requirePageUser } from "@/server/auth";
import { VENDOR_ROLES } from "@/lib/auth/roles";
import { flatParams, listHref } from "@/lib/lists/list-params";
import { accountListParamsSchema } from "@/lib/validations/account";

export const metadata: Metadata = { title: "Accounts" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

export default async function AccountsPage({ searchParams }: { searchParams: SearchParams }) {
  const user = await requirePageUser(...VENDOR_ROLES);
  const current = flatParams(await searchParams);
  const params = accountListParamsSchema.parse(current);
  const result = listAccountsPage(user, params);
  // Managers and administrators hand a new account to an engineer; an engineer owns theirs.
  const owners = user.role === "engineer" ? null : listActiveEngineers(user);
  const href = (changes: Record<string, string | number | undefined>) =>
    listHref("/accounts", current, changes);
  const filtered = Boolean(params.q) || params.archived === "show";
  return (
    <div className="space-y-6">
      <PageHeader
        title="Accounts"
        lead={
          user.role !== "engineer"
            ? "Every customer account, with its owning engineer."
            : "The customer accounts you own or that are shared with you."
        }
      />
      <NewAccountForm owners={owners} />

      <ListFilterForm
        action="/accounts"
        label="Filter accounts"
        search={{
          id: "accounts-q",
          label: "Account or owner contains",
          value: params.q,
          width: "w-64",
        }}
        keep={{ sort: params.sort, dir: params.dir }}
        submitLabel="Apply"
      >
        <label className="flex items-center gap-2 pb-2 text-small font-bold text-steel-800">
          <input
            type="checkbox"
            name="archived"
            value="show"
            defaultChecked={params.archived === "show"}
          />
          Show archived accounts
        </label>
      </ListFilterForm>

      {result.total === 0 ? (
        <EmptyState title={filtered ? "No accounts match" : "No accounts yet"}>
          {filtered
            ? "Change the filter or show archived accounts."
            : "Accounts you own or that are shared with you appear here."}
        </EmptyState>
      ) : (
        <>
          <Table caption="Customer accounts">
            <thead>
              <tr>
                <SortHeader
                  label="Account"
                  column="name"
                  sort={params.sort}
                  dir={params.dir}
                  href={(sort, dir) => href({ sort, dir })}
                />
                <SortHeader
                  label="Owner"
                  column="owner"
                  sort={params.sort}
                  dir={params.dir}
                  href={(sort, dir) => href({ sort, dir })}
                />
                <Th className="text-right">Shared with</Th>
                <SortHeader
                  label="Since"
                  column="created"
                  sort={params.sort}
                  dir={params.dir}
                  href={(sort, dir) => href({ sort, dir })}
                />
              </tr>
            </thead>
            <tbody className="divide-y divide-steel-100">
              {result.rows.map((a) => (
                <tr key={a.id}>
                  <Td className="font-bold">
                    <Link
                      href={`/accounts/${a.id}`}
                      className="text-flux-700 underline-offset-2 hover:underline"
                    >
                      {a.name}
                    </Link>
                    {a.archivedAt ? (
                      <span className="ml-2">
                        <Badge tone="caution">Archived</Badge>
                      </span>
                    ) : null}
                  </Td>
                  <Td>{a.ownerId === user.id ? "You" : a.ownerName}</Td>
                  <Td className="text-right tabular-nums">
                    {a.shareCount === 0
                      ? "—"
                      : `${a.shareCount} engineer${a.shareCount > 1 ? "s" : ""}`}
                  </Td>
                  <Td>{a.createdAt.slice(0, 10)}</Td>
                </tr>
              ))}
            </tbody>
          </Table>
          <Pager
            page={result.page}
            pageCount={result.pageCount}
            total={result.total}
            noun={["account", "accounts"]}
            href={(page) => href({ page })}
          />
        </>
      )}
    </div>
  );
}
