/**
 * The path to open after signing in, or undefined when the value could lead off the app's own
 * origin. Checking the text ("starts with one slash") is not enough: browsers read "\" as "/" and
 * drop tabs and newlines, so "/\evil.example" and "/\t/evil.example" become "//evil.example",
 * another host. The value is therefore parsed as a URL against our origin, and only a result on
 * that origin whose path cannot itself be read as "//host" is kept (OWASP ASVS 5.1.5).
 */
export function sameOriginPath(value: unknown, base: string): string | undefined {
  const candidate = Array.isArray(value) ? value[0] : value;
  if (typeof candidate !== "string" || candidate === "") return undefined;
  // Backslashes and control characters never appear in a link of ours; refuse rather than guess
  // how a browser will rewrite them.
  if (/[\\\u0000-\u001f\u007f]/.test(candidate)) return undefined;
  let url: URL;
  let origin: string;
  try {
    origin = new URL(base).origin;
    url = new URL(candidate, origin);
  } catch {
    return undefined;
  }
  if (url.origin !== origin) return undefined;
  const path = `${url.pathname}${url.search}${url.hash}`;
  return path.startsWith("/") && !path.startsWith("//") ? path : undefined;
}
