/**
 * Build-plan timing: each step takes its active minutes, then its wait
 * (glue cure, finish dry, acclimatise) before anything that depends on it
 * may start. Steps with no dependency between them may run side by side.
 */
export interface PlanStep {
  id: string;
  activeMinutes: number;
  waitMinutes: number;
  dependsOn: string[];
  status?: string;
}

export interface StepTiming {
  start: number;
  activeEnd: number;
  end: number;
}

export interface PlanTiming {
  steps: Record<string, StepTiming>;
  totalActiveMinutes: number;
  totalWaitMinutes: number;
  /** Longest dependency chain, active time and waits included. */
  criticalPathMinutes: number;
  criticalPath: string[];
}

/** Returns the ids on one dependency cycle, or null when there is none. */
export function findCycle(steps: Pick<PlanStep, "id" | "dependsOn">[]): string[] | null {
  const deps = new Map(steps.map((s) => [s.id, s.dependsOn]));
  const state = new Map<string, 1 | 2>();
  const stack: string[] = [];
  const visit = (id: string): string[] | null => {
    state.set(id, 1);
    stack.push(id);
    for (const d of deps.get(id) ?? []) {
      if (!deps.has(d)) continue;
      if (state.get(d) === 1) return stack.slice(stack.indexOf(d));
      if (!state.has(d)) {
        const c = visit(d);
        if (c) return c;
      }
    }
    stack.pop();
    state.set(id, 2);
    return null;
  };
  for (const s of steps) {
    if (!state.has(s.id)) {
      const c = visit(s.id);
      if (c) return c;
    }
  }
  return null;
}

function duration(s: PlanStep) {
  return s.status === "skipped" ? { active: 0, wait: 0 } : { active: Math.max(0, s.activeMinutes), wait: Math.max(0, s.waitMinutes) };
}

/** Earliest start for every step and the critical path. Throws on a cycle. */
export function planTiming(steps: PlanStep[]): PlanTiming {
  const cycle = findCycle(steps);
  if (cycle) throw new Error(`dependency cycle: ${cycle.join(" → ")}`);
  const byId = new Map(steps.map((s) => [s.id, s]));
  const timing: Record<string, StepTiming> = {};
  const via: Record<string, string | null> = {};
  const compute = (id: string): StepTiming => {
    const done = timing[id];
    if (done) return done;
    const s = byId.get(id)!;
    let start = 0;
    let from: string | null = null;
    for (const d of s.dependsOn) {
      if (!byId.has(d)) continue;
      const e = compute(d).end;
      if (from === null || e > start) {
        start = e;
        from = d;
      }
    }
    const { active, wait } = duration(s);
    const t = { start, activeEnd: start + active, end: start + active + wait };
    timing[id] = t;
    via[id] = from;
    return t;
  };
  steps.forEach((s) => compute(s.id));
  let last: string | null = null;
  for (const s of steps) if (last === null || timing[s.id]!.end > timing[last]!.end) last = s.id;
  const path: string[] = [];
  for (let cur = last; cur; cur = via[cur] ?? null) path.unshift(cur);
  return {
    steps: timing,
    totalActiveMinutes: steps.reduce((a, s) => a + duration(s).active, 0),
    totalWaitMinutes: steps.reduce((a, s) => a + duration(s).wait, 0),
    criticalPathMinutes: last ? timing[last]!.end : 0,
    criticalPath: path,
  };
}

export function formatMinutes(total: number): string {
  const d = Math.floor(total / 1440);
  const h = Math.floor((total % 1440) / 60);
  const m = total % 60;
  return [d ? `${d}d` : "", h ? `${h}h` : "", m || (!d && !h) ? `${m}m` : ""].filter(Boolean).join(" ");
}
