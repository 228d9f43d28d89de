/**
 * The shoot scheduler against worked examples, validity properties
 * (fast-check) and an exhaustive search on small instances.
 * Time zones come from the IANA tz database through @date-fns/tz: in
 * Europe/Dublin summer time starts on the last Sunday of March at 01:00 UTC
 * and ends on the last Sunday of October at 01:00 UTC (the EU rule of
 * Directive 2000/84/EC, which the tz database follows).
 */
import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { schedule, zonedInstant, zonedParts, changes, type ScheduleDay, type ScheduleInput, type ScheduleStep } from "@/lib/shoot-schedule";
import { exhaustive } from "../support/exhaustive-schedule";

const TZ = "Europe/Dublin";
const H = 3_600_000;
const at = (date: string, hhmm: string) => zonedInstant(date, Number(hhmm.slice(0, 2)) * 60 + Number(hhmm.slice(3)), TZ);
const local = (t: number) => {
  const p = zonedParts(t, TZ);
  return `${p.date} ${String(Math.floor(p.minutes / 60)).padStart(2, "0")}:${String(p.minutes % 60).padStart(2, "0")}`;
};
const day = (id: string, date: string, from = "09:00", to = "17:00", crew = ["ana", "ben"], helpers = 0): ScheduleDay => ({ id, date, start: at(date, from), end: at(date, to), crew, helpers });
let pos = 0;
const step = (id: string, activeMinutes: number, more: Partial<ScheduleStep> = {}): ScheduleStep => ({
  id,
  title: id,
  position: pos++,
  activeMinutes,
  waitMinutes: 0,
  waitReason: "",
  dependsOn: [],
  crewNeeded: 1,
  mustFilm: true,
  pinnedDayId: null,
  ...more,
});
const base = (steps: ScheduleStep[], days: ScheduleDay[], more: Partial<ScheduleInput> = {}): ScheduleInput => ({ steps, days, members: ["ana", "ben"], away: [], timeZone: TZ, ...more });
const placed = (s: ReturnType<typeof schedule>, id: string) => s.placements.find((p) => p.stepId === id)!;

