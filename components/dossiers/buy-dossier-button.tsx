"use client";

import { useState } from "react";
import { Button } from "@/components/ui/button";

/** Starts the checkout: the server prices it; the browser only goes to the page it answers. */
export function BuyDossierButton({ proposalId, label }: { proposalId: number; label: string }) {
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  async function buy() {
    setBusy(true);
    setError(null);
    try {
      const res = await fetch("/api/v1/payments/checkout", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify({ proposalId }),
      });
      const body = (await res.json().catch(() => ({}))) as { url?: string; error?: string };
      if (res.ok && body.url) {
        window.location.assign(body.url);
        return;
      }
      setError(body.error ?? "The checkout could not be started. Try again in a moment.");
    } catch {
      setError("The payment service could not be reached. Try again in a moment.");
    }
    setBusy(false);
  }
  return (
    <div className="space-y-2">
      <Button onClick={buy} disabled={busy}>
        {busy ? "Opening the checkout…" : label}
      </Button>
      <p role="alert" aria-live="assertive" className="text-small font-bold text-danger-700">
        {error}
      </p>
    </div>
  );
}
