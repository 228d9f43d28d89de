/**
 * `npm run bench`: speed of the timing engine, as ratios against the
 * smpte-timecode reference package measured in the same run (never a
 * pass/fail timer). Prints one JSON line per measurement.
 */
// @ts-expect-error untyped package
import Timecode from "smpte-timecode";
import { formatTimecode, parseTimecode, rateOf } from "../../lib/timecode";
import { measureText, TextMeasures, timeScript, type TimingSegment } from "../../lib/script-timing";
import { buildChapters } from "../../lib/chapters";
import { bestOf } from "./timing";

const best = bestOf;

const rate = rateOf("29.97", true);
const N = 1_000_000;
const DAY = 2_589_407;
let sink = 0;

const oursFormat = best(() => {
  for (let i = 0; i < N; i++) sink += formatTimecode((i * 2654435761) % DAY, rate).length;
}, 3);
const refFormat = best(() => {
  for (let i = 0; i < N; i++) sink += Timecode((i * 2654435761) % DAY, [30000, 1001], true).toString().length;
}, 3);
console.log(JSON.stringify({ bench: "frames→timecode ×1,000,000 (29.97 DF)", oursMs: +oursFormat.toFixed(1), referenceMs: +refFormat.toFixed(1), ratio: +(oursFormat / refFormat).toFixed(3) }));

const labels = Array.from({ length: N }, (_, i) => formatTimecode((i * 2654435761) % DAY, rate));
const oursParse = best(() => {
  for (const l of labels) sink += (parseTimecode(l, rate) as { frames: number }).frames & 1;
}, 3);
const refParse = best(() => {
  for (const l of labels) sink += Timecode(l, [30000, 1001], true).frameCount & 1;
}, 3);
console.log(JSON.stringify({ bench: "timecode→frames ×1,000,000 (29.97 DF)", oursMs: +oursParse.toFixed(1), referenceMs: +refParse.toFixed(1), ratio: +(oursParse / refParse).toFixed(3) }));

const words = "Glue on both faces of each joint, then clamps alternating above and below {1s} so the panel stays flat 3/4 in thick.";
const segments: TimingSegment[] = Array.from({ length: 2000 }, (_, i) => ({
  id: String(i),
  kind: (["to_camera", "voice_over", "sponsor_read", "on_screen_text"] as const)[i % 4]!,
  text: words.repeat(1 + (i % 5)),
  pinnedStartFrame: i % 250 === 0 && i ? i * 300 : null,
}));
const oursRetime = best(() => {
  const t = timeScript(segments, rate);
  for (const s of t.segments) sink += formatTimecode(s.start, rate).length + formatTimecode(s.end, rate).length;
});
const refRetime = best(() => {
  const t = timeScript(segments, rate);
  for (const s of t.segments) sink += Timecode(s.start, [30000, 1001], true).toString().length + Timecode(s.end, [30000, 1001], true).toString().length;
});
console.log(JSON.stringify({ bench: "retime 2,000 segments with timecodes", oursMs: +oursRetime.toFixed(2), withReferenceFormattingMs: +refRetime.toFixed(2), ratio: +(oursRetime / refRetime).toFixed(3) }));

// Per keystroke in the script editor: one segment's text grows by a letter and
// the whole script is retimed (with chapters), as the editor does on every
// change. The texts seen before are looked up; the full retime measures every
// text afresh. Goal: under 4 ms per keystroke.
const withChapters = (segs: TimingSegment[], measures: Pick<TextMeasures, "of">) => {
  const t = timeScript(segs, rate, { wpm: 150, measures });
  const ch = buildChapters(segs.flatMap((s, i) => (i % 200 === 0 ? [{ segmentId: s.id, title: `Part ${i}`, startFrame: t.segments[i]!.start }] : [])), t.totalFrames, rate);
  sink += t.totalFrames + ch.chapters.length;
};
const fullRetime = best(() => withChapters(segments, { of: measureText }), 5);
const memo = new TextMeasures();
withChapters(segments, memo);
const KEYS = 200;
const typed = segments.slice();
const keystrokes = best(() => {
  for (let k = 0; k < KEYS; k++) {
    const i = 1000;
    typed[i] = { ...typed[i]!, text: `${segments[i]!.text} ${"w".repeat(1 + (k % 7))}${k}` };
    withChapters(typed, memo);
  }
}, 3) / KEYS;
console.log(JSON.stringify({ bench: "retime 2,000 segments per keystroke (one text changed)", perKeystrokeMs: +keystrokes.toFixed(3), fullRetimeMs: +fullRetime.toFixed(2), ratio: +(keystrokes / fullRetime).toFixed(3), goal: "under 4 ms per keystroke" }));
if (sink === 42) console.log("");

const { scheduleBench } = await import("./schedule");
scheduleBench();

// The footage upload benchmark starts its own services and app.
const { uploadBench } = await import("./upload");
await uploadBench();

// Channel export and import through the app server, with its own services.
const { archiveBench } = await import("./archive");
await archiveBench();

// 50 connections on the board, script and shot list of a generated channel, against a bare route.
const { loadBench } = await import("./load");
await loadBench();
