/**
 * How many words a line takes to say aloud. Numbers, fractions, units and
 * symbols are counted as they are spoken where that is simple: "1/2" is "one
 * half" (2), "3mm" is "three millimetres" (2), "2x4" is "two by four" (3),
 * "15%" is "fifteen percent" (2). Hyphenated compounds count as one word, as
 * in ordinary word counts ("twenty-one").
 */

/** Words in the English cardinal of a whole number ("three hundred twelve" = 3). */
export function cardinalWords(n: number): number {
  if (!Number.isFinite(n) || n < 0) return 1;
  n = Math.floor(n);
  if (n <= 99) return 1; // zero … ninety-nine
  const scales: [number, number][] = [
    [1e12, 1],
    [1e9, 1],
    [1e6, 1],
    [1e3, 1],
  ];
  for (const [size] of scales) {
    if (n >= size) {
      const head = Math.floor(n / size);
      const rest = n % size;
      return cardinalWords(head) + 1 + (rest ? cardinalWords(rest) : 0);
    }
  }
  // 100 … 999: "three hundred" + rest
  const rest = n % 100;
  return 2 + (rest ? 1 : 0);
}

const UNITS: Record<string, number> = {
  mm: 1, cm: 1, m: 1, km: 1, in: 1, ft: 1, yd: 1, lb: 1, lbs: 1, oz: 1, kg: 1, g: 1,
  s: 1, sec: 1, min: 1, h: 1, hr: 1, hrs: 1, "°": 1, "°c": 2, "°f": 2, v: 1, a: 1, w: 1, hp: 2, rpm: 3, tpi: 3, "%": 1, '"': 1, "'": 1,
};

/** Spoken words of one whitespace-separated token. */
export function tokenWords(raw: string): number {
  const token = raw.replace(/^[("“‘[]+|[)"”’\],.;:!?]+$/g, "");
  if (!token) return 0;
  if (/^[&+=]$/.test(token)) return 1; // and, plus, equals
  if (!/[\p{L}\p{N}]/u.test(token)) return 0;
  let m: RegExpExecArray | null;
  // 1-1/2 → "one and a half"-like: whole + "and" + fraction
  if ((m = /^(\d+)[- ](\d+)\/(\d+)(.*)$/.exec(token))) return cardinalWords(Number(m[1])) + 1 + fractionWords(Number(m[2]), Number(m[3])) + unitWords(m[4]!);
  if ((m = /^(\d+)\/(\d+)(.*)$/.exec(token))) return fractionWords(Number(m[1]), Number(m[2])) + unitWords(m[3]!);
  // 2x4 → "two by four"
  if ((m = /^(\d+(?:\.\d+)?)[x×](\d+(?:\.\d+)?)(.*)$/i.exec(token))) return numberWords(m[1]!) + 1 + numberWords(m[2]!) + unitWords(m[3]!);
  // 1,200 / 2.5 / 3mm / 15%
  if ((m = /^(\d[\d,]*(?:\.\d+)?)(.*)$/.exec(token))) return numberWords(m[1]!) + unitWords(m[2]!);
  return 1;
}

function numberWords(s: string): number {
  const [whole, decimals] = s.replace(/,/g, "").split(".");
  return cardinalWords(Number(whole)) + (decimals ? 1 + decimals.length : 0); // "two point five"
}

function fractionWords(num: number, den: number): number {
  // "one half", "three quarters", "five sixteenths"
  return cardinalWords(num) + 1 + (den > 99 ? 1 : 0);
}

function unitWords(rest: string): number {
  const r = rest.toLowerCase().replace(/^[-.]/, "");
  if (!r) return 0;
  if (r in UNITS) return UNITS[r]!;
  return 1;
}

/** Pause markers of Jigboard's own design: {2s}, {1.5s}, {500ms}. */
export const PAUSE_PATTERN = /\{\s*(\d+(?:\.\d+)?)\s*(s|ms)\s*\}/gi;

export function pausesMs(text: string): number {
  let total = 0;
  for (const m of text.matchAll(PAUSE_PATTERN)) total += m[2]!.toLowerCase() === "ms" ? Number(m[1]) : Number(m[1]) * 1000;
  return Math.round(total);
}

export function spokenWordCount(text: string): number {
  return text
    .replace(PAUSE_PATTERN, " ")
    .split(/\s+/)
    .filter(Boolean)
    .reduce((n, t) => n + tokenWords(t), 0);
}

/** Characters a viewer reads on screen (pause markers excluded, spaces collapsed). */
export function readableChars(text: string): number {
  return text.replace(PAUSE_PATTERN, " ").replace(/\s+/g, " ").trim().length;
}
