import { json } from "@/lib/server/http/api";
import { channelRoute } from "@/lib/server/http/route-builder";
import { deleteRange } from "@/db/queries/coverage";
import { getEpisodeById } from "@/db/queries/episodes";
import { settleGaps } from "@/lib/server/services/coverage";

export const DELETE = channelRoute({ load: "range", action: "coverage.manage" }, async ({ range }) => {
  await deleteRange({ id: range.id });
  await settleGaps((await getEpisodeById({ id: range.episodeId }))!);
  return json({ ok: true });
});
