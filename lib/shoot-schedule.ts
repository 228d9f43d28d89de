/**
 * The shoot scheduler: pure, no I/O. It puts an episode's build steps on
 * clock times so that
 *  - a step starts only after each step it depends on has ended and that
 *    step's wait (glue, finish) has run on the clock, overnight and across
 *    days without shooting;
 *  - a step that must be filmed sits inside a shoot day's hours, on a day
 *    with enough crew who are not away; an unfilmed step may also run off
 *    camera on any day, inside the workshop's hours, with enough members;
 *  - the steps of one day (one shop, one camera) do not overlap, and a
 *    step's hands-on time is never split across days;
 *  - a step pinned to a shoot day stays on it.
 * The objective, in order: as many steps placed as possible, the earliest
 * end of the last filmed step, the fewest shoot days used, then the fewest
 * steps moved from the previous plan (so re-planning does not shuffle days).
 *
 * Up to EXACT_LIMIT steps, every order of the steps that respects the
 * dependencies is tried (a serial schedule with each step at the earliest
 * free time: these schedules include an optimal one); beyond that, one
 * greedy order (earliest ready first, then the longest chain after it, then
 * the plan order). Times are epoch milliseconds; dates are YYYY-MM-DD in the
 * channel's time zone.
 */
import { TZDate } from "@date-fns/tz";
import { addDays, format } from "date-fns";

export const EXACT_LIMIT = 8;
/** Off-camera work runs inside these hours on any day (common practice for a home workshop, no published source). */
export const OFF_CAMERA_HOURS = { startMinutes: 8 * 60, endMinutes: 18 * 60 };
/** How far past the last shoot day off-camera work and suggested extra days may go. */
export const HORIZON_DAYS = 60;
const MIN = 60_000;

export interface ScheduleStep {
  id: string;
  title: string;
  position: number;
  activeMinutes: number;
  waitMinutes: number;
  waitReason: string;
  dependsOn: string[];
  crewNeeded: number;
  mustFilm: boolean;
  pinnedDayId: string | null;
  /** Done, skipped or failed steps are history: they take no time and hold nobody up. */
  settled?: boolean;
}

export interface ScheduleDay {
  id: string;
  date: string;
  start: number;
  end: number;
  /** Members on the crew (ids), and named helpers from outside. */
  crew: string[];
  helpers: number;
  /** Time already taken on this day (another episode's saved steps). */
  taken?: [number, number][];
}

export interface ScheduleInput {
  steps: ScheduleStep[];
  days: ScheduleDay[];
  /** Channel members (ids), for off-camera work and the suggested extra day. */
  members: string[];
  away: { userId: string; date: string }[];
  timeZone: string;
  /** Nothing starts before this instant (now, when planning ahead). Defaults to the first shoot day's call. */
  notBefore?: number;
  /** The previous plan: step id → shoot day id (null off camera), to keep re-plans stable. */
  previous?: Record<string, string | null>;
  /** Windows for off-camera work; default OFF_CAMERA_HOURS. */
  offCameraHours?: { startMinutes: number; endMinutes: number } | null;
}

export interface Placement {
  stepId: string;
  /** The shoot day, or null when the step runs off camera (or takes no hands-on time). */
  dayId: string | null;
  date: string | null;
  start: number;
  end: number;
  /** When its wait is over and the next step may start. */
  readyAfter: number;
}

export type Refusal =
  | { kind: "too_long"; stepId: string; longestMinutes: number }
  | { kind: "crew"; stepId: string; needed: number; most: number }
  | { kind: "pinned_gone"; stepId: string }
  | { kind: "pinned_too_early"; stepId: string; dayId: string; readyAt: number; waitedOn: string | null }
  | { kind: "pinned_full"; stepId: string; dayId: string }
  | { kind: "no_day_after"; stepId: string; readyAt: number; waitedOn: string | null }
  | { kind: "blocked"; stepId: string; by: string };

export interface Schedule {
  placements: Placement[];
  unscheduled: { stepId: string; reason: string; refusal: Refusal }[];
  warnings: string[];
  /** End of the last filmed step (or of the last step when none is filmed); null when nothing was placed. */
  finish: number | null;
  shootDaysUsed: number;
  /** When something does not fit: the earliest extra shoot day that would make more of it fit. */
  suggestion: { date: string; start: number; end: number; text: string } | null;
  /** How the order was found. */
  method: "exact" | "greedy";
}

