import "server-only";
import { computeCoverage, type ComputedGap, type GapView } from "../../coverage";

export type { GapView };
import { formatTimecode, msToFrames, rateOf } from "../../timecode";
import type { Channel, CoverageRange, Episode, Gap } from "../../../db/schema";
import { scriptViewFor, type scriptView } from "./script";
import { getChannelById } from "../../../db/queries/channels";
import { listGapsByEpisode, listRangesByEpisode } from "../../../db/queries/coverage";
import { listShotsByEpisode } from "../../../db/queries/shots";


export function coverageOf(episode: Episode, channel: Pick<Channel, "brollGapMs" | "toCameraMaxMs">, view: ReturnType<typeof scriptView>, ranges: CoverageRange[], stored: Gap[], pickups: Map<string, string> = new Map()) {
  const rate = rateOf(view.rate.id as Episode["frameRate"], view.rate.dropFrame);
  const thresholds = { voiceOverGapFrames: msToFrames(channel.brollGapMs, rate), toCameraMaxFrames: msToFrames(channel.toCameraMaxMs, rate) };
  const segments = view.segments.map((s) => ({ id: s.id, kind: s.kind, start: s.timing.start, end: s.timing.end }));
  const report = computeCoverage(segments, ranges.map((r) => ({ start: r.startFrame, end: r.endFrame })), thresholds);
  const tc = (f: number) => formatTimecode(f, rate);
  const same = (g: Gap, c: ComputedGap) => g.source === "computed" && g.startFrame === c.start && g.endFrame === c.end;
  const computed: GapView[] = report.gaps.map((c) => {
    const keep = stored.find((g) => same(g, c));
    return {
      id: keep?.id ?? null,
      key: keep?.id ?? `computed:${c.start}-${c.end}`,
      source: "computed",
      reason: c.reason,
      status: keep?.status ?? "open",
      startFrame: c.start,
      endFrame: c.end,
      startTimecode: tc(c.start),
      endTimecode: tc(c.end),
      segmentId: c.segmentId,
      note: keep?.note ?? "",
      pickupShotId: keep ? (pickups.get(keep.id) ?? null) : null,
    };
  });
  const marked: GapView[] = stored
    .filter((g) => g.source === "marked")
    .map((g) => ({ id: g.id, key: g.id, source: "marked", reason: null, status: g.status, startFrame: g.startFrame, endFrame: g.endFrame, startTimecode: tc(g.startFrame), endTimecode: tc(g.endFrame), segmentId: g.segmentId, note: g.note, pickupShotId: pickups.get(g.id) ?? null }));
  const gaps = [...computed, ...marked].sort((a, b) => a.startFrame - b.startFrame);
  return {
    thresholds,
    gaps,
    openGaps: gaps.filter((g) => g.status === "open").length,
    voiceOverFrames: report.voiceOverFrames,
    coveredVoiceOverFrames: report.coveredVoiceOverFrames,
    coverage: report.coverage,
    stillComputed: (g: Gap) => report.gaps.some((c) => same(g, c)),
    ranges: ranges.map((r) => ({ id: r.id, clipId: r.clipId, clipInFrame: r.clipInFrame, startFrame: r.startFrame, endFrame: r.endFrame, startTimecode: tc(r.startFrame), endTimecode: tc(r.endFrame), note: r.note })),
  };
}

/** The episode's coverage as the API shows it, read fresh. */
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
