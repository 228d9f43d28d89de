import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { deliverableCreateSchema } from "@/lib/schemas/sponsors";
import { addDeliverable } from "@/lib/server/services/sponsors";

/** Adds a checkable promise to a deal (seconds, talking points or a link, by kind). */
export const POST = channelRoute({ load: "deal", action: "sponsors.manage", body: deliverableCreateSchema, what: "deliverable" }, async ({ deal, body }) => {
  const row = await addDeliverable({ deal, input: body });
  return json({ deliverable: { id: row.id, dealId: row.dealId, kind: row.kind, seconds: row.seconds, phrases: row.phrases, url: row.url } }, 201);
});
