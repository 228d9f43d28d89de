/**
 * SMPTE timecode (ST 12-1) in integer frames at exact rational rates.
 *
 * Drop-frame labelling (29.97 and 59.94 only) skips the frame labels 00-01
 * (00-03 at 59.94) at the start of every minute except minutes 00, 10, 20,
 * 30, 40 and 50. No picture is dropped, only labels; the separator before the
 * frames is ";". All arithmetic is on integers: no floating drift, however
 * long the programme.
 */
import { FRAME_RATES, type FrameRateId } from "./frame-rate";

export interface Rate {
  num: number;
  den: number;
  dropFrame: boolean;
}

export function rateOf(id: FrameRateId, dropFrame = false): Rate {
  const r = FRAME_RATES[id];
  if (dropFrame && !r.dropFrameAllowed) throw new Error(`drop-frame does not exist at ${id} fps`);
  return { num: r.num, den: r.den, dropFrame };
}

/** Frames per labelled second: 24, 25, 30, 50 or 60. */
export function nominalFps(rate: Rate): number {
  return Math.round(rate.num / rate.den);
}

function dropPerMinute(rate: Rate): number {
  return rate.dropFrame ? (nominalFps(rate) === 30 ? 2 : 4) : 0;
}

export interface Label {
  hours: number;
  minutes: number;
  seconds: number;
  frames: number;
}

export function framesToLabel(frameCount: number, rate: Rate): Label {
  if (!Number.isInteger(frameCount) || frameCount < 0) throw new Error("frame count must be a whole number, 0 or more");
  const fps = nominalFps(rate);
  let n = frameCount;
  const d = dropPerMinute(rate);
  if (d) {
    const per10 = fps * 600 - d * 9;
    const perMin = fps * 60 - d;
    const tens = Math.floor(n / per10);
    const rem = n % per10;
    n += d * 9 * tens + (rem > d ? d * Math.floor((rem - d) / perMin) : 0);
  }
  return {
    hours: Math.floor(n / (fps * 3600)),
    minutes: Math.floor(n / (fps * 60)) % 60,
    seconds: Math.floor(n / fps) % 60,
    frames: n % fps,
  };
}

export function labelToFrames(l: Label, rate: Rate): number {
  const fps = nominalFps(rate);
  const d = dropPerMinute(rate);
  const totalMinutes = l.hours * 60 + l.minutes;
  return (l.hours * 3600 + l.minutes * 60 + l.seconds) * fps + l.frames - d * (totalMinutes - Math.floor(totalMinutes / 10));
}

const p2 = (n: number) => String(n).padStart(2, "0");

/** HH:MM:SS:FF, or HH:MM:SS;FF when drop-frame. */
export function formatTimecode(frameCount: number, rate: Rate): string {
  const l = framesToLabel(frameCount, rate);
  return `${p2(l.hours)}:${p2(l.minutes)}:${p2(l.seconds)}${rate.dropFrame ? ";" : ":"}${p2(l.frames)}`;
}

export type ParsedTimecode = { ok: true; frames: number } | { ok: false; message: string };

/**
 * Reads HH:MM:SS:FF, HH:MM:SS;FF (also "." before frames) and the short forms
 * M:SS and H:MM:SS (frame 00). Labels that drop-frame skips are refused.
 */
export function parseTimecode(input: string, rate: Rate): ParsedTimecode {
  const s = input.trim();
  const fps = nominalFps(rate);
  let m = /^(\d{1,2}):(\d{2}):(\d{2})([:;.])(\d{2})$/.exec(s);
  let l: Label;
  if (m) {
    if (m[4] === ";" && !rate.dropFrame) return { ok: false, message: "“;” marks drop-frame timecode, which this episode does not use; write HH:MM:SS:FF" };
    l = { hours: Number(m[1]), minutes: Number(m[2]), seconds: Number(m[3]), frames: Number(m[5]) };
  } else if ((m = /^(\d{1,2}):(\d{2}):(\d{2})$/.exec(s))) {
    l = { hours: Number(m[1]), minutes: Number(m[2]), seconds: Number(m[3]), frames: 0 };
  } else if ((m = /^(\d{1,3}):(\d{2})$/.exec(s))) {
    const minutes = Number(m[1]);
    l = { hours: Math.floor(minutes / 60), minutes: minutes % 60, seconds: Number(m[2]), frames: 0 };
  } else {
    return { ok: false, message: "write a timecode as HH:MM:SS:FF (or ;FF for drop-frame), or the short forms M:SS and H:MM:SS" };
  }
  if (l.hours > 23) return { ok: false, message: "hours run from 00 to 23" };
  if (l.minutes > 59) return { ok: false, message: "minutes run from 00 to 59" };
  if (l.seconds > 59) return { ok: false, message: "seconds run from 00 to 59" };
  if (l.frames >= fps) return { ok: false, message: `frames run from 00 to ${p2(fps - 1)} at this rate` };
  const d = dropPerMinute(rate);
  if (d && l.seconds === 0 && l.frames < d && l.minutes % 10 !== 0) {
    const first = p2(d);
    return { ok: false, message: `${p2(l.hours)}:${p2(l.minutes)}:00;${p2(l.frames)} does not exist in drop-frame timecode: minute ${l.minutes} starts at ;${first}` };
  }
  return { ok: true, frames: labelToFrames(l, rate) };
}

