import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { formatInches, parseMeasure } from "@/lib/fraction";

describe("measurement input", () => {
  it.each([
    ["3/4", 0.75],
    ["1-1/2", 1.5],
    ["1 1/2", 1.5],
    ["5 - 3/8", 5.375],
    ["12", 12],
    ["12.5", 12.5],
    [".75", 0.75],
    ["0", 0],
  ])("%s is %d", (text, value) => {
    expect(parseMeasure(text)).toEqual({ ok: true, value });
  });

  it.each(["", "abc", "3/0", "1-3/2", "-2", "1/2/3", "1,5"])("%j is refused with a reason", (text) => {
    const r = parseMeasure(text);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.message.length).toBeGreaterThan(5);
  });

  it("formats sixteenths the way a tape reads and parses back (fast-check)", () => {
    expect(formatInches(1.5)).toBe("1-1/2");
    expect(formatInches(0.75)).toBe("3/4");
    expect(formatInches(12)).toBe("12");
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 16 * 200 }), (n) => {
        const r = parseMeasure(formatInches(n / 16));
        expect(r).toEqual({ ok: true, value: n / 16 });
      }),
    );
  });
});
