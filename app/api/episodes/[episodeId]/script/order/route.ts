import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { segmentOrderSchema } from "@/lib/schemas/script";
import { reorderSegments } from "@/lib/server/services/script";

export const PUT = channelRoute({ load: "episode", action: "script.write", body: segmentOrderSchema, what: "segment order" }, async ({ episode, body }) => {
  await reorderSegments({ episodeId: episode.id, ids: body.ids });
  return json({ ok: true });
});
