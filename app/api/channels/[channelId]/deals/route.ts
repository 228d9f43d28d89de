import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { can } from "@/lib/permissions";
import { dealCreateSchema } from "@/lib/schemas/sponsors";
import { listDealsByChannel } from "@/db/queries/sponsors";
import { createDeal } from "@/lib/server/services/sponsors";
import { dealDtos } from "@/lib/server/views/sponsors";
import { recordAudit } from "@/db/queries/audit";

/** Every member reads deals; fees only the owner and the sponsor liaison. */
export const GET = channelRoute({ load: "channel", action: "channel.read" }, async ({ channelId, access }) => json({ deals: await dealDtos(await listDealsByChannel({ channelId }), can(access.roles, "deals.fees")) }));

export const POST = channelRoute({ load: "channel", action: "sponsors.manage", body: dealCreateSchema, what: "deal" }, async ({ channelId, user, access, body }) => {
  const row = await createDeal({ channelId, input: body });
  await recordAudit({ channelId, userId: user.id, action: "create", entity: "deal", entityId: row.id, after: body });
  return json({ deal: (await dealDtos([row], can(access.roles, "deals.fees")))[0] }, 201);
});
