import type { Metadata } from "next";
import { CreateUserForm } from "@/components/admin/create-user-form";
import { InvitationActions } from "@/components/admin/invitation-actions";
import { UserRowActions } from "@/components/admin/user-row-actions";
import { UserStatus } from "@/components/admin/user-status";
import { Badge } from "@/components/ui/badge";
import { ListFilterForm, pickParams } from "@/components/ui/list-filter-form";
import { PageHeader, Panel } from "@/components/ui/panel";
import { Pager } from "@/components/ui/pager";
import { SortHeader, Table, Td, Th } from "@/components/ui/table";
import { listAccountOptions } from "@/db/queries/accounts";
import { listAuditPage } from "@/db/queries/audit";
import { listUsers } from "@/db/queries/users";
import { ROLES } from "@/db/schema/users";
import { requirePageUser } from "@/server/auth";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { flatParams, listHref } from "@/lib/lists/list-params";
import { AUDIT_URL_KEYS, auditListParamsSchema } from "@/lib/validations/audit";
import { USER_STATUSES, userListParamsSchema } from "@/lib/validations/user";

export const metadata: Metadata = { title: "Users and audit" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

const STATUS_LABELS = { invited: "Invited", active: "Active", inactive: "Deactivated" } as const;
const ROLE_OPTIONS = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));
const STATUS_OPTIONS = USER_STATUSES.map((s) => ({ value: s, label: STATUS_LABELS[s] }));

