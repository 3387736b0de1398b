"use client";

import { useState, useTransition } from "react";
import { changeRoleAction, setActiveAction } from "@/server/admin/actions";
import { Button } from "@/components/ui/button";
import { Select } from "@/components/ui/field";
import { ROLE_LABELS, type Role } from "@/lib/auth/roles";
import { ROLES } from "@/lib/auth/roles";

type Option = { id: number; name: string };

export function UserRowActions({
  user,
  accounts,
  isSelf,
}: {
  user: { id: number; email: string; role: Role; accountId: number | null; active: boolean };
  accounts: Option[];
  isSelf: boolean;
}) {
  const [role, setRole] = useState<Role>(user.role);
  const [accountId, setAccountId] = useState<string>(user.accountId ? String(user.accountId) : "");
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();
  const changed =
    role !== user.role || (role === "reviewer" && accountId !== String(user.accountId ?? ""));

  function run(
    action: () => Promise<{ ok: boolean; message?: string; fieldErrors?: Record<string, string> }>,
  ) {
    setMessage(null);
    startTransition(async () => {
      const result = await action();
      if (!result.ok)
        setMessage(Object.values(result.fieldErrors ?? {})[0] ?? result.message ?? "Not saved");
    });
  }

  return (
    <div className="flex flex-wrap items-center gap-2">
      <label className="sr-only" htmlFor={`role-${user.id}`}>
        Role of {user.email}
      </label>
      <Select
        id={`role-${user.id}`}
        value={role}
        onChange={(e) => setRole(e.target.value as Role)}
        className="w-44 py-1 text-small"
        disabled={isSelf}
      >
        {ROLES.map((r) => (
          <option key={r} value={r}>
            {ROLE_LABELS[r]}
          </option>
        ))}
      </Select>
      {role === "reviewer" ? (
        <>
          <label className="sr-only" htmlFor={`account-${user.id}`}>
            Account of {user.email}
          </label>
          <Select
            id={`account-${user.id}`}
            value={accountId}
            onChange={(e) => setAccountId(e.target.value)}
            className="w-52 py-1 text-small"
          >
            <option value="">Choose an account</option>
            {accounts.map((a) => (
              <option key={a.id} value={a.id}>
                {a.name}
              </option>
            ))}
          </Select>
        </>
      ) : null}
      <Button
        size="sm"
        variant="secondary"
        disabled={!changed || pending}
        onClick={() => run(() => changeRoleAction({ userId: user.id, role, accountId }))}
      >
        Save role
      </Button>
      {!isSelf ? (
        <Button
          size="sm"
          variant={user.active ? "danger" : "secondary"}
          disabled={pending}
          onClick={() => run(() => setActiveAction({ userId: user.id, active: !user.active }))}
        >
          {user.active ? "Deactivate" : "Reactivate"}
        </Button>
      ) : null}
      <span aria-live="polite" className="text-caption font-bold text-danger-700">
        {message}
      </span>
    </div>
  );
}
