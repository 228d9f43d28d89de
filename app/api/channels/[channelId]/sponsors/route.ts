import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { sponsorCreateSchema } from "@/lib/schemas/sponsors";
import { listSponsorsByChannel } from "@/db/queries/sponsors";
import { createSponsor } from "@/lib/server/services/sponsors";
import { sponsorDtos } from "@/lib/server/views/sponsors";
import { recordAudit } from "@/db/queries/audit";

export const GET = channelRoute({ load: "channel", action: "channel.read" }, async ({ channelId }) => json({ sponsors: await sponsorDtos(await listSponsorsByChannel({ channelId })) }));

export const POST = channelRoute({ load: "channel", action: "sponsors.manage", body: sponsorCreateSchema, what: "sponsor" }, async ({ channelId, user, body }) => {
  const row = await createSponsor({ channelId, input: body });
  await recordAudit({ channelId, userId: user.id, action: "create", entity: "sponsor", entityId: row.id, after: body });
  return json({ sponsor: (await sponsorDtos([row]))[0] }, 201);
});
