// The vendor's company name, as the customer's reviewer should read it ("Dana Novak of …"). The
// app stores no company of its own (its accounts are the vendor's customers), so it comes from
// the environment: VENDOR_NAME, else the display name of MAIL_FROM when that is the vendor's own
// (the default sender is the product, not a company). Null when neither says it.
export function vendorCompanyName(
  env: Record<string, string | undefined> = process.env,
): string | null {
  const explicit = env.VENDOR_NAME?.trim();
  if (explicit) return explicit;
  const display = /^\s*"?([^"<]+?)"?\s*</.exec(env.MAIL_FROM ?? "")?.[1]?.trim();
  return display && display.toLowerCase() !== "loopshift" ? display : null;
}