interface Window {
  taken?: [number, number][];
  dayId: string | null;
  date: string;
  start: number;
  end: number;
  people: number;
  shoot: boolean;
}

/** An instant for a wall-clock time on a date in a zone (daylight-saving days included). */
export function zonedInstant(date: string, minutes: number, timeZone: string): number {
  const [y, m, d] = date.split("-").map(Number) as [number, number, number];
  return new TZDate(y, m - 1, d, Math.floor(minutes / 60), minutes % 60, timeZone).getTime();
}

/** The date (YYYY-MM-DD) and minutes past midnight of an instant in a zone. */
export function zonedParts(instant: number, timeZone: string): { date: string; minutes: number } {
  const t = new TZDate(instant, timeZone);
  return { date: format(t, "yyyy-MM-dd"), minutes: t.getHours() * 60 + t.getMinutes() };
}

export function formatWhen(instant: number, timeZone: string): string {
  return format(new TZDate(instant, timeZone), "EEE d MMM HH:mm");
}

function formatDay(date: string): string {
  return format(new Date(`${date}T12:00:00Z`), "EEE d MMM");
}

function hours(minutes: number): string {
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  return m ? `${h} h ${m} min` : `${h} h`;
}

function nextDate(date: string): string {
  return format(addDays(new Date(`${date}T12:00:00Z`), 1), "yyyy-MM-dd");
}

function windowsFor(input: ScheduleInput): { shoot: Window[]; off: Window[] } {
  const awayOn = new Map<string, Set<string>>();
  for (const a of input.away) (awayOn.get(a.date) ?? awayOn.set(a.date, new Set()).get(a.date)!).add(a.userId);
  const shoot = input.days
    .map((d) => ({ dayId: d.id, date: d.date, start: d.start, end: d.end, people: d.crew.filter((u) => !awayOn.get(d.date)?.has(u)).length + d.helpers, shoot: true, taken: d.taken }))
    .sort((a, b) => a.start - b.start || a.dayId!.localeCompare(b.dayId!));
  const off: Window[] = [];
  const hoursOff = input.offCameraHours === undefined ? OFF_CAMERA_HOURS : input.offCameraHours;
  if (hoursOff) {
    const first = zonedParts(input.notBefore ?? Math.min(...input.days.map((d) => d.start), Date.now()), input.timeZone).date;
    const lastShoot = input.days.length ? input.days.map((d) => d.date).sort().at(-1)! : first;
    let date = first;
    for (let i = 0; i < 400 && date <= lastOf(lastShoot, HORIZON_DAYS); i++, date = nextDate(date)) {
      const people = input.members.filter((u) => !awayOn.get(date)?.has(u)).length;
      off.push({ dayId: null, date, start: zonedInstant(date, hoursOff.startMinutes, input.timeZone), end: zonedInstant(date, hoursOff.endMinutes, input.timeZone), people, shoot: false });
    }
  }
  return { shoot, off };
}

function lastOf(date: string, plusDays: number): string {
  return format(addDays(new Date(`${date}T12:00:00Z`), plusDays), "yyyy-MM-dd");
}

interface Ctx {
  input: ScheduleInput;
  steps: Map<string, ScheduleStep>;
  shoot: Window[];
  off: Window[];
  notBefore: number;
}

interface Attempt {
  placements: Map<string, Placement>;
  refusals: Map<string, Refusal>;
  score: [number, number, number, number];
}

/** Earliest start ≥ from inside [w.start, w.end] where `minutes` fit between the busy intervals; null when none. */
function earliestGap(busy: [number, number][], w: Window, from: number, minutes: number): number | null {
  let t = Math.max(from, w.start);
  const len = minutes * MIN;
  for (const [a, b] of busy) {
    if (t + len <= a) break;
    if (b > t) t = b;
  }
  return t + len <= w.end ? t : null;
}

function insertBusy(busy: [number, number][], a: number, b: number) {
  let i = 0;
  while (i < busy.length && busy[i]![0] < a) i++;
  busy.splice(i, 0, [a, b]);
}

function readyOf(step: ScheduleStep, placed: Map<string, Placement>, ctx: Ctx): { at: number; by: string | null } {
  let at = ctx.notBefore;
  let by: string | null = null;
  for (const d of step.dependsOn) {
    const p = placed.get(d);
    if (p && p.readyAfter > at) {
      at = p.readyAfter;
      by = d;
    }
  }
  return { at, by };
}

