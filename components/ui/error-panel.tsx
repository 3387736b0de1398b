"use client";

import { Button } from "./button";

// What an error boundary shows: a plain message and a retry, never the error's internals.
export function ErrorPanel({ reset, digest }: { reset: () => void; digest?: string }) {
  return (
    <div
      role="alert"
      className="mx-auto max-w-xl rounded-panel border border-danger-600 bg-white p-6"
    >
      <h1 className="text-title text-danger-700">This page could not be shown</h1>
      <p className="mt-2 text-steel-700">
        Something went wrong on our side. Your saved work is not affected. Try again, and if it
        keeps happening, give the administrator this reference:{" "}
        <code className="font-mono">{digest ?? "none"}</code>.
      </p>
      <Button className="mt-4" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
