import "server-only";
import Stripe from "stripe";
import { paymentConfig } from "./config";

let client: Stripe | undefined;

/** The official SDK, pointed at the host, port and protocol of the environment (the fake locally). */
export function stripeClient(): Stripe {
  if (!client) {
    const { secretKey, host, port, protocol } = paymentConfig();
    client = new Stripe(secretKey, {
      host,
      port,
      protocol,
      telemetry: false,
      maxNetworkRetries: 1,
      timeout: 15_000,
    });
  }
  return client;
}