describe("worked examples (invented scenario; expected values worked by hand)", () => {
  it("a glue-up cures overnight, so the next step lands on the second day after the cure", () => {
    const s = schedule(
      base(
        [step("mill", 180), step("glue", 120, { dependsOn: ["mill"], waitMinutes: 24 * 60, waitReason: "glue cures" }), step("flatten", 120, { dependsOn: ["glue"] })],
        [day("sat", "2026-12-12"), day("sun", "2026-12-13")],
      ),
    );
    expect(s.unscheduled).toEqual([]);
    expect(local(placed(s, "mill").start)).toBe("2026-12-12 09:00");
    expect(local(placed(s, "glue").end)).toBe("2026-12-12 14:00");
    // Glue out of the clamps at 14:00 on Saturday, cured 24 h later.
    expect(local(placed(s, "flatten").start)).toBe("2026-12-13 14:00");
    expect(placed(s, "flatten").dayId).toBe("sun");
    expect(s.shootDaysUsed).toBe(2);
  });

  it("a wait runs across midnight and across days without shooting", () => {
    const s = schedule(base([step("glue", 60, { waitMinutes: 40 * 60 }), step("next", 60, { dependsOn: ["glue"] })], [day("sat", "2026-12-12"), day("sun", "2026-12-13"), day("tue", "2026-12-15")]));
    // Saturday 10:00 + 40 h = Monday 02:00; Monday is not a shoot day, so Tuesday's call.
    expect(local(placed(s, "glue").readyAfter)).toBe("2026-12-14 02:00");
    expect(local(placed(s, "next").start)).toBe("2026-12-15 09:00");
  });

  it("an unfilmed step runs off camera between shoot days, inside the workshop's hours", () => {
    const s = schedule(
      base([step("glue", 60, { waitMinutes: 20 * 60 }), step("sand", 180, { dependsOn: ["glue"], mustFilm: false }), step("finish", 60, { dependsOn: ["sand"] })], [day("sat", "2026-12-12"), day("mon", "2026-12-14")]),
    );
    // Glue ends Sat 10:00, cured Sun 06:00; sanding waits for the shop to open at 08:00 on Sunday.
    expect(placed(s, "sand").dayId).toBeNull();
    expect(local(placed(s, "sand").start)).toBe("2026-12-13 08:00");
    expect(local(placed(s, "finish").start)).toBe("2026-12-14 09:00");
  });

  it("steps of one day do not overlap, and hands-on time is never split across days", () => {
    const s = schedule(base([step("a", 300), step("b", 240)], [day("sat", "2026-12-12"), day("sun", "2026-12-13")]));
    expect(s.unscheduled).toEqual([]);
    const [a, b] = [placed(s, "a"), placed(s, "b")];
    expect(a.dayId).not.toBe(b.dayId);
  });

  it("leaves time another episode already holds on a shared day", () => {
    const d = { ...day("sat", "2026-12-12"), taken: [[at("2026-12-12", "09:00"), at("2026-12-12", "12:00")]] as [number, number][] };
    const s = schedule(base([step("a", 60)], [d]));
    expect(local(placed(s, "a").start)).toBe("2026-12-12 12:00");
  });

  it("a pinned step stays on its day, even when an earlier day has room", () => {
    const s = schedule(base([step("a", 60, { pinnedDayId: "sun" })], [day("sat", "2026-12-12"), day("sun", "2026-12-13")]));
    expect(placed(s, "a").dayId).toBe("sun");
  });

  it("explains a pin before the cure, names the wait, and suggests no day for it", () => {
    const s = schedule(base([step("glue", 60, { waitMinutes: 24 * 60, waitReason: "glue cures" }), step("flatten", 60, { dependsOn: ["glue"], pinnedDayId: "sat" })], [day("sat", "2026-12-12"), day("sun", "2026-12-13")]));
    expect(s.unscheduled).toHaveLength(1);
    expect(s.unscheduled[0]!.reason).toBe("“flatten” is pinned to Sat 12 Dec, but it cannot start before Sun 13 Dec 10:00 (after “glue” and its wait, glue cures, 24 h). Pin it to a later day or unpin it.");
  });

  it("when nothing after the cure is left, says why and suggests the earliest extra shoot day", () => {
    const s = schedule(base([step("glue", 120, { waitMinutes: 30 * 60, waitReason: "glue cures" }), step("flatten", 120, { dependsOn: ["glue"] })], [day("sat", "2026-12-12")], { offCameraHours: null }));
    expect(s.unscheduled.map((u) => u.stepId)).toEqual(["flatten"]);
    expect(s.unscheduled[0]!.reason).toBe("“flatten” can start at Sun 13 Dec 17:00 at the earliest (after “glue” and its wait, glue cures, 30 h), and no shoot day after that has 2 h free with 1 person.");
    // Sunday's 17:00 leaves no 2 h inside 09:00–17:00, so Monday is the earliest that works.
    expect(s.suggestion?.date).toBe("2026-12-14");
    expect(s.suggestion?.text).toBe("Add a shoot day on Mon 14 Dec (09:00–17:00) and everything fits.");
  });

  it("explains a step longer than any day, and one that needs more people than any day has", () => {
    const s = schedule(base([step("long", 9 * 60), step("big", 60, { crewNeeded: 3 })], [day("sat", "2026-12-12")], { offCameraHours: null }));
    const reasons = Object.fromEntries(s.unscheduled.map((u) => [u.stepId, u.reason]));
    expect(reasons.long).toMatch(/needs 9 h of hands-on time in one go, but the longest shoot day it could use is 8 h/);
    expect(reasons.big).toMatch(/needs 3 people, but no shoot day has more than 2 on hand/);
  });

  it("counts crew marked away and warns about them", () => {
    const s = schedule(base([step("two", 60, { crewNeeded: 2 })], [day("sat", "2026-12-12"), day("sun", "2026-12-13")], { away: [{ userId: "ben", date: "2026-12-12" }] }));
    expect(placed(s, "two").dayId).toBe("sun");
    const t = schedule(base([step("one", 60)], [day("sat", "2026-12-12")], { away: [{ userId: "ben", date: "2026-12-12" }] }));
    expect(t.warnings[0]).toMatch(/1 of the crew on Sat 12 Dec is marked away/);
  });

  it("reports what moved when a day is cancelled and the plan is made again", () => {
    const steps = [step("a", 60), step("b", 60, { dependsOn: ["a"] })];
    const first = schedule(base(steps, [day("sat", "2026-12-12"), day("sun", "2026-12-13")]));
    const again = schedule(base(steps, [day("sun", "2026-12-13")]));
    const moved = changes(first.placements, again);
    expect(moved.map((m) => m.stepId).sort()).toEqual(["a", "b"]);
    expect(moved.every((m) => m.to?.dayId === "sun")).toBe(true);
  });
});

