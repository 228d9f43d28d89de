import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { computeCoverage, intersect, packLanes, subtract, union, type Interval } from "@/lib/coverage";

/** Reference: mark every frame, then read the runs back (brute force). */
function frames(xs: Interval[], size: number): boolean[] {
  const f = new Array<boolean>(size).fill(false);
  for (const x of xs) for (let i = Math.max(0, x.start); i < Math.min(size, x.end); i++) f[i] = true;
  return f;
}
function runs(f: boolean[]): Interval[] {
  const out: Interval[] = [];
  for (let i = 0; i < f.length; i++) {
    if (f[i] && (i === 0 || !f[i - 1])) out.push({ start: i, end: i });
    if (f[i]) out[out.length - 1]!.end = i + 1;
  }
  return out;
}

const SIZE = 400;
const interval = fc.tuple(fc.integer({ min: 0, max: SIZE }), fc.integer({ min: 0, max: 60 })).map(([s, l]) => ({ start: s, end: Math.min(SIZE, s + l) }));
const intervals = fc.array(interval, { maxLength: 12 });

describe("interval arithmetic against a frame-by-frame reference (fast-check)", () => {
  it("union", () => {
    fc.assert(fc.property(intervals, (a) => void expect(union(a)).toEqual(runs(frames(a, SIZE)))), { numRuns: 500 });
  });
  it("subtract", () => {
    fc.assert(
      fc.property(intervals, intervals, (a, b) => {
        const fa = frames(a, SIZE);
        const fb = frames(b, SIZE);
        expect(subtract(a, b)).toEqual(runs(fa.map((x, i) => x && !fb[i]!)));
      }),
      { numRuns: 500 },
    );
  });
  it("intersect", () => {
    fc.assert(
      fc.property(intervals, intervals, (a, b) => {
        const fa = frames(a, SIZE);
        const fb = frames(b, SIZE);
        expect(intersect(a, b)).toEqual(runs(fa.map((x, i) => x && fb[i]!)));
      }),
      { numRuns: 500 },
    );
  });

  it("gaps and coverage", () => {
    const kind = fc.constantFrom("voice_over", "to_camera", "on_screen_text", "sponsor_read");
    // A script: consecutive segments of random kinds and lengths.
    const script = fc.array(fc.tuple(kind, fc.integer({ min: 1, max: 80 })), { minLength: 1, maxLength: 8 }).map((rows) => {
      let t = 0;
      return rows.map(([k, len], i) => ({ id: String(i), kind: k, start: t, end: (t += len) }));
    });
    fc.assert(
      fc.property(script, intervals, fc.integer({ min: 0, max: 20 }), fc.integer({ min: 0, max: 40 }), (segs, broll, voGap, camMax) => {
        const r = computeCoverage(segs, broll, { voiceOverGapFrames: voGap, toCameraMaxFrames: camMax });
        const size = Math.max(SIZE, segs[segs.length - 1]!.end);
        const b = frames(broll, size);
        const vo = frames(segs.filter((s) => s.kind === "voice_over" || s.kind === "sponsor_read"), size);
        const cam = frames(segs.filter((s) => s.kind === "to_camera"), size);
        const expectedVo = runs(vo.map((x, i) => x && !b[i]!)).filter((g) => g.end - g.start > voGap);
        const expectedCam = runs(cam.map((x, i) => x && !b[i]!)).filter((g) => g.end - g.start > camMax);
        expect(r.gaps.filter((g) => g.reason === "voice_over").map(({ start, end }) => ({ start, end }))).toEqual(expectedVo);
        expect(r.gaps.filter((g) => g.reason === "to_camera").map(({ start, end }) => ({ start, end }))).toEqual(expectedCam);
        expect(r.voiceOverFrames).toBe(vo.filter(Boolean).length);
        expect(r.coveredVoiceOverFrames).toBe(vo.filter((x, i) => x && b[i]).length);
      }),
      { numRuns: 500 },
    );
  });

  it("a worked case: 2 s threshold at 25 fps", () => {
    // Voice-over 0-10 s, B-roll 0-4 s and 5-10 s: the 1 s hole is under the threshold; 4-7 s would not be.
    const segs = [{ id: "a", kind: "voice_over", start: 0, end: 250 }];
    expect(computeCoverage(segs, [{ start: 0, end: 100 }, { start: 125, end: 250 }], { voiceOverGapFrames: 50, toCameraMaxFrames: 500 }).gaps).toEqual([]);
    const r = computeCoverage(segs, [{ start: 0, end: 100 }, { start: 175, end: 250 }], { voiceOverGapFrames: 50, toCameraMaxFrames: 500 });
    expect(r.gaps).toEqual([{ start: 100, end: 175, reason: "voice_over", segmentId: "a" }]);
    expect(r.coverage).toBeCloseTo(175 / 250, 9);
  });
});

describe("gap lanes", () => {
  it("never overlap within a lane and use as many lanes as the deepest overlap (fast-check, brute force)", () => {
    fc.assert(
      fc.property(fc.array(fc.tuple(fc.nat(200), fc.integer({ min: 1, max: 60 })), { maxLength: 30 }), (raw) => {
        const ivs = raw.map(([s, len]) => ({ start: s, end: s + len }));
        const lanes = packLanes(ivs);
        for (let i = 0; i < ivs.length; i++)
          for (let j = i + 1; j < ivs.length; j++)
            if (lanes[i] === lanes[j]) expect(ivs[i]!.end <= ivs[j]!.start || ivs[j]!.end <= ivs[i]!.start).toBe(true);
        // The deepest overlap, found by checking every frame: no packing can use fewer lanes.
        let deepest = 0;
        for (let f = 0; f <= 260; f++) deepest = Math.max(deepest, ivs.filter((iv) => iv.start <= f && f < iv.end).length);
        expect(ivs.length ? Math.max(...lanes) + 1 : 0).toBe(deepest);
      }),
      { numRuns: 300 },
    );
  });
});
