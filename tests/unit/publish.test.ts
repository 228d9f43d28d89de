/**
 * The publish package, pure: the description's limits, its composition, the
 * "Ad" label rule and the checklist. Each limit names its published source.
 */
import { describe, expect, it } from "vitest";
import {
  DESCRIPTION_MAX_BYTES,
  TITLE_MAX_CHARS,
  THUMBNAIL_MAX_BYTES,
  charCount,
  checkTexts,
  composeDescription,
  disclosureLines,
  materialLines,
  needsUpFrontLabel,
  publishChecklist,
  safetyLine,
  titleCarriesAdLabel,
  utf8Bytes,
  type ChecklistInput,
  type DescriptionParts,
} from "@/lib/publish";

describe("limits", () => {
  it("are the platform's published figures", () => {
    // developers.google.com/youtube/v3/docs/videos: snippet.title "maximum length of 100 characters";
    // snippet.description "maximum length of 5000 bytes"; both exclude "<" and ">".
    expect(TITLE_MAX_CHARS).toBe(100);
    expect(DESCRIPTION_MAX_BYTES).toBe(5000);
    // developers.google.com/youtube/v3/docs/thumbnails/set: "Maximum file size: 2MB".
    expect(THUMBNAIL_MAX_BYTES).toBe(2 * 1024 * 1024);
  });

  it("counts the description in UTF-8 bytes and the title in characters", () => {
    // RFC 3629: U+00E9 is 2 bytes, U+20AC is 3 bytes, U+1F528 (hammer) is 4 bytes.
    expect(utf8Bytes("é")).toBe(2);
    expect(utf8Bytes("€")).toBe(3);
    expect(utf8Bytes("🔨")).toBe(4);
    expect(charCount("🔨é")).toBe(2);
    // 2,500 two-byte characters are exactly 5,000 bytes: at the limit, allowed; one more byte is over.
    expect(checkTexts("Title", "é".repeat(2500)).problems).toEqual([]);
    expect(checkTexts("Title", "é".repeat(2500) + "a").problems[0]).toEqual({ field: "description", message: "the description is 5001 bytes; the limit is 5000" });
  });

  it("a 100-character title passes, 101 fails; angle brackets and an empty title fail", () => {
    expect(checkTexts("x".repeat(100), "").problems).toEqual([]);
    expect(checkTexts("x".repeat(101), "").problems.map((p) => p.message)).toEqual(["the title has 101 characters; the limit is 100"]);
    expect(checkTexts("Build <fast>", "").problems.map((p) => p.field)).toEqual(["title"]);
    expect(checkTexts("  ", "a > b").problems.map((p) => p.field)).toEqual(["title", "description"]);
  });
});

describe("the Ad label up front", () => {
  it("is needed for paid and affiliate deals, not for gifts and loans", () => {
    // ASA/CAP influencers' guide (3rd ed., 2023): ads, including affiliate marketing, are labelled "Ad" up front.
    expect(needsUpFrontLabel(["paid_integration"])).toBe(true);
    expect(needsUpFrontLabel(["gifted_tool", "affiliate"])).toBe(true);
    expect(needsUpFrontLabel(["gifted_tool", "loaned_tool"])).toBe(false);
  });

  it("is found as a word of the title, not inside another word", () => {
    // ASA/CAP: "Ad", "Advert", "Advertisement" are clear; vague labels ("spon", "collab") are not.
    expect(titleCarriesAdLabel("Ad | A walnut hall table")).toBe(true);
    expect(titleCarriesAdLabel("Walnut hall table (ad)")).toBe(true);
    expect(titleCarriesAdLabel("ADVERTISEMENT: sanding jig")).toBe(true);
    expect(titleCarriesAdLabel("Adding a shelf to a bad cabinet")).toBe(false);
    expect(titleCarriesAdLabel("spon: sanding jig")).toBe(false);
  });
});

