import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { cardinalWords, pausesMs, spokenWordCount, tokenWords } from "@/lib/spoken-words";
import { measureText, segmentDurationFrames, TextMeasures, timeScript, type TimingSegment } from "@/lib/script-timing";
import { rateOf } from "@/lib/timecode";
import { buildChapters } from "@/lib/chapters";

const r30 = rateOf("30");
const r2997 = rateOf("29.97", true);
const r25 = rateOf("25");
const words = (n: number) => Array.from({ length: n }, () => "wood").join(" ");

describe("reading rate (common practice: about 150 words a minute for narration)", () => {
  it("150 words at 150 wpm is one minute", () => {
    expect(segmentDurationFrames({ id: "a", kind: "voice_over", text: words(150) }, r30).frames).toBe(1800);
    expect(segmentDurationFrames({ id: "a", kind: "voice_over", text: words(150) }, r25).frames).toBe(1500);
    // 60 s × 30000/1001 = 1798.2 → 1798 frames.
    expect(segmentDurationFrames({ id: "a", kind: "voice_over", text: words(150) }, r2997).frames).toBe(1798);
  });

  it("a faster presenter: 180 wpm (about 3 words a second) takes 50 s for 150 words", () => {
    expect(segmentDurationFrames({ id: "a", kind: "to_camera", text: words(150) }, r25, 180).frames).toBe(1250);
  });

  it("pause markers add their time", () => {
    expect(pausesMs("cut here {2s} and {500ms} here {1.5s}")).toBe(4000);
    expect(segmentDurationFrames({ id: "a", kind: "voice_over", text: `${words(150)} {2s}` }, r25).frames).toBe(1550);
  });

  it("an explicit duration wins", () => {
    expect(segmentDurationFrames({ id: "a", kind: "voice_over", text: words(500), explicitDurationFrames: 240 }, r25)).toMatchObject({ frames: 240, source: "explicit" });
  });

  // Caption reading speed for adults is about 17 characters a second (Netflix Timed Text Style Guide; BBC R&D 2015).
  it("on-screen text at 17 characters a second", () => {
    const text = "x".repeat(170);
    expect(segmentDurationFrames({ id: "a", kind: "on_screen_text", text }, r25).frames).toBe(250);
    // Short titles stay up at least 1.5 s (common practice, no published source).
    expect(segmentDurationFrames({ id: "a", kind: "on_screen_text", text: "Glue-up" }, r25).frames).toBe(38);
  });
});

describe("spoken word counts (hand-counted)", () => {
  it.each([
    ["1/2", 2], // one half
    ["3/4", 2], // three quarters
    ["1-1/2", 4], // one and a half
    ["3mm", 2], // three millimetres
    ["2x4", 3], // two by four
    ["15%", 2], // fifteen percent
    ["2.5", 3], // two point five
    ["150", 3], // one hundred fifty
    ["1,200", 4], // one thousand two hundred
    ["&", 1],
    ["—", 0],
    ["plane,", 1],
  ])("%s is %i words", (t, n) => {
    expect(tokenWords(t)).toBe(n);
  });

  it("counts a sentence", () => {
    // Rip | a | 2x4 (3) | to | 1-1/2 (4) | inches | then | wait | {2s} (0) = 13
    expect(spokenWordCount("Rip a 2x4 to 1-1/2 inches, then wait {2s}.")).toBe(13);
  });

  it("cardinals", () => {
    expect(cardinalWords(7)).toBe(1);
    expect(cardinalWords(99)).toBe(1);
    expect(cardinalWords(300)).toBe(2);
    expect(cardinalWords(312)).toBe(3);
    expect(cardinalWords(2026)).toBe(3); // two thousand twenty-six
    expect(cardinalWords(1_000_000)).toBe(2);
  });
});

describe("running timeline", () => {
  const segs: TimingSegment[] = [
    { id: "a", kind: "to_camera", text: words(150), stepId: "s1" },
    { id: "b", kind: "voice_over", text: words(75), stepId: "s1" },
    { id: "c", kind: "voice_over", text: words(75), pinnedStartFrame: 2 * 1800, stepId: "s2" },
    { id: "d", kind: "on_screen_text", text: "x".repeat(34) },
  ];

  it("starts each segment where the last ended, unless pinned, and reports drift", () => {
    const t = timeScript(segs, r30, { targetSeconds: 120 });
    expect(t.segments.map((s) => [s.start, s.end])).toEqual([
      [0, 1800],
      [1800, 2700],
      [3600, 4500],
      [4500, 4560],
    ]);
    // The estimate reaches c at 2700 but the pin says 3600: 900 frames (30 s) short of the pin.
    expect(t.segments[2]!.drift).toBe(-900);
    expect(t.totalFrames).toBe(4560);
    expect(t.overFrames).toBe(4560 - 3600);
    expect(t.byKind).toEqual({ to_camera: 1800, voice_over: 1800, sponsor_read: 0, on_screen_text: 60 });
    expect(t.byStep).toEqual({ s1: 2700, s2: 900 });
  });

  it("durations add up (fast-check): total = sum of durations when nothing is pinned", () => {
    fc.assert(
      fc.property(fc.array(fc.record({ n: fc.nat(400), kind: fc.constantFrom("to_camera", "voice_over", "sponsor_read", "on_screen_text") as fc.Arbitrary<TimingSegment["kind"]> }), { maxLength: 30 }), (rows) => {
        const t = timeScript(rows.map((r, i) => ({ id: String(i), kind: r.kind, text: words(r.n) })), r2997);
        expect(t.totalFrames).toBe(t.segments.reduce((a, s) => a + s.duration, 0));
        t.segments.forEach((s, i) => i && expect(s.start).toBe(t.segments[i - 1]!.end));
      }),
    );
  });
});

