/**
 * Scheduler speed: 30, 100 and 300 steps over 40 shoot days (the greedy
 * order), against the exhaustive reference search on small instances (up to
 * 7 steps and 4 days) timed in the same run. Ratios only, never a pass/fail timer.
 */
import { schedule, zonedInstant, type ScheduleDay, type ScheduleInput, type ScheduleStep } from "../../lib/shoot-schedule";
import { exhaustive } from "../support/exhaustive-schedule";
import { bestOf } from "./timing";

function rng(seed: number) {
  let s = seed >>> 0;
  return () => ((s = (s * 1664525 + 1013904223) >>> 0) / 2 ** 32);
}

function instance(steps: number, days: number, seed: number, hours = 8): ScheduleInput {
  const r = rng(seed);
  const big = steps > 10;
  const tz = "Europe/Dublin";
  const dayList: ScheduleDay[] = Array.from({ length: days }, (_, i) => {
    const date = new Date(Date.UTC(2027, 0, 2 + i * 2)).toISOString().slice(0, 10);
    return { id: `d${i}`, date, start: zonedInstant(date, 9 * 60, tz), end: zonedInstant(date, (9 + hours) * 60, tz), crew: ["a", "b"], helpers: 0 };
  });
  const stepList: ScheduleStep[] = Array.from({ length: steps }, (_, i) => ({
    id: `s${i}`,
    title: `s${i}`,
    position: i,
    activeMinutes: big ? 30 * (1 + Math.floor(r() * 3)) : 60 * (1 + Math.floor(r() * 3)),
    waitMinutes: r() < 0.25 ? 60 * [2, 12, 20][Math.floor(r() * 3)]! : 0,
    waitReason: "",
    dependsOn: Array.from({ length: Math.min(i, 3) }, (_, k) => i - 1 - k).filter(() => r() < 0.4).map((j) => `s${j}`),
    crewNeeded: r() < 0.2 ? 2 : 1,
    mustFilm: r() < 0.8,
    pinnedDayId: null,
  }));
  return { steps: stepList, days: dayList, members: ["a", "b"], away: [], timeZone: tz, offCameraHours: null };
}

const time = (fn: () => void, runs = 3) => bestOf(fn, runs);

export function scheduleBench() {
  const small = Array.from({ length: 20 }, (_, i) => instance(7, 4, 100 + i, 4));
  const exhaustiveMs = time(() => small.forEach((x) => exhaustive(x)), 1) / small.length;
  const exactMs = time(() => small.forEach((x) => schedule(x, { suggest: false })), 1) / small.length;
  const sizes = [30, 100, 300].map((n) => {
    const x = instance(n, 40, n, 12);
    let placed = 0;
    const ms = time(() => (placed = schedule(x, { suggest: false }).placements.length));
    return { n, ms, placed };
  });
  const at300 = sizes.find((s) => s.n === 300)!.ms;
  console.log(JSON.stringify({ bench: "scheduler: 7 steps × 4 days, exact search vs exhaustive reference (mean per instance)", oursMs: +exactMs.toFixed(2), exhaustiveMs: +exhaustiveMs.toFixed(2), ratio: +(exactMs / exhaustiveMs).toFixed(3) }));
  console.log(JSON.stringify({ bench: "scheduler: 300 steps over 40 days vs one exhaustive small instance", oursMs: +at300.toFixed(1), exhaustiveSmallMs: +exhaustiveMs.toFixed(2), ratio: +(at300 / exhaustiveMs).toFixed(2) }));
  console.log(JSON.stringify({ bench: "scheduler scaling, 40 days of 12 h", steps: sizes.map((s) => s.n), placed: sizes.map((s) => s.placed), ms: sizes.map((s) => +s.ms.toFixed(1)), ratio300to30: +(at300 / sizes[0]!.ms).toFixed(1) }));
}
