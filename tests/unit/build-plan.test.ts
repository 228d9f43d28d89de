import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { crewTiming, findCycle, formatMinutes, placeRemedy, planTiming, type CrewStep, type PlanStep } from "@/lib/build-plan";

/** Reference: the longest path found by trying every path in the graph. */
function bruteForceLongest(steps: PlanStep[]): number {
  const byId = new Map(steps.map((s) => [s.id, s]));
  const w = (s: PlanStep) => (s.status === "skipped" ? 0 : s.activeMinutes + s.waitMinutes);
  const longestEndingAt = (id: string): number => {
    const s = byId.get(id)!;
    const before = s.dependsOn.filter((d) => byId.has(d)).map(longestEndingAt);
    return w(s) + (before.length ? Math.max(...before) : 0);
  };
  return Math.max(0, ...steps.map((s) => longestEndingAt(s.id)));
}

// Random DAGs: a step may depend only on steps listed before it.
const dag = fc
  .array(fc.record({ active: fc.integer({ min: 0, max: 300 }), wait: fc.integer({ min: 0, max: 2880 }), deps: fc.array(fc.nat(20), { maxLength: 3 }), skipped: fc.boolean() }), { minLength: 1, maxLength: 9 })
  .map((rows) =>
    rows.map((r, i) => ({
      id: `s${i}`,
      activeMinutes: r.active,
      waitMinutes: r.wait,
      status: r.skipped && i % 3 === 0 ? "skipped" : "planned",
      dependsOn: i === 0 ? [] : [...new Set(r.deps.map((d) => `s${d % i}`))],
    })),
  );

describe("build plan timing", () => {
  it("critical path equals the brute-force longest chain (fast-check)", () => {
    fc.assert(
      fc.property(dag, (steps) => {
        const t = planTiming(steps);
        expect(t.criticalPathMinutes).toBe(bruteForceLongest(steps));
        // The reported path is a real chain and adds up to the length.
        const sum = t.criticalPath.reduce((a, id) => {
          const s = steps.find((x) => x.id === id)!;
          return a + (s.status === "skipped" ? 0 : s.activeMinutes + s.waitMinutes);
        }, 0);
        expect(sum).toBe(t.criticalPathMinutes);
        for (let i = 1; i < t.criticalPath.length; i++) {
          expect(steps.find((s) => s.id === t.criticalPath[i])!.dependsOn).toContain(t.criticalPath[i - 1]);
        }
      }),
      { numRuns: 500 },
    );
  });

  it("a glue-up wait delays what follows it", () => {
    const steps: PlanStep[] = [
      { id: "mill", activeMinutes: 90, waitMinutes: 0, dependsOn: [] },
      { id: "glue", activeMinutes: 30, waitMinutes: 24 * 60, dependsOn: ["mill"] },
      { id: "legs", activeMinutes: 120, waitMinutes: 0, dependsOn: ["mill"] },
      { id: "assemble", activeMinutes: 60, waitMinutes: 0, dependsOn: ["glue", "legs"] },
    ];
    const t = planTiming(steps);
    expect(t.steps.assemble!.start).toBe(90 + 30 + 1440);
    expect(t.criticalPath).toEqual(["mill", "glue", "assemble"]);
    expect(t.totalActiveMinutes).toBe(300);
    expect(t.totalWaitMinutes).toBe(1440);
    expect(formatMinutes(t.criticalPathMinutes)).toBe("1d 3h");
  });

  it("finds cycles and refuses to time them", () => {
    const steps = [
      { id: "a", dependsOn: ["c"] },
      { id: "b", dependsOn: ["a"] },
      { id: "c", dependsOn: ["b"] },
    ];
    expect(findCycle(steps)?.sort()).toEqual(["a", "b", "c"]);
    expect(findCycle([{ id: "a", dependsOn: ["a"] }])).toEqual(["a"]);
    expect(findCycle([{ id: "a", dependsOn: [] }, { id: "b", dependsOn: ["a"] }])).toBeNull();
    expect(() => planTiming(steps.map((s) => ({ ...s, activeMinutes: 1, waitMinutes: 0 })))).toThrow(/cycle/);
  });
});

