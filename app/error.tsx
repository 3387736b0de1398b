"use client";

import { ErrorPanel } from "@/components/ui/error-panel";

export default function RootError({
  error,
  reset,
}: {
  error: Error & { digest?: string };
  reset: () => void;
}) {
  return (
    <main className="px-4 py-16">
      <ErrorPanel reset={reset} digest={error.digest} />
    </main>
  );
}
