import { json } from "@/lib/server/api";
import { channelRoute } from "@/lib/server/route-builder";
import { deleteRange } from "@/db/queries/coverage";
import { getEpisodeById } from "@/db/queries/episodes";
import { settleGaps } from "@/lib/server/coverage-loader";

export const DELETE = channelRoute({ load: "range", action: "coverage.manage" }, async ({ range }) => {
  await deleteRange({ id: range.id });
  await settleGaps((await getEpisodeById({ id: range.episodeId }))!);
  return json({ ok: true });
});
