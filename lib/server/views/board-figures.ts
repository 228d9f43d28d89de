import "server-only";
import { scriptView } from "./script";
import { DEFAULT_WPM } from "../../script-timing";
import { coverageOf } from "./coverage";
import type { Episode } from "../../../db/schema";
import { listSegmentsByEpisodes } from "../../../db/queries/script";
import { listGapsByEpisodes, listRangesByEpisodes } from "../../../db/queries/coverage";
import { getChannelById } from "../../../db/queries/channels";
import { countShotsByEpisodes } from "../../../db/queries/shots";
import { listReadingRatesByUserIds } from "../../../db/queries/users";
import { episodesWithSponsorWork } from "../../../db/queries/sponsors";
import { channelShelf, sponsorChecksFor } from "./sponsors";

export interface BoardFigures {
  scriptSeconds: number | null;
  openGaps: number | null;
  shotsDone: number;
  shotsTotal: number;
  /** The sponsor checks' state; absent when the episode has no deal and no sponsored tool. */
  sponsorState?: "met" | "open" | "blocked";
}

/** The progress figures each board card shows, for all episodes of one channel at once. */
export async function boardFigures(episodes: Episode[]): Promise<Map<string, BoardFigures>> {
  const out = new Map<string, BoardFigures>();
  if (!episodes.length) return out;
  const ids = episodes.map((e) => e.id);
  const [segments, ranges, gaps, channel, shots] = await Promise.all([
    listSegmentsByEpisodes({ episodeIds: ids }),
    listRangesByEpisodes({ episodeIds: ids }),
    listGapsByEpisodes({ episodeIds: ids }),
    getChannelById({ id: episodes[0]!.channelId }),
    countShotsByEpisodes({ episodeIds: ids }),
  ]);
  const wpm = await listReadingRatesByUserIds({ ids: [...new Set(episodes.flatMap((e) => (e.presenterId ? [e.presenterId] : [])))] });
  for (const e of episodes) {
    const mine = segments.filter((s) => s.episodeId === e.id);
    const s = shots.get(e.id) ?? { done: 0, total: 0 };
    if (!mine.length) {
      out.set(e.id, { scriptSeconds: null, openGaps: null, shotsDone: s.done, shotsTotal: s.total });
      continue;
    }
    const view = scriptView(e, mine, e.presenterId ? (wpm.get(e.presenterId) ?? DEFAULT_WPM) : DEFAULT_WPM);
    const cov = coverageOf(e, channel!, view, ranges.filter((r) => r.episodeId === e.id), gaps.filter((g) => g.episodeId === e.id));
    out.set(e.id, { scriptSeconds: Math.round(view.totals.seconds), openGaps: cov.openGaps, shotsDone: s.done, shotsTotal: s.total });
  }
  // Sponsor checks only where there is something to check: a deal, or a gifted, loaned or paid tool in the plan.
  const withWork = await episodesWithSponsorWork({ episodeIds: ids });
  const shelf = withWork.length ? await channelShelf(episodes[0]!.channelId) : undefined;
  for (const id of withWork) {
    const e = episodes.find((x) => x.id === id)!;
    const { state } = await sponsorChecksFor(e, shelf);
    if (state !== "none") out.set(id, { ...(out.get(id) ?? { scriptSeconds: null, openGaps: null, shotsDone: 0, shotsTotal: 0 }), sponsorState: state });
  }
  return out;
}
