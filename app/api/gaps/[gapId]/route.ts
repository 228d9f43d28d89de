import { json } from "@/lib/server/http/api";
import { channelRoute } from "@/lib/server/http/route-builder";
import { gapUpdateSchema } from "@/lib/schemas/footage";
import { updateGap } from "@/db/queries/coverage";

export const PATCH = channelRoute({ load: "gap", action: "coverage.manage", body: gapUpdateSchema, what: "gap" }, async ({ gap, body: patch }) => {
  const after = await updateGap({ id: gap.id, patch });
  return json({ gap: { id: after!.id, status: after!.status, note: after!.note } });
});
