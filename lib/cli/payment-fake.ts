import { LOCAL_SECRET_KEY, LOCAL_WEBHOOK_SECRET } from "../../server/payments/config";
import { startFakePaymentApi, type FakePaymentApi } from "../payments/fake/server";

/**
 * Starts the local fake payment API on loopback unless a real provider is configured, and points
 * the app's environment at it. STRIPE_FAKE=on|off decides; by default the fake runs when no
 * STRIPE_SECRET_KEY is set. STRIPE_API_PORT, when set, is the fake's port (else a free one).
 */
export async function startLocalPayments(env: NodeJS.ProcessEnv): Promise<FakePaymentApi | null> {
  const wanted = env.STRIPE_FAKE ? env.STRIPE_FAKE === "on" : !env.STRIPE_SECRET_KEY;
  if (!wanted) return null;
  env.STRIPE_SECRET_KEY ||= LOCAL_SECRET_KEY;
  env.STRIPE_WEBHOOK_SECRET ||= LOCAL_WEBHOOK_SECRET;
  const fake = await startFakePaymentApi({
    secretKey: env.STRIPE_SECRET_KEY,
    webhookSecret: env.STRIPE_WEBHOOK_SECRET,
    webhookUrl: `${env.NEXTAUTH_URL}/api/webhooks/stripe`,
    port: env.STRIPE_API_PORT ? Number(env.STRIPE_API_PORT) : 0,
  });
  env.STRIPE_API_HOST = fake.host;
  env.STRIPE_API_PORT = String(fake.port);
  env.STRIPE_API_PROTOCOL = "http";
  return fake;
}
