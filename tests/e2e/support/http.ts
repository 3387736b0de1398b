import { inject } from "vitest";

export const baseUrl = () => inject("baseUrl");

// A minimal cookie jar: enough for next-auth's csrf and session cookies.
export class CookieJar {
  private cookies = new Map<string, string>();
  store(res: Response) {
    for (const line of res.headers.getSetCookie()) {
      const [pair] = line.split(";");
      const i = pair.indexOf("=");
      this.cookies.set(pair.slice(0, i), pair.slice(i + 1));
    }
  }
  header() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join("; ");
  }
}

const UNSAFE = new Set(["POST", "PUT", "PATCH", "DELETE"]);

// Sends what a browser on our own pages sends: the cookie, and for a write the page's Origin
// (the handlers refuse cookie-authenticated writes without it). A test of a forged request
// states its own Origin, which is then left as it is.
// `base` is another server than the shared one (a test that starts and kills its own).
export async function request(
  jar: CookieJar | null,
  path: string,
  init: RequestInit = {},
  base = baseUrl(),
) {
  const headers = new Headers(init.headers);
  if (jar) headers.set("cookie", jar.header());
  if (UNSAFE.has((init.method ?? "GET").toUpperCase()) && !headers.has("origin")) {
    headers.set("origin", new URL(base).origin);
  }
  const res = await fetch(`${base}${path}`, { ...init, headers, redirect: "manual" });
  jar?.store(res);
  return res;
}

// Signs in through next-auth's credentials callback, as the sign-in form does.
export async function signInOverHttp(email: string, password: string, base = baseUrl()) {
  const jar = new CookieJar();
  const csrf = (await (await request(jar, "/api/auth/csrf", {}, base)).json()) as {
    csrfToken: string;
  };
  const res = await request(
    jar,
    "/api/auth/callback/credentials",
    {
      method: "POST",
      headers: { "content-type": "application/x-www-form-urlencoded" },
      body: new URLSearchParams({ csrfToken: csrf.csrfToken, email, password, json: "true" }),
    },
    base,
  );
  const body = (await res.json()) as { url: string };
  const error = new URL(body.url).searchParams.get("error");
  return { jar, error };
}
