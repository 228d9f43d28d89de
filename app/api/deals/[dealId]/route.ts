import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { can } from "@/lib/permissions";
import { dealUpdateSchema } from "@/lib/schemas/sponsors";
import { archiveDeal, updateDeal } from "@/lib/server/services/sponsors";
import { dealDtos } from "@/lib/server/views/sponsors";
import { recordAudit } from "@/db/queries/audit";

export const GET = channelRoute({ load: "deal", action: "channel.read" }, async ({ deal, access }) => json({ deal: (await dealDtos([deal], can(access.roles, "deals.fees")))[0] }));

export const PATCH = channelRoute({ load: "deal", action: "sponsors.manage", body: dealUpdateSchema, what: "deal" }, async ({ deal, channelId, user, access, body }) => {
  const row = await updateDeal({ deal, patch: body });
  await recordAudit({ channelId, userId: user.id, action: "update", entity: "deal", entityId: deal.id, after: body });
  return json({ deal: (await dealDtos([row], can(access.roles, "deals.fees")))[0] });
});

export const DELETE = channelRoute({ load: "deal", action: "sponsors.manage" }, async ({ deal, channelId, user }) => {
  await archiveDeal({ deal });
  await recordAudit({ channelId, userId: user.id, action: "archive", entity: "deal", entityId: deal.id });
  return json({ ok: true });
});