describe("chapters (platform rule: first at 0:00, at least three, ascending, each at least 10 s)", () => {
  const rate = rateOf("25");
  const ch = (title: string, sec: number) => ({ segmentId: title, title, startFrame: sec * 25 });

  it("a valid list", () => {
    const r = buildChapters([ch("Intro", 0), ch("Milling", 45), ch("Glue-up", 130)], 600 * 25, rate);
    expect(r.valid).toBe(true);
    expect(r.text).toBe("0:00 Intro\n0:45 Milling\n2:10 Glue-up");
  });

  it("must start at 0:00", () => {
    const r = buildChapters([ch("Intro", 5), ch("Milling", 45), ch("Glue-up", 130)], 600 * 25, rate);
    expect(r.valid).toBe(false);
    expect(r.chapters[0]!.problems[0]).toMatch(/must start at 0:00/);
  });

  it("needs three", () => {
    const r = buildChapters([ch("Intro", 0), ch("Milling", 45)], 600 * 25, rate);
    expect(r.problems[0]).toMatch(/at least 3/);
  });

  it("each at least 10 seconds, the last one to the end of the video", () => {
    const r = buildChapters([ch("Intro", 0), ch("Milling", 9), ch("Glue-up", 130)], 135 * 25, rate);
    expect(r.chapters[0]!.problems[0]).toMatch(/lasts 9 s/);
    expect(r.chapters[2]!.problems[0]).toMatch(/lasts 5 s/);
  });

  it("must ascend", () => {
    const r = buildChapters([ch("Intro", 0), ch("Milling", 60), ch("Glue-up", 60)], 600 * 25, rate);
    expect(r.chapters[2]!.problems[0]).toMatch(/not after/);
  });

  it("uses hours past the hour", () => {
    const r = buildChapters([ch("Intro", 0), ch("Milling", 60), ch("Long glue-up", 3725)], 4000 * 25, rate);
    expect(r.text.split("\n")[2]).toBe("1:02:05 Long glue-up");
  });
});

describe("retiming with remembered text measures", () => {
  const kinds = ["to_camera", "voice_over", "sponsor_read", "on_screen_text"] as const;
  const segment = fc.record({
    text: fc.stringMatching(/^[a-z0-9 /{}.sm%x-]{0,60}$/),
    kind: fc.constantFrom(...kinds),
    pinned: fc.option(fc.nat(20_000), { nil: null }),
  });

  // The memo is a cache of a pure function: with it or without it, every figure is the same.
  it("gives exactly the timing of measuring every text afresh, through any sequence of edits", () => {
    fc.assert(
      fc.property(fc.array(segment, { minLength: 1, maxLength: 25 }), fc.array(fc.tuple(fc.nat(), fc.stringMatching(/^[a-z0-9 {}.s]{0,12}$/)), { maxLength: 15 }), (rows, edits) => {
        const memo = new TextMeasures();
        let segs: TimingSegment[] = rows.map((r, i) => ({ id: String(i), kind: r.kind, text: r.text, pinnedStartFrame: r.pinned }));
        for (const [at, typed] of edits) {
          const i = at % segs.length;
          segs = segs.map((s, j) => (j === i ? { ...s, text: s.text + typed } : s));
          expect(timeScript(segs, r2997, { wpm: 163, measures: memo })).toEqual(timeScript(segs, r2997, { wpm: 163, measures: { of: measureText } }));
        }
      }),
    );
  });

  it("measures only the text that changed", () => {
    const measured: string[] = [];
    const counting = new TextMeasures((t) => (measured.push(t), measureText(t)));
    const segs: TimingSegment[] = Array.from({ length: 50 }, (_, i) => ({ id: String(i), kind: "voice_over", text: `step ${i} glue and clamp` }));
    timeScript(segs, r25, { measures: counting });
    expect(measured).toHaveLength(50);
    timeScript(segs.map((s, i) => (i === 7 ? { ...s, text: `${s.text} overnight` } : s)), r25, { measures: counting });
    expect(measured.slice(50)).toEqual(["step 7 glue and clamp overnight"]);
  });
});
