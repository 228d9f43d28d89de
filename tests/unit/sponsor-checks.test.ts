/**
 * Sponsor checks on crafted scripts: each deliverable passing and failing,
 * with the rule's source named beside it. At 25 fps a frame is 40 ms, so
 * 25 frames are one second.
 */
import { describe, expect, it } from "vitest";
import { disclosureIn, runChecks, type CheckDeliverable, type CheckInput, type CheckSegment } from "@/lib/sponsor-checks";
import { rateOf } from "@/lib/timecode";

const rate = rateOf("25");
const s = (sec: number) => sec * 25;
const seg = (id: string, kind: CheckSegment["kind"], fromSec: number, toSec: number, text: string, stepId: string | null = null): CheckSegment => ({ id, kind, text, stepId, start: s(fromSec), end: s(toSec) });
const deal = { id: "deal", sponsorId: "sp", sponsorName: "Brindle Clamp Company", kind: "loaned_tool" as const, toolIds: ["clamps"] };

function input(segments: CheckSegment[], deliverables: Omit<CheckDeliverable, "dealId">[], more: Partial<CheckInput> = {}): CheckInput {
  return {
    rate,
    segments,
    steps: [{ id: "glue", title: "Glue up", toolIds: ["clamps"] }],
    tools: [{ id: "clamps", name: "parallel clamps", acquisition: "loaned", sponsorId: "sp", sponsorName: "Brindle Clamp Company" }],
    broll: [],
    description: "",
    deals: [deal],
    deliverables: deliverables.map((d) => ({ ...d, dealId: "deal" })),
    ...more,
  };
}
const result = (r: ReturnType<typeof runChecks>, id: string) => r.results.find((x) => x.deliverableId === id)!;

const goodScript = [
  seg("open", "on_screen_text", 0, 4, "Ad · clamps lent by Brindle Clamp Company"),
  seg("intro", "to_camera", 0, 20, "Today a hall bench."),
  seg("read", "sponsor_read", 60, 95, "This video is sponsored: Brindle Clamp Company lent us these parallel clamps. The jaws stay parallel under pressure, with a lifetime warranty.", "glue"),
  seg("credit", "on_screen_text", 60, 95, "Parallel clamps · Brindle Clamp Company · Loaned to us"),
];

