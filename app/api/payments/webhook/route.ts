import { publicRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { verifiedEvent } from "@/lib/server/infra/payments";
import { handlePaymentEvent } from "@/lib/server/services/sponsors";

/**
 * Public by design: the payments service calls it. Nothing is trusted until
 * the Stripe-Signature header verifies against the raw body with the webhook
 * secret; an event already handled changes nothing.
 */
export const POST = publicRoute({}, async ({ req }) => {
  const raw = await req.text();
  let event;
  try {
    event = verifiedEvent(raw, req.headers.get("stripe-signature"));
  } catch {
    throw new AppError("validation:webhook.signature", "The webhook signature does not match.");
  }
  const outcome = await handlePaymentEvent(event as never);
  return json({ received: true, outcome });
});
