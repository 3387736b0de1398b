import type { Metadata } from "next";
import { CreateUserForm } from "@/components/admin/create-user-form";
import { UserRowActions } from "@/components/admin/user-row-actions";
import { Badge } from "@/components/ui/badge";
import { buttonClass } from "@/components/ui/button";
import { Input, Select } from "@/components/ui/field";
import { PageHeader, Panel } from "@/components/ui/panel";
import { SortHeader, Table, Td, Th } from "@/components/ui/table";
import { listAccountOptions } from "@/db/queries/accounts";
import { listAudit } from "@/db/queries/audit";
import { listUsers } from "@/db/queries/users";
import { ROLES } from "@/db/schema/users";
import { requirePageUser } from "@/server/auth";
import { ROLE_LABELS } from "@/lib/auth/roles";
import { userListParamsSchema } from "@/lib/validations/user";

export const metadata: Metadata = { title: "Users and audit" };

type SearchParams = Promise<Record<string, string | string[] | undefined>>;

function first(v: string | string[] | undefined) {
  return Array.isArray(v) ? v[0] : v;
}

export default async function AdminPage({ searchParams }: { searchParams: SearchParams }) {
  const admin = await requirePageUser("admin");
  const raw = await searchParams;
  const params = userListParamsSchema.parse({
    q: first(raw.q),
    role: first(raw.role),
    sort: first(raw.sort),
    dir: first(raw.dir),
  });
  const users = listUsers(admin, params);
  const accounts = listAccountOptions(admin);
  const audit = listAudit(admin, 100);
  const sort = params.sort ?? "name";
  const dir = params.dir ?? "asc";
  const sortHref = (column: string, d: "asc" | "desc") => {
    const qs = new URLSearchParams();
    if (params.q) qs.set("q", params.q);
    if (params.role) qs.set("role", params.role);
    qs.set("sort", column);
    qs.set("dir", d);
    return `/admin?${qs}`;
  };

  return (
    <div className="space-y-8">
      <PageHeader
        title="Users and audit"
        lead="Who may sign in, in which role, and what has happened."
      />

      <Panel title="Users">
        <form
          method="get"
          action="/admin"
          className="mb-4 flex flex-wrap items-end gap-3"
          role="search"
        >
          <div>
            <label htmlFor="user-q" className="block text-small font-bold text-steel-800">
              Name or e-mail contains
            </label>
            <Input id="user-q" name="q" defaultValue={params.q ?? ""} className="w-64" />
          </div>
          <div>
            <label htmlFor="user-role" className="block text-small font-bold text-steel-800">
              Role
            </label>
            <Select id="user-role" name="role" defaultValue={params.role ?? ""} className="w-48">
              <option value="">Any role</option>
              {ROLES.map((r) => (
                <option key={r} value={r}>
                  {ROLE_LABELS[r]}
                </option>
              ))}
            </Select>
          </div>
          {params.sort ? <input type="hidden" name="sort" value={params.sort} /> : null}
          {params.dir ? <input type="hidden" name="dir" value={params.dir} /> : null}
          <button type="submit" className={buttonClass("secondary")}>
            Filter
          </button>
        </form>
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
            {users.map((u) => (
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
                  {u.active ? (
                    <Badge tone="success">Active</Badge>
                  ) : (
                    <Badge tone="danger">Deactivated</Badge>
                  )}
                </Td>
                <Td className="whitespace-nowrap">{u.createdAt.slice(0, 10)}</Td>
                <Td>
                  <UserRowActions user={u} accounts={accounts} isSelf={u.id === admin.id} />
                </Td>
              </tr>
            ))}
            {users.length === 0 ? (
              <tr>
                <Td colSpan={6} className="py-6 text-center text-steel-700">
                  No user matches this filter.
                </Td>
              </tr>
            ) : null}
          </tbody>
        </Table>
      </Panel>

      <Panel title="Add a user">
        <CreateUserForm accounts={accounts} />
      </Panel>

      <Panel
        title="Audit log"
        actions={<span className="text-small text-steel-600">Newest first, last 100 entries</span>}
      >
        <Table caption="Audit log">
          <thead>
            <tr>
              <Th>When (UTC)</Th>
              <Th>Who</Th>
              <Th>What</Th>
              <Th>Detail</Th>
            </tr>
          </thead>
          <tbody className="divide-y divide-steel-100">
            {audit.map((e) => (
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
          </tbody>
        </Table>
      </Panel>
    </div>
  );
}
