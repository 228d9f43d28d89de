import "server-only";
import { coverageOf } from "./coverage-view";
import { scriptViewFor } from "./script-view";
import type { Episode } from "../../db/schema";
import { getChannelById } from "../../db/queries/channels";
import { listGapsByEpisode, listRangesByEpisode, resolveClosedGaps } from "../../db/queries/coverage";

export async function coverageFor(episode: Episode) {
  const [view, channel, ranges, stored] = await Promise.all([scriptViewFor(episode), getChannelById({ id: episode.channelId }), listRangesByEpisode({ episodeId: episode.id }), listGapsByEpisode({ episodeId: episode.id })]);
  return { view, coverage: coverageOf(episode, channel!, view, ranges, stored) };
}

/** After B-roll changes: kept computed gaps that B-roll now covers are marked resolved. */
export async function settleGaps(episode: Episode) {
  const { coverage } = await coverageFor(episode);
  await resolveClosedGaps({ episodeId: episode.id, stillOpen: coverage.stillComputed });
}
