import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { sponsorUpdateSchema } from "@/lib/schemas/sponsors";
import { archiveSponsor, updateSponsor } from "@/lib/server/services/sponsors";
import { sponsorDtos } from "@/lib/server/views/sponsors";
import { recordAudit } from "@/db/queries/audit";

export const GET = channelRoute({ load: "sponsor", action: "channel.read" }, async ({ sponsor }) => json({ sponsor: (await sponsorDtos([sponsor]))[0] }));

export const PATCH = channelRoute({ load: "sponsor", action: "sponsors.manage", body: sponsorUpdateSchema, what: "sponsor" }, async ({ sponsor, channelId, user, body }) => {
  const row = await updateSponsor({ sponsor, patch: body });
  await recordAudit({ channelId, userId: user.id, action: "update", entity: "sponsor", entityId: sponsor.id, after: body });
  return json({ sponsor: (await sponsorDtos([row]))[0] });
});

/** Deleting a sponsor archives it; its deals stay for the record. */
export const DELETE = channelRoute({ load: "sponsor", action: "sponsors.manage" }, async ({ sponsor, channelId, user }) => {
  await archiveSponsor({ sponsor });
  await recordAudit({ channelId, userId: user.id, action: "archive", entity: "sponsor", entityId: sponsor.id });
  return json({ ok: true });
});