export default async function AdminPage({ searchParams }: { searchParams: SearchParams }) {
  const admin = await requirePageUser("admin");
  const current = flatParams(await searchParams);
  const params = userListParamsSchema.parse(current);
  // The audit list shares the page, so its state lives under its own names (aq, adir, apage).
  const auditParams = auditListParamsSchema.parse({
    q: current[AUDIT_URL_KEYS.q],
    sort: current[AUDIT_URL_KEYS.sort],
    dir: current[AUDIT_URL_KEYS.dir],
    page: current[AUDIT_URL_KEYS.page],
  });
  const users = listUsers(admin, params);
  const accounts = listAccountOptions(admin);
  const audit = listAuditPage(admin, auditParams);
  const { sort, dir } = params;
  const userHref = (changes: Record<string, string | number | undefined>) =>
    listHref("/admin", current, changes);
  const sortHref = (column: string, d: "asc" | "desc") => userHref({ sort: column, dir: d });
  // A change of the audit list keeps the users' page and goes back to the audit's first page.
  const auditHref = (changes: Record<string, string | number | undefined>) =>
    listHref("/admin", current, {
      page: current.page,
      [AUDIT_URL_KEYS.page]: undefined,
      ...changes,
    });
  const auditSortHref = (_column: string, d: "asc" | "desc") =>
    auditHref({ [AUDIT_URL_KEYS.dir]: d });
  const auditKeys = Object.values(AUDIT_URL_KEYS);
  const userKeys = ["q", "role", "status", "sort", "dir"];

  return (
    <div className="space-y-8">
      <PageHeader
        title="Users and audit"
        lead="Who may sign in, in which role, and what has happened."
      />

      <Panel title="Users">
        {/* The audit list's state rides along, so filtering users leaves it as it was. */}
        <ListFilterForm
          action="/admin"
          label="Users"
          className="mb-4"
          search={{
            id: "user-q",
            label: "Name or e-mail contains",
            value: params.q,
            width: "w-64",
          }}
          selects={[
            {
              id: "user-role",
              name: "role",
              label: "Role",
              value: params.role,
              anyLabel: "Any role",
              options: ROLE_OPTIONS,
              width: "w-48",
            },
            {
              id: "user-status",
              name: "status",
              label: "Status",
              value: params.status,
              anyLabel: "Any status",
              options: STATUS_OPTIONS,
              width: "w-48",
            },
          ]}
          keep={pickParams(current, ["sort", "dir", ...auditKeys])}
          submitLabel="Filter"
        />
        <Table caption="Users">
          <thead>
            <tr>
              <SortHeader label="Name" column="name" sort={sort} dir={dir} href={sortHref} />
              <SortHeader label="E-mail" column="email" sort={sort} dir={dir} href={sortHref} />
              <SortHeader label="Role" column="role" sort={sort} dir={dir} href={sortHref} />
              <Th>Status</Th>
              <SortHeader
                label="Created"
                column="createdAt"
                sort={sort}
                dir={dir}
                href={sortHref}
              />
              <Th>Change</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {users.rows.map((u) => (
              <tr key={u.id} data-testid={`user-${u.email}`}>
                <Td className="font-bold">{u.name}</Td>
                <Td className="break-all">{u.email}</Td>
                <Td>
                  {ROLE_LABELS[u.role]}
                  {u.accountName ? (
                    <span className="block text-caption text-steel-600">{u.accountName}</span>
                  ) : null}
                </Td>
                <Td>
                  <UserStatus user={u} />
                </Td>
                <Td className="whitespace-nowrap">{u.createdAt.slice(0, 10)}</Td>
                <Td>
                  <UserRowActions user={u} accounts={accounts} isSelf={u.id === admin.id} />
                  {u.status === "invited" ? (
                    <InvitationActions user={u} linkOpen={u.inviteLink === "open"} />
                  ) : null}
                </Td>
              </tr>
            ))}
            {users.rows.length === 0 ? (
              <tr>
                <Td colSpan={6} className="py-6 text-center text-steel-700">
                  No user matches this filter.
                </Td>
              </tr>
            ) : null}
          </tbody>
        </Table>
        <Pager
          page={users.page}
          pageCount={users.pageCount}
          total={users.total}
          noun={["user", "users"]}
          href={(page) => userHref({ page })}
        />
      </Panel>

      <Panel title="Add a user">
        <CreateUserForm accounts={accounts} />
      </Panel>

      <Panel title="Audit log">
        {/* The users list's state, its page included, rides along the same way. */}
        <ListFilterForm
          action="/admin"
          label="Audit log"
          className="mb-4"
          search={{
            id: "audit-q",
            name: AUDIT_URL_KEYS.q,
            label: "Action, who or detail contains",
            value: auditParams.q,
            width: "w-64",
          }}
          keep={pickParams(current, [...userKeys, "page", AUDIT_URL_KEYS.dir])}
          submitLabel="Filter the audit log"
        />
        <Table caption="Audit log">
          <thead>
            <tr>
              <SortHeader
                label="When (UTC)"
                column="at"
                sort="at"
                dir={auditParams.dir}
                href={auditSortHref}
              />
              <Th>Who</Th>
              <Th>What</Th>
              <Th>Detail</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {audit.rows.map((e) => (
              <tr key={e.id}>
                <Td className="whitespace-nowrap tabular-nums">
                  {e.at.replace("T", " ").slice(0, 19)}
                </Td>
                <Td className="break-all">{e.actorEmail ?? "—"}</Td>
                <Td>
                  <Badge
                    tone={
                      e.action.endsWith("failed")
                        ? "danger"
                        : e.action.startsWith("user.")
                          ? "coil"
                          : "flux"
                    }
                  >
                    {e.action}
                  </Badge>
                </Td>
                <Td className="text-steel-700">{e.detail}</Td>
              </tr>
            ))}
            {audit.rows.length === 0 ? (
              <tr>
                <Td colSpan={4} className="py-6 text-center text-steel-700">
                  No audit entry matches this filter.
                </Td>
              </tr>
            ) : null}
          </tbody>
        </Table>
        <Pager
          page={audit.page}
          pageCount={audit.pageCount}
          total={audit.total}
          noun={["entry", "entries"]}
          href={(page) => auditHref({ [AUDIT_URL_KEYS.page]: page })}
        />
      </Panel>
    </div>
  );
}
