import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepOrderSchema } from "@/lib/schemas/build";
import { reorderSteps } from "@/lib/server/services/build-plan";

export const PUT = channelRoute({ load: "episode", action: "build.edit", body: stepOrderSchema, what: "step order" }, async ({ episode, body }) => {
  await reorderSteps({ episodeId: episode.id, ids: body.ids });
  return json({ ok: true });
});