describe("deliverables (each against the deal's terms)", () => {
  it("spoken mention at least / at most N seconds", () => {
    const r = runChecks(input(goodScript, [{ id: "min", kind: "mention_min_seconds", seconds: 30 }, { id: "max", kind: "mention_max_seconds", seconds: 30 }]));
    expect(result(r, "min").pass).toBe(true); // 35 s of read
    expect(result(r, "max").pass).toBe(false);
    expect(result(r, "max").message).toBe("The spoken mention runs 35.0 s; the deal asks for at most 30 s.");
    expect(result(r, "max").evidence[0]).toMatchObject({ segmentId: "read", start: "00:01:00:00", end: "00:01:35:00" });
  });

  it("mention starts before a timecode (within the first 3 minutes, say)", () => {
    expect(result(runChecks(input(goodScript, [{ id: "b", kind: "mention_before", seconds: 180 }])), "b").pass).toBe(true);
    const late = result(runChecks(input(goodScript, [{ id: "b", kind: "mention_before", seconds: 45 }])), "b");
    expect(late.pass).toBe(false);
    expect(late.message).toBe("The first mention starts at 00:01:00:00; the deal asks for it before 00:00:45:00.");
  });

  it("talking points found in the read, and each missing one named", () => {
    const ok = result(runChecks(input(goodScript, [{ id: "t", kind: "talking_points", phrases: ["jaws stay parallel", "Lifetime warranty"] }])), "t");
    expect(ok.pass).toBe(true);
    expect(ok.evidence.every((e) => e.found && e.segmentId === "read")).toBe(true);
    const missing = result(runChecks(input(goodScript, [{ id: "t", kind: "talking_points", phrases: ["jaws stay parallel", "made in Ohio"] }])), "t");
    expect(missing.pass).toBe(false);
    expect(missing.message).toBe("Missing from the read: “made in Ohio”.");
  });

  it("disclosure said at or before the first mention (FTC Disclosures 101: in the video, in plain words)", () => {
    expect(result(runChecks(input(goodScript, [{ id: "d", kind: "spoken_disclosure" }])), "d").pass).toBe(true);
    const unsaid = [seg("read", "sponsor_read", 60, 95, "Brindle Clamp Company makes these parallel clamps.", "glue"), seg("later", "voice_over", 200, 210, "This video was sponsored by Brindle Clamp Company.")];
    const r = result(runChecks(input(unsaid, [{ id: "d", kind: "spoken_disclosure" }])), "d");
    // Said only at the end: "at the end is likely missed" (FTC Disclosures 101).
    expect(r.pass).toBe(false);
    expect(r.message).toBe("No clear disclosure is said at or before the first mention at 00:01:00:00.");
  });

  it("a vague label is not a disclosure (ASA/CAP influencers' guide: avoid 'gift', 'collab', 'spon')", () => {
    const vague = [seg("read", "sponsor_read", 60, 95, "Big thanks to Brindle Clamp Company for the gift, a great collab.", "glue")];
    const r = result(runChecks(input(vague, [{ id: "d", kind: "spoken_disclosure" }])), "d");
    expect(r.pass).toBe(false);
    expect(r.message).toMatch(/Only a vague label/);
    expect(disclosureIn("#spon").clear).toBe(false);
    // Acceptable wording from FTC Disclosures 101.
    for (const ok of ["Ad", "Advertisement", "Sponsored", "Thanks to Brindle for the free product"]) expect(disclosureIn(ok).clear, ok).toBe(true);
  });

  it("disclosure shown on screen at the start (ASA/CAP: up front; FTC: better said and shown)", () => {
    expect(result(runChecks(input(goodScript, [{ id: "o", kind: "onscreen_disclosure" }])), "o").pass).toBe(true);
    const late = [seg("read", "sponsor_read", 60, 95, "Sponsored by Brindle Clamp Company.", "glue"), seg("tag", "on_screen_text", 60, 64, "Ad")];
    const r = result(runChecks(input(late, [{ id: "o", kind: "onscreen_disclosure" }])), "o");
    expect(r.pass).toBe(false);
    expect(r.message).toBe("Shown only at 00:01:00:00, after the start (00:00:30:00); show it up front.");
  });

  it("link and written disclosure in the description (in addition to the video, FTC Disclosures 101)", () => {
    const d = [{ id: "l", kind: "description_link" as const, url: "https://clamps.example/bench" }];
    expect(result(runChecks(input(goodScript, d, { description: "Clamps lent by Brindle Clamp Company (sponsored): https://clamps.example/bench" })), "l").pass).toBe(true);
    const r = result(runChecks(input(goodScript, d, { description: "Get yours: https://clamps.example/bench" })), "l");
    expect(r.pass).toBe(false);
    expect(r.message).toBe("The description has no written disclosure.");
  });

  it("on-screen credit whenever the sponsored tool is in use (its step's segments and B-roll)", () => {
    const ok = result(runChecks(input(goodScript, [{ id: "c", kind: "tool_credit" }])), "c");
    expect(ok.pass).toBe(true);
    const r = result(runChecks(input(goodScript, [{ id: "c", kind: "tool_credit" }], { broll: [{ start: s(120), end: s(130), stepId: "glue" }] })), "c");
    expect(r.pass).toBe(false);
    expect(r.message).toBe("parallel clamps is in use without an on-screen credit at 00:02:00:00–00:02:10:00.");
  });
});

describe("undisclosed connections (16 CFR 255.5: free or lent products are material connections)", () => {
  it("a loaned tool used in a step with no disclosure in the video is an error, even with no deal", () => {
    const script = [seg("v", "voice_over", 0, 20, "These parallel clamps keep the panel flat.", "glue")];
    const r = runChecks(input(script, [], { deals: [] }));
    const u = r.results.find((x) => x.kind === "undisclosed_connection")!;
    expect(u.pass).toBe(false);
    expect(u.message).toMatch(/is loaned by Brindle Clamp Company and used in this build, but the video never says so/);
    expect(u.evidence[0]).toMatchObject({ segmentId: "v", note: "mentioned without a disclosure" });
    expect(r.state).toBe("blocked");
  });

  it("a tool the channel bought needs nothing (common practice, no published source)", () => {
    const r = runChecks(input([seg("v", "voice_over", 0, 20, "My own clamps.", "glue")], [], { deals: [], tools: [{ id: "clamps", name: "parallel clamps", acquisition: "bought", sponsorId: null, sponsorName: null }] }));
    expect(r.results).toEqual([]);
    expect(r.state).toBe("none");
  });

  it("all met when disclosed, with credits for the description and the screen", () => {
    const r = runChecks(input(goodScript, [{ id: "d", kind: "spoken_disclosure" }]));
    expect(r.state).toBe("met");
    expect(r.credits).toEqual([
      {
        toolId: "clamps",
        name: "parallel clamps",
        sponsorName: "Brindle Clamp Company",
        acquisition: "loaned",
        appearances: [{ start: "00:01:00:00", end: "00:01:35:00" }],
        descriptionLine: "parallel clamps from Brindle Clamp Company: lent to the channel (first seen at 00:01:00:00).",
        onScreen: "parallel clamps · Brindle Clamp Company · Loaned to us",
      },
    ]);
  });
});
