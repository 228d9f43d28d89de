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

/**
 * Where a remedy for a failed step goes. It depends on the failed step (plus
 * its own dependencies), sits right after the failed step and its earlier
 * remedies, and every step that waited for the failed step now waits for the
 * remedy too (unless that would make a loop), so the schedule follows the fix.
 */
export function placeRemedy(
  steps: { id: string; dependsOn: string[]; remedyOfStepId: string | null }[],
  failedId: string,
  remedyId: string,
  remedyDependsOn: string[],
): { dependsOn: string[]; rewired: string[]; order: string[] } {
  const dependsOn = remedyDependsOn.includes(failedId) ? remedyDependsOn : [failedId, ...remedyDependsOn];
  let graph = [...steps.map((s) => ({ id: s.id, dependsOn: s.dependsOn })), { id: remedyId, dependsOn }];
  const rewired: string[] = [];
  for (const s of steps) {
    if (s.id === failedId || s.remedyOfStepId === failedId || !s.dependsOn.includes(failedId)) continue;
    const next = graph.map((g) => (g.id === s.id ? { ...g, dependsOn: [...g.dependsOn, remedyId] } : g));
    if (findCycle(next)) continue;
    graph = next;
    rewired.push(s.id);
  }
  const order = steps.map((s) => s.id);
  let at = order.indexOf(failedId) + 1;
  while (at < order.length && steps[at]!.remedyOfStepId === failedId) at++;
  order.splice(at, 0, remedyId);
  return { dependsOn, rewired, order };
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

export interface CrewStep extends PlanStep {
  crewNeeded: number;
}

export interface CrewTiming {
  steps: Record<string, StepTiming & { crewDelayMinutes: number }>;
  /** When the last step's wait is over, counting crew. */
  finishMinutes: number;
  /** Steps that need more people than the team has; they are placed as if the whole team were enough. */
  overCrew: string[];
}

/**
 * The same chain of durations, but hands-on time counts people: at no moment
 * do the steps being worked on need more than `crew` people together. Waits
 * (glue curing, finish drying) need nobody. Steps are placed one at a time,
 * the one that could start soonest first (ties by plan order), each at the
 * first moment after its dependencies when enough people are free: a greedy
 * list schedule, not a proven optimum. Still elapsed time from the first
 * step, not clock times: nights and days off are for the shoot-day schedule.
 */
export function crewTiming(steps: CrewStep[], crew: number): CrewTiming {
  const cycle = findCycle(steps);
  if (cycle) throw new Error(`dependency cycle: ${cycle.join(" → ")}`);
  const team = Math.max(1, Math.floor(crew));
  const known = new Set(steps.map((s) => s.id));
  const placed: { id: string; start: number; activeEnd: number; need: number }[] = [];
  const out: CrewTiming["steps"] = {};
  const overCrew: string[] = [];
  const usageAt = (x: number) => placed.reduce((a, p) => (p.start <= x && x < p.activeEnd ? a + p.need : a), 0);
  const left = steps.map((s, index) => ({ s, index }));
  while (left.length) {
    let best: { k: number; est: number } | null = null;
    left.forEach(({ s, index }, k) => {
      const deps = s.dependsOn.filter((d) => known.has(d));
      if (!deps.every((d) => out[d])) return;
      const est = Math.max(0, ...deps.map((d) => out[d]!.end));
      if (!best || est < best.est || (est === best.est && index < left[best.k]!.index)) best = { k, est };
    });
    const { k, est } = best!;
    const { s } = left.splice(k, 1)[0]!;
    const { active, wait } = duration(s);
    const need = Math.min(team, Math.max(0, s.crewNeeded));
    if (s.crewNeeded > team) overCrew.push(s.id);
    let start = est;
    if (active > 0 && need > 0) {
      // Free people only appear when a placed step's hands-on time ends.
      const candidates = [est, ...placed.map((p) => p.activeEnd).filter((t) => t > est)].sort((a, b) => a - b);
      start = candidates.find((t) => {
        const points = [t, ...placed.map((p) => p.start).filter((x) => x > t && x < t + active)];
        return points.every((x) => usageAt(x) + need <= team);
      })!;
      placed.push({ id: s.id, start, activeEnd: start + active, need });
    }
    out[s.id] = { start, activeEnd: start + active, end: start + active + wait, crewDelayMinutes: start - est };
  }
  return { steps: out, finishMinutes: Math.max(0, ...Object.values(out).map((t) => t.end)), overCrew };
}