function run(order: string[], ctx: Ctx): Attempt {
  const placed = new Map<string, Placement>();
  const refusals = new Map<string, Refusal>();
  const busy = new Map<Window, [number, number][]>();
  const blockedBy = (s: ScheduleStep) => s.dependsOn.find((d) => refusals.has(d) && !ctx.steps.get(d)?.settled);
  for (const id of order) {
    const step = ctx.steps.get(id)!;
    if (step.settled) continue;
    const blocker = blockedBy(step);
    if (blocker) {
      refusals.set(id, { kind: "blocked", stepId: id, by: blocker });
      continue;
    }
    const ready = readyOf(step, placed, ctx);
    if (step.activeMinutes <= 0) {
      placed.set(id, { stepId: id, dayId: null, date: null, start: ready.at, end: ready.at, readyAfter: ready.at + step.waitMinutes * MIN });
      continue;
    }
    let windows: Window[];
    if (step.pinnedDayId) {
      const w = ctx.shoot.find((x) => x.dayId === step.pinnedDayId);
      if (!w) {
        refusals.set(id, { kind: "pinned_gone", stepId: id });
        continue;
      }
      windows = [w];
    } else windows = step.mustFilm ? ctx.shoot.filter((w) => w.people > 0) : mergeWindows(ctx.shoot.filter((w) => w.people > 0), ctx.off);
    let done = false;
    for (const w of windows) {
      if (w.end <= ready.at || w.people < Math.max(1, step.crewNeeded)) continue;
      if ((w.end - w.start) / MIN < step.activeMinutes) continue;
      const b = busy.get(w) ?? [...(w.taken ?? [])].sort((x, y) => x[0] - y[0]);
      const start = earliestGap(b, w, ready.at, step.activeMinutes);
      if (start == null) continue;
      const end = start + step.activeMinutes * MIN;
      insertBusy(b, start, end);
      busy.set(w, b);
      placed.set(id, { stepId: id, dayId: w.dayId, date: w.date, start, end, readyAfter: end + step.waitMinutes * MIN });
      done = true;
      break;
    }
    if (!done) refusals.set(id, refusalFor(step, windows, ready, ctx, busy));
  }
  return { placements: placed, refusals, score: scoreOf(placed, refusals, ctx) };
}

/** Shoot days and off-camera days in time order; on a date with a shoot day, off-camera work shares the shoot day's hours. */
function mergeWindows(shoot: Window[], off: Window[]): Window[] {
  const shootDates = new Set(shoot.map((w) => w.date));
  return [...shoot, ...off.filter((w) => !shootDates.has(w.date))].sort((a, b) => a.start - b.start);
}

function refusalFor(step: ScheduleStep, windows: Window[], ready: { at: number; by: string | null }, ctx: Ctx, busy: Map<Window, [number, number][]>): Refusal {
  const id = step.id;
  const need = Math.max(1, step.crewNeeded);
  if (step.pinnedDayId) {
    const w = windows[0]!;
    if (w.end <= ready.at || (w.end - Math.max(w.start, ready.at)) / MIN < step.activeMinutes) {
      if (ready.at > w.start) return { kind: "pinned_too_early", stepId: id, dayId: w.dayId!, readyAt: ready.at, waitedOn: ready.by };
    }
    if (w.people < need) return { kind: "crew", stepId: id, needed: need, most: w.people };
    if ((w.end - w.start) / MIN < step.activeMinutes) return { kind: "too_long", stepId: id, longestMinutes: Math.round((w.end - w.start) / MIN) };
    void busy;
    return { kind: "pinned_full", stepId: id, dayId: w.dayId! };
  }
  const pool = step.mustFilm ? ctx.shoot : mergeWindows(ctx.shoot, ctx.off);
  const staffed = pool.filter((w) => w.people >= need);
  if (!staffed.length) return { kind: "crew", stepId: id, needed: need, most: Math.max(0, ...pool.map((w) => w.people)) };
  const longest = Math.max(...staffed.map((w) => (w.end - w.start) / MIN));
  if (longest < step.activeMinutes) return { kind: "too_long", stepId: id, longestMinutes: Math.round(longest) };
  return { kind: "no_day_after", stepId: id, readyAt: ready.at, waitedOn: ready.by };
}

