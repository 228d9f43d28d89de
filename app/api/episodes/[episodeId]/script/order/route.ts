import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { segmentOrderSchema } from "@/lib/schemas/script";
import { reorderSegments } from "@/db/queries/script";
import { AppError } from "@/lib/server/errors";

type P = { episodeId: string };

export const PUT = route<P>(async (req, params) => {
  const { ids } = await parseBody(req, segmentOrderSchema, "segment order");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "script.write");
  await reorderSegments({
    episodeId: episode.id,
    ids,
    check: (current) => {
      if (current.length !== ids.length || !current.every((id) => ids.includes(id))) {
        throw new AppError("conflict:segment.order", "The script changed since you loaded it: reload and reorder again.", { fields: { ids: ["must list every segment exactly once"] } });
      }
    },
  });
  return json({ ok: true });
});
