import "server-only";
import { timeScript, DEFAULT_WPM } from "../../script-timing";
import { buildChapters } from "../../chapters";
import { convertFrames, formatTimecode, framesToSeconds, rateOf } from "../../timecode";
import { allowsDropFrame, type FrameRateId } from "../../frame-rate";
import type { ScriptDto, SegmentDto } from "../../schemas/script";
import type { Episode } from "../../../db/schema";
import { listSegmentsByEpisode, segmentSnapshot, type Segment } from "../../../db/queries/script";
import { getUserById } from "../../../db/queries/users";

export async function presenterWpm(episode: Episode): Promise<number> {
  if (!episode.presenterId) return DEFAULT_WPM;
  return (await getUserById({ id: episode.presenterId }))?.readingRateWpm ?? DEFAULT_WPM;
}

/** A segment as the API shows it (the shape of segmentSchema). */
export function toSegmentDto(s: Segment): SegmentDto {
  return { ...segmentSnapshot(s), updatedAt: s.updatedAt.toISOString() };
}

/** Segments with their computed timing, totals and chapters at a rate (the episode's unless asked). */
export function scriptView(episode: Episode, segments: Segment[], wpm: number, override?: { rate?: FrameRateId; dropFrame?: boolean }): ScriptDto {
  const rateId = override?.rate ?? episode.frameRate;
  const dropFrame = override?.rate ? Boolean(override.dropFrame) : override?.dropFrame ?? episode.dropFrame;
  const rate = rateOf(rateId, dropFrame && allowsDropFrame(rateId));
  // Pins and fixed lengths are stored in frames at the episode's rate; viewed at another rate they keep their time.
  const stored = rateOf(episode.frameRate, episode.dropFrame);
  const at = (f: number | null) => (f == null ? null : convertFrames(f, stored, rate));
  const timing = timeScript(
    segments.map((s) => ({ id: s.id, kind: s.kind, text: s.text, stepId: s.stepId, pinnedStartFrame: at(s.pinnedStartFrame), explicitDurationFrames: at(s.explicitDurationFrames) })),
    rate,
    { wpm, targetSeconds: episode.targetRuntimeSeconds },
  );
  const chapters = buildChapters(
    segments.flatMap((s, i) => (s.chapterStart ? [{ segmentId: s.id, title: s.chapterTitle ?? "", startFrame: timing.segments[i]!.start }] : [])),
    timing.totalFrames,
    rate,
  );
  const tc = (f: number) => formatTimecode(f, rate);
  return {
    rate: { id: rateId, dropFrame: rate.dropFrame, num: rate.num, den: rate.den },
    wordsPerMinute: wpm,
    segments: segments.map((s, i) => {
      const { id: _id, kind: _kind, stepId: _step, ...t } = timing.segments[i]!;
      return { ...toSegmentDto(s), timing: { ...t, startTimecode: tc(t.start), endTimecode: tc(t.end), durationSeconds: framesToSeconds(t.duration, rate) } };
    }),
    totals: {
      frames: timing.totalFrames,
      timecode: tc(timing.totalFrames),
      seconds: framesToSeconds(timing.totalFrames, rate),
      targetFrames: timing.targetFrames,
      overFrames: timing.overFrames,
      overSeconds: timing.overFrames != null ? framesToSeconds(timing.overFrames, rate) : null,
      byKind: timing.byKind,
      byStep: timing.byStep,
    },
    chapters,
  };
}

export async function scriptViewFor(episode: Episode, override?: { rate?: FrameRateId; dropFrame?: boolean }) {
  const [segments, wpm] = await Promise.all([listSegmentsByEpisode({ episodeId: episode.id }), presenterWpm(episode)]);
  return scriptView(episode, segments, wpm, override);
}