function scoreOf(placed: Map<string, Placement>, refusals: Map<string, Refusal>, ctx: Ctx): [number, number, number, number] {
  const all = [...placed.values()];
  const filmed = all.filter((p) => p.dayId !== null && ctx.steps.get(p.stepId)!.mustFilm);
  const finish = Math.max(0, ...(filmed.length ? filmed : all).map((p) => p.end));
  const days = new Set(all.map((p) => p.dayId).filter(Boolean)).size;
  const prev = ctx.input.previous;
  const moved = prev ? all.filter((p) => p.stepId in prev && prev[p.stepId] !== p.dayId).length : 0;
  return [refusals.size, finish, days, moved];
}

function better(a: Attempt["score"], b: Attempt["score"]): boolean {
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return a[i]! < b[i]!;
  return false;
}

/** Every order of the steps that respects the dependencies, plan order first. */
function* topologicalOrders(steps: ScheduleStep[]): Generator<string[]> {
  const ids = steps.map((s) => s.id);
  const known = new Set(ids);
  const preds = new Map(steps.map((s) => [s.id, s.dependsOn.filter((d) => known.has(d))]));
  const order: string[] = [];
  const used = new Set<string>();
  function* rec(): Generator<string[]> {
    if (order.length === ids.length) {
      yield [...order];
      return;
    }
    for (const id of ids) {
      if (used.has(id) || !preds.get(id)!.every((p) => used.has(p))) continue;
      used.add(id);
      order.push(id);
      yield* rec();
      order.pop();
      used.delete(id);
    }
  }
  yield* rec();
}

/** The longest chain (hands-on and waits) from the start of each step to the end of the plan. */
function tails(steps: ScheduleStep[]): Map<string, number> {
  const next = new Map<string, string[]>();
  for (const s of steps) for (const d of s.dependsOn) (next.get(d) ?? next.set(d, []).get(d)!).push(s.id);
  const byId = new Map(steps.map((s) => [s.id, s]));
  const memo = new Map<string, number>();
  const tail = (id: string, seen = new Set<string>()): number => {
    if (memo.has(id)) return memo.get(id)!;
    if (seen.has(id)) return 0;
    seen.add(id);
    const s = byId.get(id)!;
    const own = s.activeMinutes + s.waitMinutes;
    const v = own + Math.max(0, ...(next.get(id) ?? []).map((n) => tail(n, seen)));
    memo.set(id, v);
    return v;
  };
  return new Map(steps.map((s) => [s.id, tail(s.id)]));
}

/** One good order for large plans: the step that can start soonest, then the one with the longest chain after it, then plan order. */
function greedyOrder(ctx: Ctx, steps: ScheduleStep[]): string[] {
  const tail = tails(steps);
  const known = new Set(steps.map((s) => s.id));
  const left = new Set(steps.map((s) => s.id));
  const approxReady = new Map<string, number>();
  const order: string[] = [];
  while (left.size) {
    let best: ScheduleStep | null = null;
    let bestReady = Infinity;
    for (const id of left) {
      const s = ctx.steps.get(id)!;
      if (!s.dependsOn.every((d) => !known.has(d) || !left.has(d))) continue;
      const r = Math.max(0, ...s.dependsOn.map((d) => approxReady.get(d) ?? 0));
      if (!best || r < bestReady || (r === bestReady && (tail.get(id)! > tail.get(best.id)! || (tail.get(id) === tail.get(best.id) && s.position < best.position)))) {
        best = s;
        bestReady = r;
      }
    }
    if (!best) break; // a loop: the build plan refuses those, so this does not happen
    left.delete(best.id);
    order.push(best.id);
    approxReady.set(best.id, bestReady + best.activeMinutes + best.waitMinutes);
  }
  return order;
}

