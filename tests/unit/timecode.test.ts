import { describe, expect, it } from "vitest";
import fc from "fast-check";
// Reference implementation, used only here (devDependency).
// @ts-expect-error untyped package
import Timecode from "smpte-timecode";
import { convertFrames, formatTimecode, framesToSeconds, msToFrames, parseTimecode, rateOf, rulerTicks, type Rate } from "@/lib/timecode";
import { FRAME_RATE_IDS, FRAME_RATES, type FrameRateId } from "@/lib/frame-rate";

const DF30 = rateOf("29.97", true);
const DF60 = rateOf("59.94", true);

describe("drop-frame worked examples (SMPTE ST 12-1 rule; values as tabulated for 30000/1001 DF)", () => {
  it.each([
    ["00:01:00;02", 1800],
    ["00:01:59;29", 3597],
    ["00:10:00;00", 17982],
    ["01:00:00;00", 107892],
    ["10:00:00;00", 1078920],
    ["23:59:59;29", 2589407],
  ])("%s is frame %i", (tc, frames) => {
    expect(parseTimecode(tc, DF30)).toEqual({ ok: true, frames });
    expect(formatTimecode(frames, DF30)).toBe(tc);
  });

  // 108 labels are dropped per hour: 30 × 3600 − 108 = 107892 (SMPTE ST 12-1).
  it("drops 108 labels an hour", () => {
    expect(30 * 3600 - (parseTimecode("01:00:00;00", DF30) as { frames: number }).frames).toBe(108);
  });

  it("00:01:00;00 does not exist and says why", () => {
    const r = parseTimecode("00:01:00;00", DF30);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message).toMatch(/does not exist in drop-frame/);
    expect(parseTimecode("00:01:00;01", DF30).ok).toBe(false);
    expect(parseTimecode("00:10:00;00", DF30).ok).toBe(true);
  });

  // 59.94 DF drops four labels a minute (common software practice): 00:10:00;00 = 35964.
  it("59.94 drop-frame", () => {
    expect(parseTimecode("00:10:00;00", DF60)).toEqual({ ok: true, frames: 35964 });
    expect(parseTimecode("00:01:00;03", DF60).ok).toBe(false);
    expect(formatTimecode(3600, DF60)).toBe("00:01:00;04");
  });

  // No drop-frame at 23.976, 24, 25, 30, 50 or 60 (SMPTE ST 12-1).
  it.each(["23.976", "24", "25", "30", "50", "60"] as FrameRateId[])("no drop-frame at %s", (id) => {
    expect(() => rateOf(id, true)).toThrow(/does not exist/);
  });
});

describe("parsing", () => {
  const r25 = rateOf("25");
  it("reads short forms as frame 00", () => {
    expect(parseTimecode("4:05", r25)).toEqual({ ok: true, frames: (4 * 60 + 5) * 25 });
    expect(parseTimecode("1:02:03", r25)).toEqual({ ok: true, frames: (3723) * 25 });
  });
  it.each(["", "1:2:3:4", "00:61:00:00", "00:00:00:25", "24:00:00:00", "00:00:00;10", "abc"])("refuses %j with a message", (s) => {
    const r = parseTimecode(s, r25);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message.length).toBeGreaterThan(8);
  });
});

/** The reference's constructor takes [num, den] and the drop-frame flag. */
function reference(frames: number, id: FrameRateId, df: boolean) {
  const r = FRAME_RATES[id];
  return Timecode(frames, [r.num, r.den], df);
}

const CASES: [FrameRateId, boolean][] = [
  ...FRAME_RATE_IDS.map((id) => [id, false] as [FrameRateId, boolean]),
  ["29.97", true],
  ["59.94", true],
];

describe("randomized comparison with the smpte-timecode package (10,000 frame counts per rate, both directions)", () => {
  it.each(CASES)("%s fps, drop-frame %s", (id, df) => {
    const rate = rateOf(id, df);
    // Frame counts below 24 hours: the reference wraps at midnight.
    const fps = Math.round(FRAME_RATES[id].num / FRAME_RATES[id].den);
    const dayFrames = (parseTimecode("23:59:59" + (df ? ";" : ":") + String(fps - 1).padStart(2, "0"), rate) as { frames: number }).frames;
    let seed = 12345;
    const next = () => (seed = (seed * 1103515245 + 12345) % 2147483648) / 2147483648;
    for (let i = 0; i < 10_000; i++) {
      const frames = i < 100 ? i * 1797 : Math.floor(next() * (dayFrames + 1));
      const ours = formatTimecode(frames, rate);
      const theirs = reference(frames, id, df).toString();
      expect(ours.replace(/[:;.](\d\d)$/, ":$1")).toBe(theirs.replace(/[:;.](\d\d)$/, ":$1"));
      const back = Timecode(theirs, [FRAME_RATES[id].num, FRAME_RATES[id].den], df).frameCount;
      expect((parseTimecode(ours, rate) as { frames: number }).frames).toBe(back);
    }
  });
});

