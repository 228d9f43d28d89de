import "server-only";
/**
 * The payments service through its official Node SDK. With the local
 * defaults it talks to the fake that `npm start` runs on 127.0.0.1; with
 * real keys (and no STRIPE_API_* overrides) the same code talks to the real service.
 */
import Stripe from "stripe";
import { env } from "../../env";

const g = globalThis as unknown as { __jigboardPayments?: Stripe };

export function payments(): Stripe {
  if (!g.__jigboardPayments) {
    const e = env();
    g.__jigboardPayments = new Stripe(e.STRIPE_SECRET_KEY, {
      ...(e.STRIPE_API_HOST ? { host: e.STRIPE_API_HOST } : {}),
      ...(e.STRIPE_API_PORT ? { port: e.STRIPE_API_PORT } : {}),
      ...(e.STRIPE_API_PROTOCOL ? { protocol: e.STRIPE_API_PROTOCOL } : {}),
      maxNetworkRetries: 2,
      telemetry: false,
    });
  }
  return g.__jigboardPayments;
}

/** Verifies a webhook's signature against the raw body; throws when it does not match. */
export function verifiedEvent(rawBody: string, signature: string | null): Stripe.Event {
  return payments().webhooks.constructEvent(rawBody, signature ?? "", env().STRIPE_WEBHOOK_SECRET);
}
