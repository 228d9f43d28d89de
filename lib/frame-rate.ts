/**
 * Frame rates Jigboard supports, as exact rationals (ISO/IEC 13818-2
 * frame_rate_code table: 24000/1001, 30000/1001, 60000/1001; the rest exact).
 * Drop-frame labelling exists only at 29.97 and 59.94 (SMPTE ST 12-1).
 */
export const FRAME_RATES = {
  "23.976": { num: 24000, den: 1001, dropFrameAllowed: false },
  "24": { num: 24, den: 1, dropFrameAllowed: false },
  "25": { num: 25, den: 1, dropFrameAllowed: false },
  "29.97": { num: 30000, den: 1001, dropFrameAllowed: true },
  "30": { num: 30, den: 1, dropFrameAllowed: false },
  "50": { num: 50, den: 1, dropFrameAllowed: false },
  "59.94": { num: 60000, den: 1001, dropFrameAllowed: true },
  "60": { num: 60, den: 1, dropFrameAllowed: false },
} as const;

export type FrameRateId = keyof typeof FRAME_RATES;
export const FRAME_RATE_IDS = Object.keys(FRAME_RATES) as FrameRateId[];

export function allowsDropFrame(rate: FrameRateId): boolean {
  return FRAME_RATES[rate].dropFrameAllowed;
}