function explain(r: Refusal, ctx: Ctx): string {
  const title = (id: string) => `“${ctx.steps.get(id)?.title ?? "a step"}”`;
  const tz = ctx.input.timeZone;
  const s = ctx.steps.get(r.stepId)!;
  const after = (by: string | null) => {
    if (!by) return "";
    const b = ctx.steps.get(by)!;
    return b.waitMinutes > 0 ? ` (after ${title(by)} and its wait${b.waitReason ? `, ${b.waitReason}` : ""}, ${hours(b.waitMinutes)})` : ` (after ${title(by)})`;
  };
  const dayName = (id: string) => {
    const d = ctx.input.days.find((x) => x.id === id);
    return d ? formatDay(d.date) : "its shoot day";
  };
  switch (r.kind) {
    case "too_long":
      return `${title(r.stepId)} needs ${hours(s.activeMinutes)} of hands-on time in one go, but the longest ${s.mustFilm ? "shoot day" : "working day"} it could use is ${hours(r.longestMinutes)}. Lengthen a shoot day or split the step.`;
    case "crew":
      return `${title(r.stepId)} needs ${r.needed} ${r.needed === 1 ? "person" : "people"}, but no ${s.mustFilm ? "shoot day" : "day"} has more than ${r.most} on hand who are not away. Add crew or helpers to a day.`;
    case "pinned_gone":
      return `${title(r.stepId)} is pinned to a shoot day this episode cannot use (cancelled, removed, already shot or set aside for another episode). Pin it to another day or unpin it.`;
    case "pinned_too_early":
      return `${title(r.stepId)} is pinned to ${dayName(r.dayId)}, but it cannot start before ${formatWhen(r.readyAt, tz)}${after(r.waitedOn)}. Pin it to a later day or unpin it.`;
    case "pinned_full":
      return `${title(r.stepId)} is pinned to ${dayName(r.dayId)}, but that day has no ${hours(s.activeMinutes)} left once the other steps are in. Unpin it or lengthen the day.`;
    case "no_day_after":
      return `${title(r.stepId)} can start at ${formatWhen(r.readyAt, tz)} at the earliest${after(r.waitedOn)}, and no ${s.mustFilm ? "shoot day" : "day"} after that has ${hours(s.activeMinutes)} free with ${Math.max(1, s.crewNeeded)} ${s.crewNeeded > 1 ? "people" : "person"}.`;
    case "blocked":
      return `${title(r.stepId)} waits for ${title(r.by)}, which does not fit yet.`;
  }
}

/** Subsets of `items` of a given size, in order. */
function* subsets<T>(items: T[], size: number, from = 0, acc: T[] = []): Generator<T[]> {
  if (acc.length === size) {
    yield [...acc];
    return;
  }
  for (let i = from; i <= items.length - (size - acc.length); i++) {
    acc.push(items[i]!);
    yield* subsets(items, size, i + 1, acc);
    acc.pop();
  }
}

/** How many schedule runs the exact search may spend looking for fewer shoot days. */
const DAY_SEARCH_BUDGET = 150_000;

function best(ctx: Ctx, steps: ScheduleStep[]): { attempt: Attempt; method: Schedule["method"] } {
  const active = steps.filter((s) => !s.settled);
  if (active.length > EXACT_LIMIT) return { attempt: run(greedyOrder(ctx, active), ctx), method: "greedy" };
  const orders = [...topologicalOrders(active)];
  let top: Attempt | null = null;
  for (const order of orders) {
    const a = run(order, ctx);
    if (!top || better(a.score, top.score)) top = a;
  }
  if (!top) return { attempt: run([], ctx), method: "exact" };
  // Each step goes to its earliest room, which can spread work over more days than needed:
  // look for the same finish on fewer shoot days, smallest sets first.
  let budget = DAY_SEARCH_BUDGET;
  const used = top.score[2];
  for (let size = 1; size < used && budget > 0; size++) {
    let found: Attempt | null = null;
    for (const shoot of subsets(ctx.shoot, size)) {
      if (budget <= 0) break;
      const sub: Ctx = { ...ctx, shoot };
      for (const order of orders) {
        if (--budget <= 0) break;
        const a = run(order, sub);
        if (a.score[0] === top.score[0] && a.score[1] === top.score[1] && (!found || better(a.score, found.score))) found = a;
      }
    }
    if (found) return { attempt: found, method: "exact" };
  }
  return { attempt: top, method: "exact" };
}

function context(input: ScheduleInput): Ctx {
  const { shoot, off } = windowsFor(input);
  const notBefore = input.notBefore ?? (input.days.length ? Math.min(...input.days.map((d) => d.start)) : Date.now());
  return { input, steps: new Map(input.steps.map((s) => [s.id, s])), shoot, off, notBefore };
}

