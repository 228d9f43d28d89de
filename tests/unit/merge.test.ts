import { describe, expect, it } from "vitest";
import fc from "fast-check";
import { proposeMerge } from "@/components/script/merge";

describe("three-way merge of a segment's text", () => {
  it("keeps both writers' changes to different words (worked by hand)", () => {
    const base = "The glue cures overnight.\nThen we flatten the top.";
    const mine = "The PVA glue cures overnight.\nThen we flatten the top.";
    const theirs = "The glue cures overnight at 20 C.\nThen we flatten the top.";
    expect(proposeMerge(base, mine, theirs)).toEqual({ text: "The PVA glue cures overnight at 20 C.\nThen we flatten the top.", conflicts: 0 });
  });

  it("keeps both versions of words both changed, theirs first", () => {
    const r = proposeMerge("Clamp for an hour.", "Clamp for two hours.", "Clamp for 90 minutes.");
    expect(r.conflicts).toBe(1);
    expect(r.text).toContain("90 minutes.");
    expect(r.text).toContain("two hours.");
    expect(r.text.indexOf("90")).toBeLessThan(r.text.indexOf("two"));
  });

  it("takes the only side that changed, and loses no word of either (fast-check)", () => {
    const text = fc.array(fc.constantFrom("oak", "ash", "glue", "clamp", "\n", "cure"), { maxLength: 12 }).map((w) => w.join(" "));
    fc.assert(
      fc.property(text, text, (base, other) => {
        expect(proposeMerge(base, base, other).text).toBe(other);
        expect(proposeMerge(base, other, base).text).toBe(other);
      }),
      { numRuns: 300 },
    );
    fc.assert(
      fc.property(text, text, text, (base, mine, theirs) => {
        const merged = proposeMerge(base, mine, theirs).text.split(/\s+/).filter(Boolean);
        // Every word either writer added (not in the base) is still there.
        const added = (s: string) => s.split(/\s+/).filter((w) => w && !base.split(/\s+/).includes(w));
        for (const w of [...added(mine), ...added(theirs)]) expect(merged).toContain(w);
      }),
      { numRuns: 300 },
    );
  });
});