describe("time zones and daylight saving (IANA tz via @date-fns/tz)", () => {
  it("reads shoot-day hours on the day the clocks go forward", () => {
    // 29 Mar 2026: Dublin goes from GMT to IST (UTC+1) at 01:00 UTC.
    expect(new Date(zonedInstant("2026-03-29", 9 * 60, TZ)).toISOString()).toBe("2026-03-29T08:00:00.000Z");
    expect(new Date(zonedInstant("2026-03-28", 9 * 60, TZ)).toISOString()).toBe("2026-03-28T09:00:00.000Z");
    // 25 Oct 2026: back to GMT.
    expect(new Date(zonedInstant("2026-10-25", 9 * 60, TZ)).toISOString()).toBe("2026-10-25T09:00:00.000Z");
  });

  it("runs a wait as elapsed time: 24 h from Saturday noon GMT ends at 13:00 IST on Sunday", () => {
    const s = schedule(base([step("glue", 60, { waitMinutes: 23 * 60 }), step("next", 60, { dependsOn: ["glue"] })], [day("sat", "2026-03-28", "11:00", "17:00"), day("sun", "2026-03-29", "09:00", "17:00")]));
    expect(local(placed(s, "glue").end)).toBe("2026-03-28 12:00");
    expect(local(placed(s, "next").start)).toBe("2026-03-29 12:00");
    expect(placed(s, "next").start - placed(s, "glue").end).toBe(23 * H);
    // A shoot day on the short day is seven hours long, not eight, if it spans the change.
    expect((zonedInstant("2026-03-29", 17 * 60, TZ) - zonedInstant("2026-03-29", 0, TZ)) / H).toBe(16);
  });
});

// ---------------------------------------------------------------- properties

const arbInstance = (maxSteps: number, maxDays: number, withOff: boolean) =>
  fc
    .record({
      n: fc.integer({ min: 1, max: maxSteps }),
      nd: fc.integer({ min: 1, max: maxDays }),
      durations: fc.array(fc.integer({ min: 1, max: 3 }), { minLength: maxSteps, maxLength: maxSteps }),
      waits: fc.array(fc.constantFrom(0, 0, 1, 2, 12, 20), { minLength: maxSteps, maxLength: maxSteps }),
      deps: fc.array(fc.array(fc.boolean(), { minLength: maxSteps, maxLength: maxSteps }), { minLength: maxSteps, maxLength: maxSteps }),
      crew: fc.array(fc.integer({ min: 1, max: 2 }), { minLength: maxSteps, maxLength: maxSteps }),
      film: fc.array(fc.boolean(), { minLength: maxSteps, maxLength: maxSteps }),
      gaps: fc.array(fc.integer({ min: 1, max: 2 }), { minLength: maxDays, maxLength: maxDays }),
      dayCrew: fc.array(fc.integer({ min: 1, max: 2 }), { minLength: maxDays, maxLength: maxDays }),
      pin: fc.array(fc.integer({ min: -6, max: maxDays - 1 }), { minLength: maxSteps, maxLength: maxSteps }),
    })
    .map((r) => {
      const days: ScheduleDay[] = [];
      let date = new Date("2026-12-12T12:00:00Z");
      for (let d = 0; d < r.nd; d++) {
        const iso = date.toISOString().slice(0, 10);
        days.push(day(`d${d}`, iso, "09:00", "13:00", ["ana", "ben"].slice(0, r.dayCrew[d]!)));
        date = new Date(date.getTime() + r.gaps[d]! * 86_400_000);
      }
      const steps: ScheduleStep[] = Array.from({ length: r.n }, (_, i) =>
        step(`s${i}`, r.durations[i]! * 60, {
          position: i,
          waitMinutes: r.waits[i]! * 60,
          dependsOn: Array.from({ length: i }, (_, j) => j).filter((j) => r.deps[i]![j] && (i - j <= 2 || j % 3 === 0)).map((j) => `s${j}`),
          crewNeeded: r.crew[i]!,
          mustFilm: withOff ? r.film[i]! : true,
          pinnedDayId: r.pin[i]! >= 0 && r.pin[i]! < r.nd ? `d${r.pin[i]}` : null,
        }),
      );
      return base(steps, days, { offCameraHours: withOff ? { startMinutes: 9 * 60, endMinutes: 12 * 60 } : null });
    });

