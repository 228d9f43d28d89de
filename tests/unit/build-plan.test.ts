import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { findCycle, formatMinutes, planTiming, type PlanStep } from "@/lib/build-plan";

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
