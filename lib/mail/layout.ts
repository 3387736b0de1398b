// The look of every message Loopshift sends: a plain card with the wordmark, the text, one button
// and the safety line. Inline styles only, because mail programs drop style sheets.

export type MailContent = { subject: string; text: string; html: string };

const COLORS = {
  page: "#f6f7f8",
  card: "#ffffff",
  band: "#123433",
  text: "#22262c",
  muted: "#555e6c",
  button: "#1d5452",
  rule: "#d6dadf",
  quote: "#eef7f6",
};

export function escapeHtml(value: string): string {
  return value
    .replace(/&/g, "&amp;")
    .replace(/</g, "&lt;")
    .replace(/>/g, "&gt;")
    .replace(/"/g, "&quot;")
    .replace(/'/g, "&#39;");
}

export type MailBlock =
  | { kind: "paragraph"; text: string }
  | { kind: "facts"; rows: [string, string][] }
  | { kind: "quote"; text: string }
  | { kind: "button"; label: string; href: string }
  | { kind: "note"; text: string };

export const SAFETY_LINE =
  "Figures are estimates from datasheet values and the stated assumptions. Converting an axis means working on live machine wiring: qualified persons only, with the machine isolated and locked out, under your local codes.";

const FONT = "font-family:Lato,Segoe UI,Helvetica,Arial,sans-serif;";

function blockHtml(block: MailBlock): string {
  switch (block.kind) {
    case "paragraph":
      return `<p style="${FONT}margin:0 0 14px;font-size:15px;line-height:22px;color:${COLORS.text}">${escapeHtml(block.text)}</p>`;
    case "note":
      return `<p style="${FONT}margin:0 0 14px;font-size:13px;line-height:19px;color:${COLORS.muted}">${escapeHtml(block.text)}</p>`;
    case "quote":
      return `<blockquote style="${FONT}margin:0 0 16px;padding:10px 14px;border-left:4px solid ${COLORS.button};background:${COLORS.quote};font-size:15px;line-height:22px;color:${COLORS.text};white-space:pre-wrap">${escapeHtml(block.text)}</blockquote>`;
    case "facts":
      return `<table role="presentation" style="${FONT}margin:0 0 16px;border-collapse:collapse;font-size:14px;color:${COLORS.text}">${block.rows
        .map(
          ([k, v]) =>
            `<tr><td style="padding:4px 18px 4px 0;color:${COLORS.muted}">${escapeHtml(k)}</td><td style="padding:4px 0;font-weight:700">${escapeHtml(v)}</td></tr>`,
        )
        .join("")}</table>`;
    case "button":
      return `<p style="margin:6px 0 18px"><a href="${escapeHtml(block.href)}" style="${FONT}display:inline-block;padding:11px 20px;border-radius:6px;background:${COLORS.button};color:#ffffff;font-size:15px;font-weight:700;text-decoration:none">${escapeHtml(block.label)}</a></p><p style="${FONT}margin:0 0 16px;font-size:12px;line-height:17px;color:${COLORS.muted}">Or open this address: <a href="${escapeHtml(block.href)}" style="color:${COLORS.button};word-break:break-all">${escapeHtml(block.href)}</a></p>`;
  }
}

function blockText(block: MailBlock): string {
  switch (block.kind) {
    case "paragraph":
    case "note":
      return block.text;
    case "quote":
      return block.text
        .split("\n")
        .map((line) => `> ${line}`)
        .join("\n");
    case "facts":
      return block.rows.map(([k, v]) => `${k}: ${v}`).join("\n");
    case "button":
      return `${block.label}:\n${block.href}`;
  }
}

/** A message with its plain-text part and its HTML part, built from the same blocks. */
export function composeMail(subject: string, heading: string, blocks: MailBlock[]): MailContent {
  const text = [heading, "", ...blocks.map(blockText).flatMap((b) => [b, ""]), "--", SAFETY_LINE]
    .join("\n")
    .trim();
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>${escapeHtml(subject)}</title></head><body style="margin:0;padding:0;background:${COLORS.page}"><table role="presentation" width="100%" style="border-collapse:collapse;background:${COLORS.page}"><tr><td align="center" style="padding:24px 12px"><table role="presentation" width="100%" style="max-width:600px;border-collapse:collapse;background:${COLORS.card};border:1px solid ${COLORS.rule};border-radius:10px"><tr><td style="${FONT}padding:16px 24px;background:${COLORS.band};border-radius:10px 10px 0 0;color:#ffffff;font-size:18px;font-weight:900;letter-spacing:0.3px">Loopshift</td></tr><tr><td style="padding:24px"><h1 style="${FONT}margin:0 0 16px;font-size:21px;line-height:28px;color:${COLORS.text}">${escapeHtml(heading)}</h1>${blocks.map(blockHtml).join("")}</td></tr><tr><td style="${FONT}padding:14px 24px;border-top:1px solid ${COLORS.rule};font-size:12px;line-height:17px;color:${COLORS.muted}">${escapeHtml(SAFETY_LINE)}</td></tr></table></td></tr></table></body></html>`;
  return { subject, text, html };
}