function checkValid(input: ScheduleInput, s: ReturnType<typeof schedule>): string[] {
  const bad: string[] = [];
  const byId = new Map(input.steps.map((x) => [x.id, x]));
  const place = new Map(s.placements.map((p) => [p.stepId, p]));
  for (const p of s.placements) {
    const st = byId.get(p.stepId)!;
    for (const d of st.dependsOn) {
      const q = place.get(d);
      if (!q) bad.push(`${p.stepId} placed while ${d} is not`);
      else if (p.start < q.readyAfter) bad.push(`${p.stepId} starts before ${d}'s wait is over`);
    }
    if (p.end - p.start !== st.activeMinutes * 60_000) bad.push(`${p.stepId} split or stretched`);
    if (st.pinnedDayId && p.dayId !== st.pinnedDayId) bad.push(`${p.stepId} left its pinned day`);
    if (st.mustFilm && p.dayId === null && st.activeMinutes > 0) bad.push(`${p.stepId} filmed off a shoot day`);
    if (p.dayId) {
      const d = input.days.find((x) => x.id === p.dayId)!;
      if (p.start < d.start || p.end > d.end) bad.push(`${p.stepId} outside its day's hours`);
      if (d.crew.length + d.helpers < st.crewNeeded) bad.push(`${p.stepId} on a day without enough crew`);
    }
  }
  const windows = new Map<string, [number, number][]>();
  for (const p of s.placements) {
    if (p.end === p.start) continue;
    const key = p.dayId ?? `off:${p.date}`;
    const list = windows.get(key) ?? [];
    for (const [a, b] of list) if (p.start < b && a < p.end) bad.push(`${p.stepId} overlaps another step on ${key}`);
    list.push([p.start, p.end]);
    windows.set(key, list);
  }
  if (s.placements.length + s.unscheduled.length !== input.steps.length) bad.push("a step is neither placed nor explained");
  return bad;
}

describe("validity (fast-check): dependencies, waits, capacity, pins", () => {
  it("holds for random plans with and without off-camera work", () => {
    for (const withOff of [false, true]) {
      fc.assert(
        fc.property(arbInstance(7, 4, withOff), (input) => {
          const s = schedule(input, { suggest: false });
          expect(checkValid(input, s)).toEqual([]);
        }),
        { numRuns: 150 },
      );
    }
  });

  it("holds for large plans scheduled greedily", () => {
    fc.assert(
      fc.property(arbInstance(20, 10, true), (input) => {
        const s = schedule(input, { suggest: false });
        expect(checkValid(input, s)).toEqual([]);
      }),
      { numRuns: 40 },
    );
  });
});

// ---------------------------------------------------------------- exhaustive reference

describe("optimality against an exhaustive search (up to 7 steps and 4 days)", () => {
  it("finds the same best objective as trying every placement", () => {
    fc.assert(
      fc.property(arbInstance(7, 4, false), (input) => {
        const s = schedule(input, { suggest: false });
        const filmedEnds = s.placements.map((p) => p.end);
        const mine: [number, number, number] = [s.unscheduled.length, Math.max(0, ...filmedEnds), s.shootDaysUsed];
        expect(mine).toEqual(exhaustive(input));
      }),
      { numRuns: 60 },
    );
  }, 120_000);
});
