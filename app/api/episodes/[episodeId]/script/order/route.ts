import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { segmentOrderSchema } from "@/lib/schemas/script";
import { reorderSegments } from "@/db/queries/script";
import { AppError } from "@/lib/server/http/errors";

export const PUT = channelRoute({ load: "episode", action: "script.write", body: segmentOrderSchema, what: "segment order" }, async ({ episode, body }) => {
  const { ids } = body;
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
