/**
 * A number as a person types it. A decimal comma is accepted ("0,24" is 0.24), as is a grouped
 * thousand with the other mark as decimal ("1,234.5", "1.234,5"). "1,234" alone could be either
 * a thousand or a little over one, so it is refused rather than guessed.
 */
export type TypedNumber =
  | { ok: true; value: number }
  | { ok: false; reason: "empty" | "not-a-number" | "ambiguous" };

const GROUPED = /^\d{1,3}([.,]\d{3})+$/;

export function parseTypedNumber(text: string): TypedNumber {
  const raw = text.trim().replace(/[\s\u00a0\u202f]/g, "").replace(/^\u2212/, "-");
  if (raw === "") return { ok: false, reason: "empty" };
  const sign = raw.startsWith("-") ? -1 : 1;
  const body = raw.replace(/^[-+]/, "");
  const commas = (body.match(/,/g) ?? []).length;
  const dots = (body.match(/\./g) ?? []).length;
  let plain: string;
  if (commas === 0) plain = body;
  else if (dots === 0 && commas === 1) {
    const [whole, fraction] = body.split(",");
    // "1,234": a thousands group or a decimal comma; "0,234" and "1,23" can only be decimals.
    if (fraction.length === 3 && /^[1-9]\d{0,2}$/.test(whole)) return { ok: false, reason: "ambiguous" };
    plain = `${whole}.${fraction}`;
  } else {
    // Both marks, or several of one: the last mark is the decimal one unless every mark groups thousands.
    const decimalMark = body.lastIndexOf(",") > body.lastIndexOf(".") ? "," : ".";
    const groupMark = decimalMark === "," ? "." : ",";
    const onlyGroups = (dots === 0 || commas === 0) && GROUPED.test(body);
    if (onlyGroups) plain = body.replace(/[.,]/g, "");
    else {
      const cut = body.lastIndexOf(decimalMark);
      const whole = body.slice(0, cut);
      if (whole.includes(decimalMark) || !(whole === "" || GROUPED.test(whole) || /^\d+$/.test(whole)))
        return { ok: false, reason: "not-a-number" };
      plain = `${whole.split(groupMark).join("")}.${body.slice(cut + 1)}`;
    }
  }
  if (!/^(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(plain)) return { ok: false, reason: "not-a-number" };
  return { ok: true, value: sign * Number(plain) };
}

/** The sentence beside a field when what was typed is not a number we can read. */
export function typedNumberMessage(label: string, text: string, reason: "not-a-number" | "ambiguous"): string {
  if (reason === "ambiguous") {
    const digits = text.trim().replace(",", "");
    return `${label}: write ${digits} or ${text.trim().replace(",", ".")} — '${text.trim()}' could mean either`;
  }
  return `${label}: enter a number such as 0.24`;
}
