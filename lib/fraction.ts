/**
 * Measurement input as woodworkers write it: decimals ("12.5", ".75"),
 * fractions ("3/4") and mixed numbers ("1-1/2" or "1 1/2").
 */
export type ParseResult = { ok: true; value: number } | { ok: false; message: string };

const MESSAGE = "use a number, a fraction like 3/4 or a mixed number like 1-1/2";

export function parseMeasure(input: string): ParseResult {
  const s = input.trim();
  if (!s) return { ok: false, message: "enter a size" };
  let m = /^(\d+(?:\.\d*)?|\.\d+)$/.exec(s);
  if (m) return { ok: true, value: Number(m[1]) };
  m = /^(\d+)\/(\d+)$/.exec(s);
  if (m) return fraction(0, Number(m[1]), Number(m[2]));
  m = /^(\d+)(?:\s+|\s*-\s*)(\d+)\/(\d+)$/.exec(s);
  if (m) return fraction(Number(m[1]), Number(m[2]), Number(m[3]));
  return { ok: false, message: MESSAGE };
}

function fraction(whole: number, num: number, den: number): ParseResult {
  if (den === 0) return { ok: false, message: "a fraction cannot have 0 below the line" };
  if (whole > 0 && num >= den) return { ok: false, message: "in a mixed number the fraction must be less than 1, e.g. 1-1/2" };
  return { ok: true, value: whole + num / den };
}

/** Nearest sixteenth, written the way it is read off a tape: 1-1/2, 3/4, 12. */
export function formatInches(value: number): string {
  const sixteenths = Math.round(value * 16);
  const whole = Math.floor(sixteenths / 16);
  let num = sixteenths % 16;
  let den = 16;
  while (num && num % 2 === 0) {
    num /= 2;
    den /= 2;
  }
  if (!num) return String(whole);
  return whole ? `${whole}-${num}/${den}` : `${num}/${den}`;
}