describe("build plan timing with crew counted", () => {
  const withCrew = dag.chain((steps) => fc.tuple(fc.constant(steps), fc.array(fc.integer({ min: 0, max: 3 }), { minLength: steps.length, maxLength: steps.length }), fc.integer({ min: 1, max: 3 })));

  it("keeps every dependency and wait, and never needs more people than the team at once (fast-check)", () => {
    fc.assert(
      fc.property(withCrew, ([base, needs, team]) => {
        const steps: CrewStep[] = base.map((s, i) => ({ ...s, crewNeeded: needs[i]! }));
        const t = crewTiming(steps, team);
        for (const s of steps) {
          for (const d of s.dependsOn) expect(t.steps[s.id]!.start).toBeGreaterThanOrEqual(t.steps[d]!.end);
        }
        // Resource check by sweeping every moment a step starts: the people busy then.
        const busy = steps.filter((s) => t.steps[s.id]!.activeEnd > t.steps[s.id]!.start);
        for (const p of busy) {
          const x = t.steps[p.id]!.start;
          const people = busy.filter((q) => t.steps[q.id]!.start <= x && x < t.steps[q.id]!.activeEnd).reduce((a, q) => a + Math.min(team, q.crewNeeded), 0);
          expect(people).toBeLessThanOrEqual(team);
        }
        expect(t.finishMinutes).toBeGreaterThanOrEqual(planTiming(steps).criticalPathMinutes);
      }),
      { numRuns: 500 },
    );
  });

  it("with people enough for everything, equals the plain chain of durations (fast-check)", () => {
    fc.assert(
      fc.property(dag, (base) => {
        const steps: CrewStep[] = base.map((s) => ({ ...s, crewNeeded: 1 }));
        const t = crewTiming(steps, steps.length);
        const plain = planTiming(steps);
        for (const s of steps) expect(t.steps[s.id]!.start).toBe(plain.steps[s.id]!.start);
      }),
      { numRuns: 300 },
    );
  });

  it("one person cannot sand the legs while gluing the top; glue curing needs nobody", () => {
    // Worked by hand: with one person the 120 min of legs waits for the 30 min glue-up, then runs during the cure.
    const steps: CrewStep[] = [
      { id: "glue", activeMinutes: 30, waitMinutes: 24 * 60, dependsOn: [], crewNeeded: 1 },
      { id: "legs", activeMinutes: 120, waitMinutes: 0, dependsOn: [], crewNeeded: 1 },
      { id: "assemble", activeMinutes: 60, waitMinutes: 0, dependsOn: ["glue", "legs"], crewNeeded: 2 },
    ];
    const one = crewTiming(steps, 1);
    expect(one.steps.legs).toMatchObject({ start: 30, activeEnd: 150, crewDelayMinutes: 30 });
    expect(one.steps.assemble!.start).toBe(30 + 1440);
    expect(one.overCrew).toEqual(["assemble"]);
    const two = crewTiming(steps, 2);
    expect(two.steps.legs!.start).toBe(0);
    expect(two.overCrew).toEqual([]);
  });
});

describe("placeRemedy (common practice, no published source: a fix goes between the failure and what waited for it)", () => {
  const steps = [
    { id: "glue", dependsOn: [], remedyOfStepId: null },
    { id: "fix1", dependsOn: ["glue"], remedyOfStepId: "glue" },
    { id: "sand", dependsOn: ["glue"], remedyOfStepId: null },
    { id: "finish", dependsOn: ["sand"], remedyOfStepId: null },
  ];
  it("depends on the failed step, sits after its earlier remedies, and what waited for the failure waits for it", () => {
    const p = placeRemedy(steps, "glue", "fix2", []);
    expect(p.dependsOn).toEqual(["glue"]);
    expect(p.order).toEqual(["glue", "fix1", "fix2", "sand", "finish"]);
    expect(p.rewired).toEqual(["sand"]);
  });
  it("skips a rewiring that would make a loop", () => {
    // The remedy itself waits for "sand", so "sand" cannot wait for the remedy.
    const p = placeRemedy(steps, "glue", "fix2", ["sand"]);
    expect(p.rewired).toEqual([]);
    expect(findCycle([...steps, { id: "fix2", dependsOn: p.dependsOn }])).toBeNull();
  });
});
