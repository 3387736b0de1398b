"use client";

import Link from "next/link";
import { useState, useTransition } from "react";
import { setCatalogueActiveAction } from "@/server/catalogue/actions";
import { Button, buttonClass } from "@/components/ui/button";

// Edit and retire/restore for one catalogue row. The code is spoken with each control so that a
// screen reader's list of buttons says which row each one changes.
export function CatalogueRowActions({
  kind,
  id,
  code,
  active,
}: {
  kind: "kit" | "motor";
  id: number;
  code: string;
  active: boolean;
}) {
  const [message, setMessage] = useState<string | null>(null);
  const [pending, startTransition] = useTransition();

  function toggle() {
    setMessage(null);
    startTransition(async () => {
      const result = await setCatalogueActiveAction({ kind, id, active: !active });
      if (!result.ok) setMessage(result.message);
    });
  }

  return (
    <div>
      <div className="flex items-center gap-2 whitespace-nowrap">
        <Link href={`/catalogue/${kind}s/${id}`} className={buttonClass("secondary", "sm")}>
          Edit<span className="sr-only"> {code}</span>
        </Link>
        <Button
          size="sm"
          variant={active ? "danger" : "secondary"}
          disabled={pending}
          onClick={toggle}
        >
          {active ? "Retire" : "Restore"}
          <span className="sr-only"> {code}</span>
        </Button>
      </div>
      <p aria-live="polite" className="mt-1 text-caption font-bold text-danger-700 empty:mt-0">
        {message}
      </p>
    </div>
  );
}
