import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { AppError } from "@/lib/server/http/errors";
import { presenceSchema } from "@/lib/schemas/shoot-log";
import { linksBelong } from "@/db/queries/shots";
import { announcePresence } from "@/db/queries/live";

/** Tells the others on this episode which segment I am editing (or none); announced live, never stored. */
export const POST = channelRoute({ load: "episode", action: "script.annotate", body: presenceSchema, what: "presence" }, async ({ episode, user, body }) => {
  if (body.segmentId && (await linksBelong({ episodeId: episode.id, segmentId: body.segmentId }))) throw new AppError("unprocessable:presence.segment", "That segment is not in this episode.", { fields: { segmentId: ["not in this episode"] } });
  await announcePresence({ channelId: episode.channelId, episodeId: episode.id, kind: "presence", op: "focus", recordIds: [], userId: user.id, userName: user.name, segmentId: body.segmentId });
  return json({ ok: true });
});
