import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { shotBulkSchema } from "@/lib/schemas/footage";
import { setShotStatus } from "@/lib/server/services/shots";
import { AppError } from "@/lib/server/http/errors";

/** One status for many shots, all or none. */
export const POST = channelRoute({ load: "episode", action: "shots.edit", body: shotBulkSchema, what: "bulk status" }, async ({ episode, body }) => {
  const { ids, status } = body;
  const n = await setShotStatus({ episodeId: episode.id, ids, status });
  if (n == null) throw new AppError("not_found:shot", "Some of those shots are not on this episode's shot list; nothing was changed.");
  return json({ updated: n });
});