/** Wall-clock seconds (exact rational, as a float for display) of a frame count. */
export function framesToSeconds(frames: number, rate: Rate): number {
  return (frames * rate.den) / rate.num;
}

/** Nearest whole frame to a duration in milliseconds, in integers. */
export function msToFrames(ms: number, rate: Rate): number {
  // frames = ms × num / (1000 × den), rounded half up.
  const numer = Math.round(ms) * rate.num;
  const denom = 1000 * rate.den;
  return Math.floor((2 * numer + denom) / (2 * denom));
}

/** Whole seconds elapsed at a frame (floor), for chapter stamps. */
export function framesToWholeSeconds(frames: number, rate: Rate): number {
  return Math.floor((frames * rate.den) / rate.num);
}

/** 0:00, 4:05, 1:02:03: the short clock form used in video descriptions. */
export function formatClock(totalSeconds: number): string {
  const h = Math.floor(totalSeconds / 3600);
  const m = Math.floor((totalSeconds % 3600) / 60);
  const s = totalSeconds % 60;
  return h ? `${h}:${p2(m)}:${p2(s)}` : `${m}:${p2(s)}`;
}

/** A duration for summaries: 0:06.4, 12:30.0, 1:02:03.5 (wall-clock, tenths). */
export function formatDuration(frames: number, rate: Rate): string {
  const tenths = Math.round((frames * rate.den * 10) / rate.num);
  const totalSeconds = Math.floor(tenths / 10);
  return `${formatClock(totalSeconds)}.${tenths % 10}`;
}

/**
 * Ruler ticks at whole labelled seconds (00:10, 00:20, 01:00…), at most
 * about `maxTicks` of them. The text is the label itself, never a rounded
 * frame count: at drop-frame a minute's ;00 and ;01 labels do not exist, so
 * that tick sits on the first label the minute has (;02 or ;04), still
 * reading 01:00 rather than the 00:59 the frame before it would show.
 */
export function rulerTicks(totalFrames: number, rate: Rate, maxTicks = 12): { frame: number; label: string }[] {
  const seconds = framesToSeconds(Math.max(0, totalFrames), rate);
  const step = [1, 2, 5, 10, 15, 30, 60, 120, 300, 600, 900, 1800, 3600].find((s) => seconds / s <= maxTicks) ?? 7200;
  const d = dropPerMinute(rate);
  const out: { frame: number; label: string }[] = [];
  for (let t = 0; ; t += step) {
    const hours = Math.floor(t / 3600);
    const minutes = Math.floor(t / 60) % 60;
    const secs = t % 60;
    const skipped = d && secs === 0 && minutes % 10 !== 0;
    const frame = labelToFrames({ hours, minutes, seconds: secs, frames: skipped ? d : 0 }, rate);
    if (frame > totalFrames) break;
    out.push({ frame, label: hours ? `${hours}:${p2(minutes)}:${p2(secs)}` : `${p2(minutes)}:${p2(secs)}` });
  }
  return out;
}

/**
 * A frame count stored at one rate, expressed at another: the same instant
 * in time, rounded to the nearest frame (halves away from zero), in exact
 * integer arithmetic: frames × (num₂/den₂) ÷ (num₁/den₁). Frames stored at a
 * rate mean that rate, so this runs wherever the rate changes.
 */
export function convertFrames(frames: number, from: Pick<Rate, "num" | "den">, to: Pick<Rate, "num" | "den">): number {
  if (from.num === to.num && from.den === to.den) return frames;
  const numer = BigInt(frames) * BigInt(to.num) * BigInt(from.den);
  const denom = BigInt(to.den) * BigInt(from.num);
  const sign = numer < 0n ? -1n : 1n;
  const abs = numer * sign;
  return Number(sign * ((2n * abs + denom) / (2n * denom)));
}