export function schedule(input: ScheduleInput, opts: { suggest?: boolean } = {}): Schedule {
  const ctx = context(input);
  const { attempt, method } = best(ctx, input.steps);
  const warnings: string[] = [];
  const awaySet = new Set(input.away.map((a) => `${a.userId}|${a.date}`));
  for (const d of input.days) {
    const awayCrew = d.crew.filter((u) => awaySet.has(`${u}|${d.date}`));
    const used = [...attempt.placements.values()].filter((p) => p.dayId === d.id);
    if (awayCrew.length && used.length) warnings.push(`${awayCrew.length} of the crew on ${formatDay(d.date)} ${awayCrew.length === 1 ? "is" : "are"} marked away that day; the plan counts without ${awayCrew.length === 1 ? "them" : "them all"}.`);
  }
  const unscheduled = [...attempt.refusals.values()].map((r) => ({ stepId: r.stepId, reason: explain(r, ctx), refusal: r }));
  const placements = [...attempt.placements.values()].sort((a, b) => a.start - b.start || ctx.steps.get(a.stepId)!.position - ctx.steps.get(b.stepId)!.position);
  const result: Schedule = {
    placements,
    unscheduled,
    warnings,
    finish: placements.length ? attempt.score[1] : null,
    shootDaysUsed: attempt.score[2],
    suggestion: null,
    method,
  };
  if (opts.suggest !== false && unscheduled.length) result.suggestion = suggestDay(input, result, ctx);
  return result;
}

/**
 * The earliest extra shoot day (same hours and crew as the last shoot day,
 * or the workshop's hours with every member) on which more steps would fit.
 */
function suggestDay(input: ScheduleInput, current: Schedule, ctx: Ctx): Schedule["suggestion"] {
  const first = current.unscheduled.find((u) => u.refusal.kind !== "blocked" && u.refusal.kind !== "pinned_gone") ?? null;
  if (!first) return null;
  const template = [...input.days].sort((a, b) => a.start - b.start).at(-1);
  const tz = input.timeZone;
  const hoursOf = template
    ? { startMinutes: zonedParts(template.start, tz).minutes, endMinutes: zonedParts(template.end, tz).minutes || 24 * 60 }
    : { startMinutes: 9 * 60, endMinutes: 17 * 60 };
  const ready = first.refusal.kind === "no_day_after" || first.refusal.kind === "pinned_too_early" ? first.refusal.readyAt : ctx.notBefore;
  const step = ctx.steps.get(first.stepId)!;
  if (step.activeMinutes > hoursOf.endMinutes - hoursOf.startMinutes) return null;
  let date = zonedParts(ready, tz).date;
  for (let i = 0; i < HORIZON_DAYS; i++, date = nextDate(date)) {
    if (input.days.some((d) => d.date === date)) continue;
    const extra: ScheduleDay = { id: `suggested:${date}`, date, start: zonedInstant(date, hoursOf.startMinutes, tz), end: zonedInstant(date, hoursOf.endMinutes, tz), crew: template?.crew ?? input.members, helpers: template?.helpers ?? 0 };
    if (extra.end <= ready) continue;
    const trial = schedule({ ...input, days: [...input.days, extra] }, { suggest: false });
    if (trial.unscheduled.length < current.unscheduled.length) {
      return {
        date,
        start: extra.start,
        end: extra.end,
        text: `Add a shoot day on ${formatDay(date)} (${formatWhen(extra.start, tz).slice(-5)}–${formatWhen(extra.end, tz).slice(-5)}) and ${trial.unscheduled.length === 0 ? "everything fits" : `${current.unscheduled.length - trial.unscheduled.length} more step${current.unscheduled.length - trial.unscheduled.length === 1 ? "" : "s"} fit`}.`,
      };
    }
  }
  return null;
}

/** What moved between two plans: steps whose day or start changed, and steps that no longer fit. */
export function changes(before: { stepId: string; dayId: string | null; start: number }[], after: Schedule): { stepId: string; from: { dayId: string | null; start: number } | null; to: { dayId: string | null; start: number } | null }[] {
  const old = new Map(before.map((b) => [b.stepId, b]));
  const out: ReturnType<typeof changes> = [];
  const seen = new Set<string>();
  for (const p of after.placements) {
    seen.add(p.stepId);
    const o = old.get(p.stepId);
    if (!o) out.push({ stepId: p.stepId, from: null, to: { dayId: p.dayId, start: p.start } });
    else if (o.dayId !== p.dayId || o.start !== p.start) out.push({ stepId: p.stepId, from: { dayId: o.dayId, start: o.start }, to: { dayId: p.dayId, start: p.start } });
  }
  for (const o of before) if (!seen.has(o.stepId)) out.push({ stepId: o.stepId, from: { dayId: o.dayId, start: o.start }, to: null });
  return out;
}

/** Today's date in a zone. */
export function todayIn(timeZone: string, now: number = Date.now()): string {
  return zonedParts(now, timeZone).date;
}
