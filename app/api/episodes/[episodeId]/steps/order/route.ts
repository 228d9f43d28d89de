import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { stepOrderSchema } from "@/lib/schemas/build";
import { reorderSteps } from "@/db/queries/build";
import { AppError } from "@/lib/server/errors";

type P = { episodeId: string };

export const PUT = route<P>(async (req, params) => {
  const { ids } = await parseBody(req, stepOrderSchema, "step order");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "build.edit");
  await reorderSteps({
    episodeId: episode.id,
    ids,
    check: (current) => {
      const same = current.length === ids.length && current.every((id) => ids.includes(id));
      if (!same) throw new AppError("conflict:step.order", "The plan changed since you loaded it: reload and reorder again.", { fields: { ids: ["must list every step of this episode exactly once"] } });
    },
  });
  return json({ ok: true });
});
