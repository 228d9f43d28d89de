import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepOrderSchema } from "@/lib/schemas/build";
import { reorderSteps } from "@/db/queries/build";
import { AppError } from "@/lib/server/http/errors";

export const PUT = channelRoute({ load: "episode", action: "build.edit", body: stepOrderSchema, what: "step order" }, async ({ episode, body }) => {
  const { ids } = body;
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
