import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { shotBulkSchema } from "@/lib/schemas/footage";
import { setShotStatus } from "@/db/queries/shots";
import { AppError } from "@/lib/server/errors";

type P = { episodeId: string };

/** One status for many shots, all or none. */
export const POST = route<P>(async (req, params) => {
  const { ids, status } = await parseBody(req, shotBulkSchema, "bulk status");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "shots.edit");
  const n = await setShotStatus({ episodeId: episode.id, ids, status });
  if (n == null) throw new AppError("not_found:shot", "Some of those shots are not on this episode's shot list; nothing was changed.");
  return json({ updated: n });
});
