import { describe, expect, it } from "vitest";
import config from "../../tailwind.config";

/** Contrast ratio as WCAG 2.2 defines it (relative luminance of sRGB, (L1 + 0.05) / (L2 + 0.05)). */
function luminance(hex: string) {
  const [r, g, b] = [1, 3, 5].map((i) => parseInt(hex.slice(i, i + 2), 16) / 255).map((c) => (c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4));
  return 0.2126 * r! + 0.7152 * g! + 0.0722 * b!;
}
function ratio(a: string, b: string) {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (hi! + 0.05) / (lo! + 0.05);
}

const c = config.theme.extend.colors;

describe("colour tokens meet WCAG 2.2 AA", () => {
  it("computes the ratio as WCAG defines it", () => {
    // Black on white is the maximum, 21:1 (WCAG 2.2, definition of contrast ratio).
    expect(ratio("#000000", "#ffffff")).toBeCloseTo(21, 5);
    // #767676 on white, the lightest grey usually quoted as passing 4.5:1 (common practice; from memory: 4.54:1).
    expect(ratio("#767676", "#ffffff")).toBeCloseTo(4.54, 2);
  });

  it("text: 4.5:1 on the page and on white (1.4.3)", () => {
    for (const text of [c.walnut[900], c.walnut[800], c.walnut[700], c.walnut[600]]) {
      expect(ratio(text, c.timber[50])).toBeGreaterThanOrEqual(4.5);
      expect(ratio(text, "#ffffff")).toBeGreaterThanOrEqual(4.5);
    }
    expect(ratio("#ffffff", c.chalk[600])).toBeGreaterThanOrEqual(4.5); // primary button
    expect(ratio(c.timber[100], c.walnut[900])).toBeGreaterThanOrEqual(4.5); // header links
    // Refusals, passes and merge prompts, as the notices pair them.
    expect(ratio(c.fault[700], "#ffffff")).toBeGreaterThanOrEqual(4.5);
    expect(ratio(c.fault[900], c.fault[100])).toBeGreaterThanOrEqual(4.5);
    expect(ratio(c.pass[900], c.pass[100])).toBeGreaterThanOrEqual(4.5);
    expect(ratio(c.pass[700], "#ffffff")).toBeGreaterThanOrEqual(4.5);
    expect(ratio(c.heed[800], c.heed[50])).toBeGreaterThanOrEqual(4.5);
  });

  it("focus rings: 3:1 against what they sit on (1.4.11, 2.4.7)", () => {
    expect(ratio(c.chalk[600], c.timber[50])).toBeGreaterThanOrEqual(3);
    expect(ratio(c.chalk[600], "#ffffff")).toBeGreaterThanOrEqual(3);
    // On the dark header the blue ring would fail, which is why the header uses pale timber.
    expect(ratio(c.chalk[600], c.walnut[900])).toBeLessThan(3);
    expect(ratio(c.timber[200], c.walnut[900])).toBeGreaterThanOrEqual(3);
  });
});
