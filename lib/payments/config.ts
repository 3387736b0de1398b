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

export function paymentConfig(env: NodeJS.ProcessEnv = process.env): PaymentConfig {
  const port = env.STRIPE_API_PORT ? Number(env.STRIPE_API_PORT) : undefined;
  const protocol =
    env.STRIPE_API_PROTOCOL === "http" ? "http" : env.STRIPE_API_HOST ? "https" : undefined;
  return {
    secretKey: env.STRIPE_SECRET_KEY || LOCAL_SECRET_KEY,
    webhookSecret: env.STRIPE_WEBHOOK_SECRET || LOCAL_WEBHOOK_SECRET,
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
