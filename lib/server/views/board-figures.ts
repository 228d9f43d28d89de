import "server-only";
import { scriptView } from "./script";
import { DEFAULT_WPM } from "../../script-timing";
import { coverageOf } from "./coverage";
import type { Episode } from "../../../db/schema";
import { listSegmentsByEpisodes } from "../../../db/queries/script";
import { listGapsByEpisodes, listRangesByEpisodes } from "../../../db/queries/coverage";
import { getChannelById } from "../../../db/queries/channels";
import { listEpisodesByIds } from "../../../db/queries/episodes";
import { countShotsByChannel } from "../../../db/queries/shots";
import { listEpisodeFiguresByChannel, storeEpisodeFigures, type StoredFigures } from "../../../db/queries/figures";
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

/** Every figure a board card shows: progress figures and, where there is sponsor work, the checks' state. */
export async function boardFigures(episodes: Episode[]): Promise<Map<string, BoardFigures>> {
  const [progress, sponsor] = await Promise.all([progressFigures(episodes), sponsorStates(episodes)]);
  for (const [id, state] of sponsor) progress.set(id, { ...progress.get(id)!, sponsorState: state });
  return progress;
}

/**
 * Script runtime, open gaps and shot counts of episodes of one channel.
 * Runtime and gaps come from episode_figures while still current; only
 * episodes whose inputs changed since are computed (from data read after
 * their revision was seen) and stored again.
 */
export async function progressFigures(episodes: Episode[]): Promise<Map<string, BoardFigures>> {
  const out = new Map<string, BoardFigures>();
  if (!episodes.length) return out;
  const channelId = episodes[0]!.channelId;
  const [stored, shots] = await Promise.all([listEpisodeFiguresByChannel({ channelId }), countShotsByChannel({ channelId })]);
  const stale = episodes.filter((e) => {
    const f = stored.get(e.id);
    return !f || f.computedRev !== f.rev;
  });
  const fresh = stale.length ? await computeFigures(stale, stored) : new Map<string, Pick<BoardFigures, "scriptSeconds" | "openGaps">>();
  for (const e of episodes) {
    const f = fresh.get(e.id) ?? stored.get(e.id) ?? { scriptSeconds: null, openGaps: null };
    const s = shots.get(e.id) ?? { done: 0, total: 0 };
    out.set(e.id, { scriptSeconds: f.scriptSeconds, openGaps: f.openGaps, shotsDone: s.done, shotsTotal: s.total });
  }
  return out;
}

/**
 * The sponsor checks' state of the episodes that have something to check (a
 * live deal, or a gifted, loaned or paid tool in the plan), read fresh: the
 * checks read deals, reviews, tools and the composed description, which the
 * cached figures do not follow.
 */
export async function sponsorStates(episodes: Episode[]): Promise<Map<string, NonNullable<BoardFigures["sponsorState"]>>> {
  const out = new Map<string, NonNullable<BoardFigures["sponsorState"]>>();
  if (!episodes.length) return out;
  const channelId = episodes[0]!.channelId;
  const mine = new Map(episodes.map((e) => [e.id, e]));
  const checked = (await episodesWithSponsorWork({ channelId })).filter((id) => mine.has(id));
  const shelf = checked.length ? await channelShelf(channelId) : undefined;
  for (const id of checked) {
    const { state } = await sponsorChecksFor(mine.get(id)!, shelf);
    if (state !== "none") out.set(id, state);
  }
  return out;
}

/** Script runtime and open gaps of episodes whose stored figures are stale; stores them. */
async function computeFigures(loaded: Episode[], stored: Map<string, StoredFigures>) {
  const out = new Map<string, Pick<BoardFigures, "scriptSeconds" | "openGaps">>();
  const ids = loaded.map((e) => e.id);
  // Everything is read after the revisions were, the episodes' own rows too.
  const [episodes, segments, ranges, gaps, channel] = await Promise.all([
    listEpisodesByIds({ ids }),
    listSegmentsByEpisodes({ episodeIds: ids }),
    listRangesByEpisodes({ episodeIds: ids }),
    listGapsByEpisodes({ episodeIds: ids }),
    getChannelById({ id: loaded[0]!.channelId }),
  ]);
  const wpm = await listReadingRatesByUserIds({ ids: [...new Set(episodes.flatMap((e) => (e.presenterId ? [e.presenterId] : [])))] });
  const byEpisode = <T extends { episodeId: string }>(rows: T[]) => {
    const m = new Map<string, T[]>();
    for (const r of rows) {
      const list = m.get(r.episodeId);
      if (list) list.push(r);
      else m.set(r.episodeId, [r]);
    }
    return m;
  };
  const [segs, rangesOf, gapsOf] = [byEpisode(segments), byEpisode(ranges), byEpisode(gaps)];
  for (const e of episodes) {
    const mine = segs.get(e.id);
    if (!mine) {
      out.set(e.id, { scriptSeconds: null, openGaps: null });
      continue;
    }
    const view = scriptView(e, mine, e.presenterId ? (wpm.get(e.presenterId) ?? DEFAULT_WPM) : DEFAULT_WPM);
    const cov = coverageOf(e, channel!, view, rangesOf.get(e.id) ?? [], gapsOf.get(e.id) ?? []);
    out.set(e.id, { scriptSeconds: Math.round(view.totals.seconds), openGaps: cov.openGaps });
  }
  try {
    await storeEpisodeFigures(episodes.map((e) => ({ episodeId: e.id, rev: stored.get(e.id)?.rev ?? 0, ...out.get(e.id)! })));
  } catch (err) {
    // A cache write that fails (a lock timeout, a deadlock) leaves the figures to be computed next time.
    console.warn("episode figures not stored:", (err as Error).message);
  }
  return out;
}
