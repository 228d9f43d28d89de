import "server-only";
import { coverageOf } from "../views/coverage";
import { scriptViewFor } from "../views/script";
import type { Episode } from "../../../db/schema";
import { getChannelById } from "../../../db/queries/channels";
import { listGapsByEpisode, listRangesByEpisode, resolveClosedGaps } from "../../../db/queries/coverage";
import { listShotsByEpisode } from "../../../db/queries/shots";

export async function coverageFor(episode: Episode) {
  const [view, channel, ranges, stored, shots] = await Promise.all([
    scriptViewFor(episode),
    getChannelById({ id: episode.channelId }),
    listRangesByEpisode({ episodeId: episode.id }),
    listGapsByEpisode({ episodeId: episode.id }),
    listShotsByEpisode({ episodeId: episode.id }),
  ]);
  const pickups = new Map(shots.filter((s) => s.gapId).map((s) => [s.gapId!, s.id]));
  return { view, coverage: coverageOf(episode, channel!, view, ranges, stored, pickups) };
}

/** After B-roll changes: kept computed gaps that B-roll now covers are marked resolved. */
export async function settleGaps(episode: Episode) {
  const { coverage } = await coverageFor(episode);
  await resolveClosedGaps({ episodeId: episode.id, stillOpen: coverage.stillComputed });
}
