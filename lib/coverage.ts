/**
 * B-roll coverage in integer frames on the script timeline. Intervals are
 * half-open [start, end). Voice-over stretches not covered by any B-roll for
 * longer than the channel's threshold are gaps; so are to-camera stretches
 * that run longer than the channel's limit without a cutaway.
 */
export interface Interval {
  start: number;
  end: number;
}

/** Sorted, merged, non-empty intervals; touching intervals join. */
export function union(intervals: Interval[]): Interval[] {
  const sorted = intervals.filter((i) => i.end > i.start).sort((a, b) => a.start - b.start || a.end - b.end);
  const out: Interval[] = [];
  for (const i of sorted) {
    const last = out[out.length - 1];
    if (last && i.start <= last.end) last.end = Math.max(last.end, i.end);
    else out.push({ start: i.start, end: i.end });
  }
  return out;
}

/** Parts of `from` not covered by `remove`. */
export function subtract(from: Interval[], remove: Interval[]): Interval[] {
  const cut = union(remove);
  const out: Interval[] = [];
  for (const f of union(from)) {
    let cursor = f.start;
    for (const c of cut) {
      if (c.end <= cursor) continue;
      if (c.start >= f.end) break;
      if (c.start > cursor) out.push({ start: cursor, end: c.start });
      cursor = Math.max(cursor, c.end);
      if (cursor >= f.end) break;
    }
    if (cursor < f.end) out.push({ start: cursor, end: f.end });
  }
  return out;
}

export function intersect(a: Interval[], b: Interval[]): Interval[] {
  const out: Interval[] = [];
  const ua = union(a);
  const ub = union(b);
  let i = 0;
  let j = 0;
  while (i < ua.length && j < ub.length) {
    const s = Math.max(ua[i]!.start, ub[j]!.start);
    const e = Math.min(ua[i]!.end, ub[j]!.end);
    if (e > s) out.push({ start: s, end: e });
    if (ua[i]!.end < ub[j]!.end) i++;
    else j++;
  }
  return out;
}

export const length = (xs: Interval[]) => union(xs).reduce((a, i) => a + i.end - i.start, 0);

export interface CoverageSegment extends Interval {
  id: string;
  kind: string;
}

export interface ComputedGap extends Interval {
  /** voice_over: no B-roll over narration; to_camera: too long without a cutaway. */
  reason: "voice_over" | "to_camera";
  /** The segment where the gap begins. */
  segmentId: string | null;
}

export interface CoverageReport {
  gaps: ComputedGap[];
  voiceOverFrames: number;
  coveredVoiceOverFrames: number;
  /** Share of voice-over time with B-roll over it, 0..1 (1 when there is no voice-over). */
  coverage: number;
}

/** Narration-like kinds: B-roll is expected over them. */
const NARRATION = new Set(["voice_over", "sponsor_read"]);

export function computeCoverage(segments: CoverageSegment[], broll: Interval[], opts: { voiceOverGapFrames: number; toCameraMaxFrames: number }): CoverageReport {
  const vo = union(segments.filter((s) => NARRATION.has(s.kind)));
  const cam = union(segments.filter((s) => s.kind === "to_camera"));
  const covered = union(broll);
  const segmentAt = (frame: number) => segments.find((s) => frame >= s.start && frame < s.end)?.id ?? null;
  const gaps: ComputedGap[] = [
    ...subtract(vo, covered)
      .filter((g) => g.end - g.start > opts.voiceOverGapFrames)
      .map((g) => ({ ...g, reason: "voice_over" as const, segmentId: segmentAt(g.start) })),
    ...subtract(cam, covered)
      .filter((g) => g.end - g.start > opts.toCameraMaxFrames)
      .map((g) => ({ ...g, reason: "to_camera" as const, segmentId: segmentAt(g.start) })),
  ].sort((a, b) => a.start - b.start);
  const voiceOverFrames = length(vo);
  const coveredVoiceOverFrames = length(intersect(vo, covered));
  return { gaps, voiceOverFrames, coveredVoiceOverFrames, coverage: voiceOverFrames ? coveredVoiceOverFrames / voiceOverFrames : 1 };
}

/** A gap as the coverage API reports it: computed or marked, with its status and timecodes. */
export interface GapView {
  id: string | null;
  key: string;
  source: "computed" | "marked";
  reason: string | null;
  status: "open" | "resolved" | "dismissed";
  startFrame: number;
  endFrame: number;
  startTimecode: string;
  endTimecode: string;
  segmentId: string | null;
  note: string;
  /** The pickup shot made for this gap, if any: the gap stays open until B-roll covers it, but needs no second pickup. */
  pickupShotId: string | null;
}

/**
 * Lays intervals in lanes so that none overlap within a lane: each goes in
 * the first lane whose last interval has ended (interval-graph colouring in
 * start order, which uses the fewest lanes possible).
 */
export function packLanes(intervals: { start: number; end: number }[]): number[] {
  const order = intervals.map((iv, i) => ({ ...iv, i })).sort((a, b) => a.start - b.start || a.end - b.end);
  const laneEnds: number[] = [];
  const lanes = new Array<number>(intervals.length);
  for (const iv of order) {
    let lane = laneEnds.findIndex((e) => e <= iv.start);
    if (lane === -1) lane = laneEnds.push(iv.end) - 1;
    else laneEnds[lane] = iv.end;
    lanes[iv.i] = lane;
  }
  return lanes;
}
