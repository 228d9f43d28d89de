/**
 * Script timing: every segment's start, end and duration in integer frames at
 * the episode's rate. Spoken segments take their words at the presenter's
 * reading rate (default 150 wpm, common practice) plus pause markers; on-screen
 * text takes its characters at caption reading speed (17 characters a
 * second); an explicit duration overrides both. A pinned start fixes where a
 * segment begins, and the engine reports the drift between the running
 * estimate and the pin instead of hiding it.
 */
import { LRUCache } from "lru-cache";
import { msToFrames, type Rate } from "./timecode";
import { pausesMs, readableChars, spokenWordCount } from "./spoken-words";

export const SEGMENT_KINDS = ["to_camera", "voice_over", "sponsor_read", "on_screen_text"] as const;
export type SegmentKind = (typeof SEGMENT_KINDS)[number];
export const SEGMENT_KIND_LABELS: Record<SegmentKind, string> = {
  to_camera: "To camera",
  voice_over: "Voice-over",
  sponsor_read: "Sponsor read",
  on_screen_text: "On-screen text",
};

export const DEFAULT_WPM = 150;
export const MIN_WPM = 100;
export const MAX_WPM = 220;
/** Caption reading speed for adults, 17 characters a second (lower end of broadcaster guidance). */
export const CAPTION_CPS = 17;
/** Shortest time a line of on-screen text stays up (common practice, no published source). */
export const MIN_ON_SCREEN_MS = 1500;

export interface TimingSegment {
  id: string;
  kind: SegmentKind;
  text: string;
  stepId?: string | null;
  pinnedStartFrame?: number | null;
  explicitDurationFrames?: number | null;
}

export interface TimedSegment {
  id: string;
  kind: SegmentKind;
  stepId: string | null;
  words: number;
  start: number;
  end: number;
  duration: number;
  /** Where the running estimate would have started it (before any pin). */
  estimatedStart: number;
  /** estimatedStart − pinned start: positive means the script before it runs long. */
  drift: number | null;
  source: "explicit" | "reading" | "caption";
}

export interface ScriptTiming {
  segments: TimedSegment[];
  totalFrames: number;
  byKind: Record<SegmentKind, number>;
  byStep: Record<string, number>;
  targetFrames: number | null;
  /** totalFrames − targetFrames: positive is over. */
  overFrames: number | null;
}

/** What timing needs of a text whatever the rate: spoken words, pause time and on-screen characters. */
export interface TextMeasure {
  words: number;
  pausesMs: number;
  chars: number;
}

export function measureText(text: string): TextMeasure {
  return { words: spokenWordCount(text), pausesMs: pausesMs(text), chars: readableChars(text) };
}

/**
 * Measures of texts already seen, so a retime after one keystroke counts the
 * words of the one segment that changed and looks the others up. Bounded by
 * total text length (about 8 million characters), least recently used first
 * out; a cache of a pure function, so dropping it changes nothing but speed.
 */
export class TextMeasures {
  private cache = new LRUCache<string, TextMeasure>({ maxSize: 8_000_000, sizeCalculation: (_v, k) => Math.max(1, k.length) });
  constructor(private readonly measure: (text: string) => TextMeasure = measureText) {}
  of(text: string): TextMeasure {
    let m = this.cache.get(text);
    if (!m) this.cache.set(text, (m = this.measure(text)));
    return m;
  }
}

/** The measures timeScript uses unless given its own. */
export const sharedTextMeasures = new TextMeasures();

export function segmentDurationFrames(s: TimingSegment, rate: Rate, wpm = DEFAULT_WPM, measures: Pick<TextMeasures, "of"> = sharedTextMeasures): { frames: number; words: number; source: TimedSegment["source"] } {
  const m = measures.of(s.text);
  const words = s.kind === "on_screen_text" ? 0 : m.words;
  if (s.explicitDurationFrames != null) return { frames: s.explicitDurationFrames, words, source: "explicit" };
  if (s.kind === "on_screen_text") {
    const ms = m.chars ? Math.max(MIN_ON_SCREEN_MS, (m.chars * 1000) / CAPTION_CPS) : 0;
    return { frames: msToFrames(ms + m.pausesMs, rate), words, source: "caption" };
  }
  // words / wpm minutes, in whole milliseconds, then to frames; integers all the way.
  const readingMs = Math.round((words * 60_000) / wpm);
  return { frames: msToFrames(readingMs + m.pausesMs, rate), words, source: "reading" };
}

export function timeScript(segments: TimingSegment[], rate: Rate, opts: { wpm?: number; targetSeconds?: number | null; measures?: Pick<TextMeasures, "of"> } = {}): ScriptTiming {
  const wpm = opts.wpm ?? DEFAULT_WPM;
  const measures = opts.measures ?? sharedTextMeasures;
  const out: TimedSegment[] = [];
  const byKind = { to_camera: 0, voice_over: 0, sponsor_read: 0, on_screen_text: 0 } as Record<SegmentKind, number>;
  const byStep: Record<string, number> = {};
  let cursor = 0;
  for (const s of segments) {
    const { frames, words, source } = segmentDurationFrames(s, rate, wpm, measures);
    const estimatedStart = cursor;
    const start = s.pinnedStartFrame ?? cursor;
    const drift = s.pinnedStartFrame != null ? estimatedStart - s.pinnedStartFrame : null;
    const end = start + frames;
    out.push({ id: s.id, kind: s.kind, stepId: s.stepId ?? null, words, start, end, duration: frames, estimatedStart, drift, source });
    byKind[s.kind] += frames;
    if (s.stepId) byStep[s.stepId] = (byStep[s.stepId] ?? 0) + frames;
    cursor = end;
  }
  let totalFrames = 0;
  for (const s of out) if (s.end > totalFrames) totalFrames = s.end;
  const targetFrames = opts.targetSeconds != null ? msToFrames(opts.targetSeconds * 1000, rate) : null;
  return { segments: out, totalFrames, byKind, byStep, targetFrames, overFrames: targetFrames != null ? totalFrames - targetFrames : null };
}

/** Two segments' texts as one: joined by one space, outer whitespace of the seam dropped. */
export function joinSegmentTexts(first: string, second: string): string {
  return [first.trimEnd(), second.trimStart()].filter(Boolean).join(" ");
}