describe("properties (fast-check)", () => {
  const rateArb = fc.constantFrom(...CASES).map(([id, df]) => rateOf(id, df));
  // Below 24 hours at the lowest label rate (24 × 86400 frames): labels stop at 23:59:59.
  const framesArb = fc.integer({ min: 0, max: 24 * 86400 - 2 });

  it("parse(format(n)) == n", () => {
    fc.assert(fc.property(rateArb, framesArb, (rate: Rate, n) => {
      expect(parseTimecode(formatTimecode(n, rate), rate)).toEqual({ ok: true, frames: n });
    }), { numRuns: 2000 });
  });

  it("labels increase with frame count", () => {
    fc.assert(
      fc.property(rateArb, framesArb, (rate: Rate, n) => {
        expect(formatTimecode(n + 1, rate) > formatTimecode(n, rate)).toBe(true);
      }),
      { numRuns: 2000 },
    );
  });

  it("durations add: frames(a + b) = frames(a) + frames(b) for frame counts, and seconds scale exactly", () => {
    fc.assert(
      fc.property(rateArb, fc.integer({ min: 0, max: 1_000_000 }), fc.integer({ min: 0, max: 1_000_000 }), (rate: Rate, a, b) => {
        expect(framesToSeconds(a + b, rate)).toBeCloseTo(framesToSeconds(a, rate) + framesToSeconds(b, rate), 6);
      }),
    );
  });

  it("ten hours of 29.97 is 1078920 frames without drift", () => {
    // 10 h × 3600 s × 30000/1001 = 1078921.08 real frames; drop-frame labels read 10:00:00;00 at 1078920.
    expect(msToFrames(10 * 3600 * 1000, DF30)).toBe(1078921);
    expect(formatTimecode(1078920, DF30)).toBe("10:00:00;00");
  });
});

describe("ruler ticks", () => {
  it("read whole labels at drop-frame, on the minute's first existing label", () => {
    const df = rateOf("29.97", true);
    // 2 min 10 s of 29.97 DF; ticks every 15 s.
    const ticks = rulerTicks(3900, df);
    expect(ticks.map((t) => t.label)).toEqual(["00:00", "00:15", "00:30", "00:45", "01:00", "01:15", "01:30", "01:45", "02:00"]);
    // 00:01:00;02 is frame 1800 (SMPTE ST 12-1 worked example; 00:01:00;00 does not exist).
    expect(ticks.find((t) => t.label === "01:00")!.frame).toBe(1800);
    // Cross-check every tick with the smpte-timecode reference package: the frame's label starts with the tick's text.
    for (const t of ticks) expect(new Timecode(t.frame, 29.97, true).toString().slice(3, 8)).toBe(t.label);
  });

  it("at 25 fps sit on exact seconds", () => {
    const r = rateOf("25");
    expect(rulerTicks(25 * 60, r).map((t) => t.frame)).toEqual([0, 125, 250, 375, 500, 625, 750, 875, 1000, 1125, 1250, 1375, 1500]);
  });
});

describe("frames at another rate keep their time", () => {
  it("matches the drop-frame table: real 10 min and 1 h of 25 fps land on the DF labels of the same clock time", () => {
    // 00:10:00;00 = 17982 and 01:00:00;00 = 107892 at 30000/1001 DF (SMPTE ST 12-1 worked examples), checked with the smpte-timecode package.
    const df = rateOf("29.97", true);
    expect(convertFrames(15000, rateOf("25"), df)).toBe(new Timecode("00:10:00;00", 29.97, true).frameCount);
    expect(convertFrames(90000, rateOf("25"), df)).toBe(new Timecode("01:00:00;00", 29.97, true).frameCount);
  });

  it("is within half a frame of the exact instant, and round-trips through a faster rate (fast-check)", () => {
    const ids = ["23.976", "24", "25", "29.97", "30", "50", "59.94", "60"] as const;
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 5_000_000 }), fc.constantFrom(...ids), fc.constantFrom(...ids), (f, a, b) => {
        const from = rateOf(a);
        const to = rateOf(b);
        const g = convertFrames(f, from, to);
        const exact = (f * from.den * to.num) / (from.num * to.den);
        expect(Math.abs(g - exact)).toBeLessThanOrEqual(0.5 + 1e-9);
        if (to.num / to.den >= from.num / from.den) expect(convertFrames(g, to, from)).toBe(f);
      }),
      { numRuns: 2000 },
    );
  });
});
