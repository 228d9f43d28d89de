import type { ScheduleInput } from "../../lib/shoot-schedule";

const H = 3_600_000;

/**
 * Tries every assignment of every step to a shoot day and a whole-hour start
 * (or to nothing), keeping the valid ones, and returns the best objective:
 * [steps left out, end of the last filmed step, shoot days used]. All
 * durations, waits and hours in these instances are whole hours, so some
 * optimal schedule starts every step on the hour.
 */
export function exhaustive(input: ScheduleInput): [number, number, number] {
  const steps = input.steps;
  const options = input.days.flatMap((d) => {
    const out: { dayId: string; start: number }[] = [];
    for (let t = d.start; t < d.end; t += H) out.push({ dayId: d.id, start: t });
    return out;
  });
  const assign = new Map<string, { dayId: string; start: number; end: number } | null>();
  let bestScore: [number, number, number] = [Infinity, Infinity, Infinity];
  const less = (a: number[], b: number[]) => {
    for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! < b[i]!;
    return false;
  };
  const notBefore = Math.min(...input.days.map((d) => d.start));
  const rec = (i: number, out: number) => {
    if (out > bestScore[0]) return;
    if (i === steps.length) {
      const placedList = [...assign.values()].filter(Boolean) as { dayId: string; start: number; end: number }[];
      const finish = Math.max(0, ...placedList.map((p) => p.end));
      const score: [number, number, number] = [out, finish, new Set(placedList.map((p) => p.dayId)).size];
      if (less(score, bestScore)) bestScore = score;
      return;
    }
    const st = steps[i]!;
    const predsOk = st.dependsOn.every((d) => assign.get(d));
    if (predsOk) {
      const ready = Math.max(notBefore, ...st.dependsOn.map((d) => assign.get(d)!.end + steps.find((x) => x.id === d)!.waitMinutes * 60_000));
      for (const o of options) {
        const d = input.days.find((x) => x.id === o.dayId)!;
        if (st.pinnedDayId && st.pinnedDayId !== o.dayId) continue;
        if (d.crew.length + d.helpers < st.crewNeeded) continue;
        const end = o.start + st.activeMinutes * 60_000;
        if (o.start < ready || end > d.end) continue;
        if ([...assign.values()].some((p) => p && p.dayId === o.dayId && o.start < p.end && p.start < end)) continue;
        assign.set(st.id, { dayId: o.dayId, start: o.start, end });
        rec(i + 1, out);
        assign.delete(st.id);
      }
    }
    assign.set(st.id, null);
    rec(i + 1, out + 1);
    assign.delete(st.id);
  };
  rec(0, 0);
  return bestScore;
}
