// No "server-only" guard here: lib/cli/app-server.ts and lib/cli/start.ts load this file with
// plain tsx, outside a React Server Component bundle, where the guard would throw.
/**
 * The payment provider's settings from the environment. Without any, `npm start` and the tests
 * run the local fake payment API (lib/payments/fake) and point the real SDK at it with these
 * test-mode keys; in production STRIPE_SECRET_KEY, STRIPE_WEBHOOK_SECRET and no STRIPE_API_HOST
 * send the same calls to the real service.
 */
export const LOCAL_SECRET_KEY = "sk_test_loopshift_local";
export const LOCAL_WEBHOOK_SECRET = "whsec_loopshift_local";

export interface PaymentConfig {
  secretKey: string;
  webhookSecret: string;
  host?: string;
  port?: number;
  protocol?: "http" | "https";
}

/**
 * A key other than the local fake's is a real provider's key. With one, the webhook secret must
 * come from the environment: the local secret is published in the README, so falling back to it
 * would let anyone sign a checkout.session.completed that unlocks a dossier.
 */
export function hasRealSecretKey(env: NodeJS.ProcessEnv = process.env): boolean {
  return Boolean(env.STRIPE_SECRET_KEY) && env.STRIPE_SECRET_KEY !== LOCAL_SECRET_KEY;
}

export const MISSING_WEBHOOK_SECRET =
  "STRIPE_SECRET_KEY is set to a real payment key but STRIPE_WEBHOOK_SECRET is not set. " +
  "Set STRIPE_WEBHOOK_SECRET to the signing secret of the provider's webhook endpoint; the " +
  "local fallback secret is public and only serves the local fake payment API.";

export class PaymentConfigError extends Error {}

/** Stops the app at start (npm start, the e2e setup) when a real key has no webhook secret. */
export function assertPaymentEnv(env: NodeJS.ProcessEnv = process.env): void {
  if (hasRealSecretKey(env) && !env.STRIPE_WEBHOOK_SECRET) {
    throw new PaymentConfigError(MISSING_WEBHOOK_SECRET);
  }
}

export function paymentConfig(env: NodeJS.ProcessEnv = process.env): PaymentConfig {
  const port = env.STRIPE_API_PORT ? Number(env.STRIPE_API_PORT) : undefined;
  const protocol =
    env.STRIPE_API_PROTOCOL === "http" ? "http" : env.STRIPE_API_HOST ? "https" : undefined;
  return {
    secretKey: env.STRIPE_SECRET_KEY || LOCAL_SECRET_KEY,
    // Empty (never the public local secret) when a real key is set without one; the webhook
    // handler refuses every event then, in case the server was started without npm start.
    webhookSecret: env.STRIPE_WEBHOOK_SECRET || (hasRealSecretKey(env) ? "" : LOCAL_WEBHOOK_SECRET),
    host: env.STRIPE_API_HOST || undefined,
    port: Number.isInteger(port) ? port : undefined,
    protocol,
  };
}

const LOOPBACK = /^(localhost|127(?:\.\d{1,3}){3}|\[?::1\]?)$/i;

/**
 * The fake is in use when the API host is on this machine: the real service never is. The
 * test-mode banner shows then, and whenever the key is a test key.
 */
export function paymentsTestMode(env: NodeJS.ProcessEnv = process.env): boolean {
  const { host, secretKey } = paymentConfig(env);
  return (host !== undefined && LOOPBACK.test(host)) || secretKey.startsWith("sk_test_");
}
