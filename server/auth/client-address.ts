import "server-only";
/**
 * The client's address for the sign-in throttle.
 *
 * Next.js gives a route handler no socket, and it fills X-Forwarded-For from the socket only when
 * the client sent none, so that header is whatever the client chose and cannot key a throttle.
 * The server process is therefore started with lib/cli/peer-address.mjs preloaded
 * (spawnNext in lib/cli/app-server.ts), which writes the TCP peer into PEER_HEADER on every
 * request, overwriting any copy the client sent, and marks the process with PEER_MARK. Without
 * the mark (the server started some other way) the header is not trusted at all.
 *
 * TRUSTED_PROXY says who may speak for the client through X-Forwarded-For: a number of proxy
 * hops in front of the app (each appends the address it saw), or a comma-separated list of the
 * proxies' addresses. Unset, X-Forwarded-For is ignored and the peer is the client.
 */
export const PEER_HEADER = "x-loopshift-peer";
export const PEER_MARK = "LOOPSHIFT_PEER_FROM_SOCKET";
export const UNKNOWN_ADDRESS = "unknown";

type Headers = Record<string, unknown> | undefined;

function header(headers: Headers, name: string): string {
  const value = headers?.[name];
  return typeof value === "string" ? value.trim() : "";
}

// "::ffff:10.0.0.1" and "10.0.0.1" are the same client.
function normalise(address: string): string {
  return address.replace(/^::ffff:(?=\d+\.\d+\.\d+\.\d+$)/i, "");
}

export function clientAddress(
  headers: Headers,
  env: Record<string, string | undefined> = process.env,
): string {
  const peer = env[PEER_MARK] === "1" ? normalise(header(headers, PEER_HEADER)) : "";
  if (!peer) return UNKNOWN_ADDRESS;
  const trusted = env.TRUSTED_PROXY?.trim();
  if (!trusted) return peer;

  const forwarded = header(headers, "x-forwarded-for")
    .split(",")
    .map((a) => normalise(a.trim()))
    .filter(Boolean);
  const chain = [...forwarded, peer];
  if (/^\d+$/.test(trusted)) {
    // Each trusted hop appended what it saw; the client is the entry just before the last hop's.
    return chain[Math.max(0, chain.length - 1 - Number(trusted))];
  }
  const proxies = new Set(trusted.split(",").map((a) => normalise(a.trim())));
  // Only a trusted proxy may speak for the address before it; the first untrusted one from the
  // right is the client.
  for (let i = chain.length - 1; i >= 0; i--) {
    if (!proxies.has(chain[i])) return chain[i];
  }
  return chain[0];
}
