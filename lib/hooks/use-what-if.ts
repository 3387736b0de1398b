import { useMutation } from "@tanstack/react-query";
import type { CaseResult } from "@/lib/engine";
import type { WhatIfRequest } from "@/lib/validations/what-if";

export const whatIfKeys = {
  run: (proposalId: number) => ["proposals", String(proposalId), "what-if"] as const,
};

/** A refused sandbox request, with the problems the server named per field. */
export class WhatIfError extends Error {
  constructor(
    message: string,
    readonly fields: Record<string, string>,
  ) {
    super(message);
    this.name = "WhatIfError";
  }
}

/** Runs the proposal's sandbox: the engine on the frozen input with the reviewer's figures. */
export function useWhatIf(proposalId: number) {
  return useMutation({
    mutationKey: whatIfKeys.run(proposalId),
    mutationFn: async (values: WhatIfRequest): Promise<CaseResult> => {
      const response = await fetch(`/api/v1/proposals/${proposalId}/what-if`, {
        method: "POST",
        headers: { "content-type": "application/json", accept: "application/json" },
        body: JSON.stringify(values),
      });
      const body = (await response.json().catch(() => ({}))) as {
        error?: string;
        issues?: { path: (string | number)[]; message: string }[];
      };
      if (!response.ok) {
        const fields: Record<string, string> = {};
        for (const issue of body.issues ?? [])
          fields[String(issue.path[0] ?? "form")] ??= issue.message;
        throw new WhatIfError(body.error ?? "The sandbox could not compute these figures.", fields);
      }
      return body as unknown as CaseResult;
    },
  });
}