describe("composition", () => {
  const parts: DescriptionParts = {
    disclosures: ["Ad: this video is sponsored by Kestrel Abrasives."],
    summary: "A hall table from one walnut board.",
    chapters: "0:00 Intro\n0:40 Milling",
    credits: ["parallel clamps from Brindle: loaned to us"],
    materials: ["Walnut: 12.4 board feet"],
    safety: "Work safely.",
    closing: "Plans: example.org/plans",
    sections: { chapters: true, credits: true, materials: true, safety: true },
  };

  it("puts the disclosure first, then summary, chapters, tools, materials, safety and the closing text", () => {
    // 16 CFR 255.0(f): a disclosure must be difficult to miss, so it leads the description.
    expect(composeDescription(parts)).toBe(
      "Ad: this video is sponsored by Kestrel Abrasives.\n\nA hall table from one walnut board.\n\nChapters\n0:00 Intro\n0:40 Milling\n\nTools in this build\nparallel clamps from Brindle: loaned to us\n\nMaterials\nWalnut: 12.4 board feet\n\nWork safely.\n\nPlans: example.org/plans",
    );
  });

  it("leaves out switched-off and empty sections, but never the disclosure", () => {
    const text = composeDescription({ ...parts, summary: " ", closing: "", sections: { chapters: false, credits: false, materials: false, safety: false } });
    expect(text).toBe("Ad: this video is sponsored by Kestrel Abrasives.");
  });

  it("says each kind of deal in the guides' words, with the deal's links", () => {
    // FTC "Disclosures 101": "Ad"/"Sponsored"; "Thanks to [brand] for the free product". CMA "Hidden ads" (2022): loans too.
    expect(
      disclosureLines([
        { kind: "paid_integration", sponsorName: "Kestrel Abrasives", toolNames: [], urls: ["https://kestrel.example/jig"] },
        { kind: "gifted_tool", sponsorName: "Harrow Power Tools", toolNames: ["random orbit sander"], urls: [] },
        { kind: "loaned_tool", sponsorName: "Brindle", toolNames: ["parallel clamps", "bar clamps"], urls: [] },
      ]),
    ).toEqual([
      "Ad: this video is sponsored by Kestrel Abrasives.\nKestrel Abrasives: https://kestrel.example/jig",
      "Thanks to Harrow Power Tools for the free random orbit sander.",
      "Brindle loaned us the parallel clamps and bar clamps for this build; we are giving them back.",
    ]);
  });

  it("lists materials by board feet and whole sheets", () => {
    expect(materialLines([{ material: "Walnut", boardFeet: 12.36, sheetsToBuy: 0 }, { material: "Birch ply", boardFeet: 0, sheetsToBuy: 2 }])).toEqual(["Walnut: 12.4 board feet", "Birch ply: 2 sheets"]);
  });

  it("adds the usual caution only when the build has hazards, deferring to the manufacturer", () => {
    expect(safetyLine([], "Follow the manual.")).toBeNull();
    expect(safetyLine(["Power tools", "Finishes and solvents"], "Follow the manual.")).toBe("Work safely. This build uses power tools and finishes and solvents: wear the protection each needs. Follow the manual.");
  });
});

describe("checklist", () => {
  const passing: ChecklistInput = {
    script: { segments: 12, markedFinal: true, changedSince: false },
    shots: { total: 20, open: 0 },
    openGaps: 0,
    sponsorChecks: [{ pass: true, label: "spoken disclosure", sponsorName: "Kestrel Abrasives" }],
    approvals: [{ dealTitle: "Sanding jig read", sponsorName: "Kestrel Abrasives", state: "approved" }],
    texts: checkTexts("Ad | Sanding jig", "Ad: sponsored."),
    chaptersValid: true,
    chapterProblems: [],
    thumbnail: true,
    adLabel: { needed: true, inTitle: true, onThumbnail: false },
  };

  it("passes when every item passes", () => {
    const c = publishChecklist(passing);
    expect(c.pass).toBe(true);
    expect(c.items.map((i) => i.key)).toEqual(["script_final", "shots_done", "gaps_closed", "sponsor_checks", "sponsor_approvals", "description_valid", "title_thumbnail"]);
  });

  it.each([
    ["script_final", { script: { segments: 12, markedFinal: true, changedSince: true } }, /edited after it was marked final/],
    ["script_final", { script: { segments: 0, markedFinal: false, changedSince: false } }, /no segments/],
    ["shots_done", { shots: { total: 20, open: 3 } }, /3 shots still planned/],
    ["gaps_closed", { openGaps: 1 }, /1 open gap$/],
    ["sponsor_checks", { sponsorChecks: [{ pass: false, label: "spoken disclosure", sponsorName: "Kestrel Abrasives" }] }, /Kestrel Abrasives: spoken disclosure/],
    ["sponsor_approvals", { approvals: [{ dealTitle: "Read", sponsorName: "Kestrel Abrasives", state: "changes_requested" }] }, /changes requested/],
    ["description_valid", { chaptersValid: false, chapterProblems: ["the first chapter must start at 0:00"] }, /0:00/],
    ["title_thumbnail", { thumbnail: false }, /no thumbnail/],
    ["title_thumbnail", { adLabel: { needed: true, inTitle: false, onThumbnail: false } }, /"Ad" in the title or on the thumbnail/],
  ] as const)("fails %s alone, saying why", (key, change, why) => {
    const c = publishChecklist({ ...passing, ...change } as ChecklistInput);
    expect(c.pass).toBe(false);
    expect(c.failing).toEqual([key]);
    expect(c.items.find((i) => i.key === key)!.detail).toMatch(why);
  });

  it("links each item to the tab where it is fixed", () => {
    const tabs = Object.fromEntries(publishChecklist(passing).items.map((i) => [i.key, i.tab]));
    expect(tabs).toMatchObject({ script_final: "script", shots_done: "shots", gaps_closed: "coverage", sponsor_checks: "sponsors", description_valid: "publish" });
  });

  it("an Ad label on the thumbnail counts as up front", () => {
    expect(publishChecklist({ ...passing, texts: checkTexts("Sanding jig", ""), adLabel: { needed: true, inTitle: false, onThumbnail: true } }).pass).toBe(true);
  });
});
