import { z } from "zod";

// A person's display name as typed into a form or the API. Names end up in mail headers
// ("To: Name <address>"), the audit log and page text, where a CR or LF would start a new header
// or a forged log line, so line breaks and other control characters become single spaces.
export function displayName(requiredMessage: string) {
  return z
    .string()
    .transform((value) =>
      value
        .replace(/[\u0000-\u001f\u007f\u2028\u2029]+/g, " ")
        .replace(/ {2,}/g, " ")
        .trim(),
    )
    .pipe(z.string().min(1, requiredMessage).max(120, "Keep the name under 120 characters"));
}
