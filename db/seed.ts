/**
 * The demo scenario: an invented two-person-plus channel and an outsider's
 * channel for isolation checks. Everything here is made up for the demo.
 * Runs once, on an empty database.
 */
import bcrypt from "bcryptjs";
import crypto from "node:crypto";
import { sql } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import * as schema from "./schema";
import type { Role } from "../lib/roles";
import type { Stage } from "../lib/stages";
import type { StepStatus } from "../lib/schemas/build";
import type { PricingUnit } from "../lib/materials";
import type { SegmentKind } from "../lib/script-timing";
import type { ShotKind, ShotStatus } from "../lib/schemas/footage";
import type { CoverageKind } from "../lib/shot-kinds";

export const DEMO_PASSWORD = "jigboard-demo";

export const DEMO_USERS: { email: string; name: string; roles: Role[] }[] = [
  { email: "owner@jigboard.example", name: "Mara Lindqvist", roles: ["owner"] },
  { email: "presenter@jigboard.example", name: "Tomas Reyes", roles: ["presenter"] },
  { email: "editor@jigboard.example", name: "Ines Okafor", roles: ["editor"] },
  { email: "producer@jigboard.example", name: "Dev Halloran", roles: ["producer"] },
  { email: "sponsors@jigboard.example", name: "Priya Castellan", roles: ["sponsor_liaison"] },
];
export const OUTSIDER = { email: "outsider@jigboard.example", name: "Quill Ashworth" };

const EPISODES: { title: string; stage: Stage; summary: string; target: number; publish: string | null }[] = [
  { title: "Folding sawhorses that nest flat", stage: "idea", summary: "Two pairs that hang on the wall and take a full sheet.", target: 720, publish: null },
  { title: "A tool chest from one sheet of plywood", stage: "idea", summary: "Every part nested on one 4x8 sheet, no offcuts wasted.", target: 960, publish: null },
  { title: "Walnut side table with a floating top", stage: "planning", summary: "Bridle joints, a shadow gap under the top, oil finish.", target: 900, publish: "2027-01-22" },
  { title: "Cedar planter boxes for a balcony", stage: "planning", summary: "Three sizes, sliding-dovetail feet, no metal in contact with soil.", target: 780, publish: "2027-02-05" },
  { title: "Shaker-style step stool", stage: "shooting", summary: "Through-tenons, hand-cut, finished with shellac.", target: 840, publish: "2027-01-08" },
  { title: "Crosscut sled with a stop block", stage: "shooting", summary: "Squared with the five-cut method; a sponsor's clamps on screen.", target: 660, publish: "2026-12-30" },
  { title: "Outdoor bench from reclaimed decking", stage: "editing", summary: "Glue-up warped on day two; the fix is half the story.", target: 1020, publish: "2026-12-18" },
  { title: "Router table fence with dust port", stage: "editing", summary: "Split fence, T-track and a 4-inch port.", target: 720, publish: "2026-12-23" },
  { title: "Oak wall shelf with hidden cleat", stage: "review", summary: "French cleat cut on the table saw, wipe-on poly.", target: 600, publish: "2026-12-11" },
  { title: "End-grain cutting board from maple offcuts", stage: "scheduled", summary: "Two glue-ups, a router sled to flatten, food-safe finish.", target: 780, publish: "2026-12-09" },
  { title: "A leg vise from workshop scrap", stage: "published", summary: "Parallel guide, wooden screw bought in, chop from laminated pine.", target: 900, publish: "2026-11-20" },
  { title: "Ash coat rack with turned pegs", stage: "published", summary: "Lathe work for the pegs, wedged tenons into the rail.", target: 660, publish: "2026-11-06" },
  { title: "Plywood box for drill bits", stage: "published", summary: "Bandsaw box with sized holes; a quick weekend build.", target: 480, publish: "2026-10-23" },
];

export interface SeedOptions {
  /** Stores a demo clip's bytes; without it the demo has no footage. */
  putObject?: (key: string, bytes: Uint8Array, contentType: string) => Promise<string | null>;
}

export async function seedDemo(db: NodePgDatabase<typeof schema>, opts: SeedOptions = {}): Promise<boolean> {
  const existing = await db.execute(sql`select count(*)::int as n from channels`);
  if ((existing.rows[0] as { n: number }).n > 0) return false;

  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await db.transaction(async (tx) => {
    const [channel] = await tx.insert(schema.channels).values({ name: "Crooked Kerf Workshop", currency: "USD", timeZone: "Europe/Dublin" }).returning();
    const [outsiderChannel] = await tx.insert(schema.channels).values({ name: "Outlier Joinery", currency: "EUR", units: "metric" }).returning();
    if (!channel || !outsiderChannel) throw new Error("seed: channel insert failed");

    const ids: Record<string, string> = {};
    for (const u of DEMO_USERS) {
      const [row] = await tx.insert(schema.users).values({ email: u.email, name: u.name, passwordHash: hash }).returning();
      ids[u.email] = row!.id;
      await tx.insert(schema.memberships).values({ channelId: channel.id, userId: row!.id, roles: u.roles });
    }
    const [outsider] = await tx.insert(schema.users).values({ email: OUTSIDER.email, name: OUTSIDER.name, passwordHash: hash }).returning();
    await tx.insert(schema.memberships).values({ channelId: outsiderChannel.id, userId: outsider!.id, roles: ["owner"] });

    const positions: Partial<Record<Stage, number>> = {};
    const episodeIds: Record<string, string> = {};
    for (const e of EPISODES) {
      const position = positions[e.stage] ?? 0;
      positions[e.stage] = position + 1;
      const [ep] = await tx.insert(schema.episodes).values({
        channelId: channel.id,
        title: e.title,
        summary: e.summary,
        stage: e.stage,
        position,
        targetRuntimeSeconds: e.target,
        publishDate: e.publish,
        frameRate: "29.97",
        dropFrame: true,
        createdBy: ids["presenter@jigboard.example"],
        updatedBy: ids["presenter@jigboard.example"],
      }).returning();
      episodeIds[e.title] = ep!.id;
    }
    const stepIds = await seedBuildPlans(tx, channel.id, episodeIds);
    await seedScripts(tx, episodeIds, stepIds, ids["presenter@jigboard.example"]!);
    await seedShotsAndFootage(tx, channel.id, episodeIds, stepIds, ids["editor@jigboard.example"]!, opts);
    await seedShootDays(tx, channel.id, episodeIds, stepIds, ids);
    await seedDeals(tx, channel.id, episodeIds);
    await seedPublish(tx, episodeIds);
    await tx.insert(schema.episodes).values({
      channelId: outsiderChannel.id,
      title: "Hall bench in steamed beech",
      summary: "The outsider channel's only episode.",
      stage: "planning",
      position: 0,
      frameRate: "25",
      dropFrame: false,
      createdBy: outsider!.id,
    });
  });
  return true;
}

type SeedTx = Parameters<Parameters<NodePgDatabase<typeof schema>["transaction"]>[0]>[0];

interface SeedStep {
  key: string;
  title: string;
  active: number;
  wait?: number;
  reason?: string;
  deps?: string[];
  tools?: string[];
  cover?: CoverageKind[];
  hazards?: string[];
  status?: StepStatus;
  failure?: string;
  remedyOf?: string;
  notes?: string;
  crew?: number;
}

interface SeedPart {
  part: string;
  material: string;
  t: string;
  w: string;
  l: string;
  qty: number;
  sizing?: "nominal" | "actual";
  pricing?: PricingUnit;
  price: number;
  waste?: number;
  step?: string;
}

/** Invented build plans: a glue-up wait, a finish that needs days, a failure with remedies, a sponsored tool. */
async function seedBuildPlans(tx: SeedTx, channelId: string, episodeIds: Record<string, string>): Promise<Record<string, Record<string, string>>> {
  const allStepIds: Record<string, Record<string, string>> = {};
  const [sponsor] = await tx
    .insert(schema.sponsors)
    .values({ channelId, name: "Brindle Clamp Company", contactName: "Odile Marchetti", contactEmail: "odile@brindle-clamps.example" })
    .returning();
  const toolRows = [
    { key: "tablesaw", name: "Cabinet table saw", kind: "power_tool", acquisition: "bought", caution: "Riving knife on for every rip; push sticks within reach." },
    { key: "planer", name: "Thickness planer", kind: "power_tool", acquisition: "bought", caution: "Feed no pieces shorter than 12 in; dust collection on." },
    { key: "router", name: "Plunge router", kind: "power_tool", acquisition: "bought", caution: "" },
    { key: "clamps", name: "Parallel clamps (set of 8)", kind: "clamp", acquisition: "loaned", sponsorId: sponsor!.id, caution: "" },
    { key: "chisels", name: "Bench chisels", kind: "hand_tool", acquisition: "bought", caution: "" },
    { key: "oil", name: "Hardwax oil", kind: "finish", acquisition: "bought", caution: "Oily rags: dry flat outdoors or drown in a closed metal can." },
    { key: "torch", name: "Propane torch", kind: "heat", acquisition: "bought", caution: "" },
  ] as const;
  const tools: Record<string, string> = {};
  for (const t of toolRows) {
    const { key, ...values } = t;
    const [row] = await tx.insert(schema.tools).values({ channelId, ...values }).returning();
    tools[key] = row!.id;
  }

  const plan = async (title: string, steps: SeedStep[], parts: SeedPart[]) => {
    const episodeId = episodeIds[title];
    if (!episodeId) throw new Error(`seed: no episode ${title}`);
    const stepIds: Record<string, string> = {};
    allStepIds[title] = stepIds;
    for (const [position, s] of steps.entries()) {
      const [row] = await tx
        .insert(schema.buildSteps)
        .values({
          episodeId,
          position,
          title: s.title,
          notes: s.notes ?? "",
          activeMinutes: s.active,
          waitMinutes: s.wait ?? 0,
          waitReason: s.reason ?? "",
          crewNeeded: s.crew ?? 1,
          coverageKinds: s.cover ?? ["to_camera", "broll"],
          hazards: s.hazards ?? [],
          status: s.status ?? "planned",
          failureNote: s.failure ?? null,
          remedyOfStepId: s.remedyOf ? stepIds[s.remedyOf] : null,
        })
        .returning();
      stepIds[s.key] = row!.id;
      for (const d of s.deps ?? []) await tx.insert(schema.stepDependencies).values({ stepId: row!.id, dependsOnStepId: stepIds[d]! });
      for (const t of s.tools ?? []) await tx.insert(schema.stepTools).values({ stepId: row!.id, toolId: tools[t]! });
    }
    for (const [position, p] of parts.entries()) {
      const num = (v: string) => {
        const m = /^(\d+)-(\d+)\/(\d+)$/.exec(v) ?? /^()(\d+)\/(\d+)$/.exec(v);
        return m ? String(Number(m[1] || 0) + Number(m[2]) / Number(m[3])) : v;
      };
      await tx.insert(schema.materials).values({
        episodeId,
        position,
        partName: p.part,
        material: p.material,
        thickness: num(p.t),
        width: num(p.w),
        length: num(p.l),
        quantity: p.qty,
        sizing: p.sizing ?? "actual",
        pricingUnit: p.pricing ?? "board_foot",
        unitPriceMinor: p.price,
        wastePercent: String(p.waste ?? 15),
        stepId: p.step ? stepIds[p.step] : null,
      });
    }
  };

  await plan(
    "Walnut side table with a floating top",
    [
      { key: "acclimate", title: "Sticker the walnut in the shop", active: 20, wait: 3 * 1440, reason: "acclimatise to shop humidity", cover: ["broll"], status: "done" },
      { key: "mill", title: "Mill legs, aprons and top to size", active: 150, deps: ["acclimate"], tools: ["tablesaw", "planer"], cover: ["to_camera", "broll", "slow_motion"] },
      { key: "bridles", title: "Cut the bridle joints", active: 180, deps: ["mill"], tools: ["tablesaw", "chisels"], cover: ["close_up", "overhead"] },
      { key: "glue", title: "Glue up the base", active: 40, wait: 24 * 60, reason: "glue cure before unclamping", deps: ["bridles"], tools: ["clamps"], crew: 2, cover: ["time_lapse", "broll"] },
      { key: "top", title: "Flatten and edge the top", active: 90, deps: ["mill"], tools: ["router"], cover: ["broll", "overhead"] },
      { key: "fit", title: "Fit the top on cleats with a shadow gap", active: 75, deps: ["glue", "top"], cover: ["to_camera", "close_up"] },
      { key: "oil", title: "Three coats of hardwax oil", active: 45, wait: 3 * 1440, reason: "finish dries between and after coats", deps: ["fit"], tools: ["oil"], hazards: ["finish"], cover: ["time_lapse", "close_up"] },
    ],
    [
      { part: "Leg", material: "Black walnut", t: "1-3/4", w: "1-3/4", l: "24", qty: 4, price: 1450, waste: 20, step: "mill" },
      { part: "Apron", material: "Black walnut", t: "3/4", w: "3", l: "16", qty: 4, price: 1450, waste: 20, step: "mill" },
      { part: "Top", material: "Black walnut", t: "3/4", w: "16", l: "20", qty: 1, price: 1450, waste: 25, step: "top" },
      { part: "Top cleat", material: "Hard maple", t: "3/4", w: "1", l: "14", qty: 2, price: 780, step: "fit" },
    ],
  );

  await plan(
    "Outdoor bench from reclaimed decking",
    [
      { key: "strip", title: "Pull screws and plane the old decking", active: 120, tools: ["planer"], status: "done", cover: ["broll", "slow_motion"] },
      { key: "seat", title: "Glue up the seat slats", active: 60, wait: 24 * 60, reason: "glue cure", deps: ["strip"], tools: ["clamps"], crew: 2, status: "failed", failure: "The seat panel cupped about 1/8 in overnight: the decking was still wet inside.", cover: ["time_lapse"] },
      { key: "rejoin", title: "Rip the panel apart, dry the stock, re-joint and re-glue", active: 90, wait: 2 * 1440, reason: "drying, then glue cure", deps: ["seat"], remedyOf: "seat", tools: ["tablesaw", "clamps"], cover: ["to_camera", "broll"] },
      { key: "battens", title: "Screw battens under the seat to hold it flat", active: 40, deps: ["rejoin"], remedyOf: "seat", cover: ["close_up"] },
      { key: "legs", title: "Cut and join the leg frames", active: 150, deps: ["strip"], tools: ["tablesaw"], status: "done" },
      { key: "assemble", title: "Assemble and seal the end grain", active: 60, wait: 12 * 60, reason: "sealer dries", deps: ["battens", "legs"], hazards: ["finish"] },
    ],
    [
      { part: "Seat slat", material: "Reclaimed decking 2x6", t: "2", w: "6", l: "48", qty: 6, sizing: "nominal", pricing: "linear_foot", price: 0, waste: 10, step: "seat" },
      { part: "Leg", material: "Reclaimed decking 2x6", t: "2", w: "6", l: "17", qty: 4, sizing: "nominal", pricing: "linear_foot", price: 0, step: "legs" },
      { part: "Batten", material: "Pressure-treated 2x4", t: "2", w: "4", l: "16", qty: 3, sizing: "nominal", pricing: "linear_foot", price: 125, step: "battens" },
      { part: "Exterior screws", material: "Hardware", t: "1/4", w: "1/4", l: "3", qty: 40, pricing: "each", price: 12, waste: 10 },
    ],
  );

  await plan(
    "Crosscut sled with a stop block",
    [
      { key: "base", title: "Cut the base and runners", active: 60, tools: ["tablesaw"], cover: ["to_camera", "broll"] },
      { key: "fences", title: "Laminate the front and back fences", active: 30, wait: 2 * 60, reason: "glue cure before cutting", deps: ["base"], tools: ["clamps"], cover: ["broll", "close_up"] },
      { key: "square", title: "Square the fence with the five-cut method", active: 45, deps: ["fences"], tools: ["tablesaw"], cover: ["to_camera", "overhead", "close_up"] },
      { key: "stop", title: "Make and fit the stop block", active: 40, deps: ["square"], tools: ["router"], cover: ["close_up"] },
    ],
    [
      { part: "Base", material: "Baltic birch plywood 3/4", t: "3/4", w: "24", l: "30", qty: 1, pricing: "sheet", price: 8900, waste: 10, step: "base" },
      { part: "Fence layers", material: "Baltic birch plywood 3/4", t: "3/4", w: "4", l: "30", qty: 4, pricing: "sheet", price: 8900, waste: 10, step: "fences" },
      { part: "Runner", material: "Hard maple", t: "3/8", w: "3/4", l: "24", qty: 2, price: 780, step: "base" },
    ],
  );

  await plan(
    "End-grain cutting board from maple offcuts",
    [
      { key: "strips", title: "Rip maple and cherry strips", active: 60, tools: ["tablesaw"], status: "done" },
      { key: "glue1", title: "First glue-up: long-grain panel", active: 30, wait: 24 * 60, reason: "glue cure", deps: ["strips"], tools: ["clamps"], status: "done", crew: 2 },
      { key: "crosscut", title: "Crosscut the panel into end-grain strips", active: 40, deps: ["glue1"], tools: ["tablesaw"], status: "done" },
      { key: "glue2", title: "Second glue-up: end-grain board", active: 30, wait: 24 * 60, reason: "glue cure", deps: ["crosscut"], tools: ["clamps"], status: "done", crew: 2 },
      { key: "flatten", title: "Flatten with the router sled", active: 90, deps: ["glue2"], tools: ["router"], status: "done" },
      { key: "brand", title: "Burn the channel mark into the side", active: 10, deps: ["flatten"], tools: ["torch"], status: "done", cover: ["close_up", "slow_motion"] },
      { key: "oil", title: "Food-safe oil, two coats", active: 20, wait: 2 * 1440, reason: "oil cures", deps: ["brand"], tools: ["oil"], status: "done" },
    ],
    [
      { part: "Strips", material: "Hard maple", t: "1-1/2", w: "2", l: "36", qty: 6, price: 780, step: "strips" },
      { part: "Accent strips", material: "Cherry", t: "1-1/2", w: "1", l: "36", qty: 2, price: 990, step: "strips" },
    ],
  );
  return allStepIds;
}

type SeedSegment = [kind: SegmentKind, step: string | null, text: string, extra?: { chapter?: string; pinSeconds?: number; fixedSeconds?: number; note?: string }];

/** Invented scripts in the channel's voice, linked to the build steps above. Frame rate 29.97 DF. */
async function seedScripts(tx: SeedTx, episodeIds: Record<string, string>, stepIds: Record<string, Record<string, string>>, presenterId: string) {
  const fps = 30000 / 1001;
  const script = async (title: string, segments: SeedSegment[]) => {
    const episodeId = episodeIds[title]!;
    await tx.update(schema.episodes).set({ presenterId }).where(sql`id = ${episodeId}`);
    for (const [position, [kind, step, text, extra]] of segments.entries()) {
      await tx.insert(schema.scriptSegments).values({
        episodeId,
        position,
        kind,
        text,
        stepId: step ? stepIds[title]![step]! : null,
        chapterStart: Boolean(extra?.chapter),
        chapterTitle: extra?.chapter ?? null,
        pinnedStartFrame: extra?.pinSeconds != null ? Math.round(extra.pinSeconds * fps) : null,
        explicitDurationFrames: extra?.fixedSeconds != null ? Math.round(extra.fixedSeconds * fps) : null,
        editorNotes: extra?.note ?? "",
        updatedBy: presenterId,
      });
    }
  };

  await script("Outdoor bench from reclaimed decking", [
    ["to_camera", null, "This decking spent eight summers under a barbecue. Today it becomes a bench, and before the end of the week it tried very hard to become firewood instead. {1s} Let me show you what happened.", { chapter: "A bench from old boards" }],
    ["on_screen_text", null, "Reclaimed decking, 2x6, about 40 linear feet"],
    ["voice_over", "strip", "First job: every screw comes out. A metal detector wand finds the ones that snapped off, because one buried screw will take a nick out of the planer knives. Then a light pass on each face until clean wood shows through.", { chapter: "Stripping the old boards", note: "Use the slow-motion shot of the first shavings here." }],
    ["voice_over", "seat", "The seat is six slats glued edge to edge. Glue on both faces of each joint, clamps alternating above and below so the panel stays flat, and then we wait a full day.", { chapter: "The glue-up that failed" }],
    ["to_camera", "seat", "Next morning the panel had cupped about an eighth of an inch. The outside of these boards was dry. The inside was not. That water had to go somewhere, and it went into the shape of a shallow bowl."],
    ["voice_over", "rejoin", "So the panel goes back through the saw, right on the glue lines. The strips sit stickered in front of a fan for two days, and this time I check them with a moisture meter before any glue comes out.", { chapter: "Starting the seat again" }],
    ["voice_over", "battens", "Two battens underneath, screwed through slotted holes, keep the seat flat while still letting it move with the seasons. {2s}"],
    ["voice_over", "legs", "The leg frames are simple half-laps cut on the table saw with a dado stack. Riving knife off for the dado, guard back on the moment it's done.", { pinSeconds: 95 }],
    ["to_camera", "assemble", "End grain gets a sealer so it doesn't drink the rain, and that's the bench. It took two days longer than planned, and I'd call that a cheap lesson.", { chapter: "Finished bench" }],
  ]);

  await script("Crosscut sled with a stop block", [
    ["to_camera", null, "A crosscut sled is the first jig I'd build for any table saw. It's square, it's repeatable, and it keeps your hands well away from the blade.", { chapter: "Why a sled" }],
    ["voice_over", "base", "The base is three-quarter birch ply, twenty-four by thirty. The runners are hard maple, planed until they slide in the miter slots with no play at all.", { chapter: "Base and runners" }],
    ["sponsor_read", "fences", "The fences are two layers of ply laminated together, and the clamps holding them come from Brindle Clamp Company, who lent them to the channel for this build. That's a sponsorship: they had no say in what I tell you about them. The jaws stay parallel under pressure, so the glue-up stays flat.", { note: "Show the disclosure caption while this plays." }],
    ["on_screen_text", "fences", "Paid partnership: clamps loaned by Brindle Clamp Company"],
    ["voice_over", "square", "Squaring uses the five-cut method. Cut each edge of a test board in turn, measure the last offcut at both ends, and the difference tells you how far to nudge the fence.", { chapter: "Five cuts to square" }],
    ["voice_over", "stop", "Last, a stop block that rides in a T-track, so ten parts come out exactly the same length. {1.5s}", { chapter: "The stop block" }],
  ]);

  await script("Walnut side table with a floating top", [
    ["to_camera", null, "Walnut, bridle joints, and a top that seems to hover over the base. This is the plan, and it starts with three days of doing nothing at all.", { chapter: "The plan" }],
    ["voice_over", "acclimate", "The boards get stickered in the shop so they settle to our humidity before a single cut. Skip this step and the joints you fit on Monday are loose by Friday."],
    ["voice_over", "bridles", "Each bridle joint starts on the table saw with a tenoning jig and finishes with a chisel, paring to a knife line.", { chapter: "Bridle joints" }],
    ["voice_over", "oil", "Three coats of hardwax oil, a day between each. The rags go flat on the concrete outside to dry. Oily rags can catch fire all on their own.", { chapter: "Oil finish" }],
  ]);
}

/** Shots in every status, generated test-pattern clips (made with ffmpeg for the demo) and a few open gaps. */
async function seedShotsAndFootage(tx: SeedTx, channelId: string, episodeIds: Record<string, string>, stepIds: Record<string, Record<string, string>>, editorId: string, opts: SeedOptions) {
  const title = "Outdoor bench from reclaimed decking";
  const episodeId = episodeIds[title]!;
  const steps = stepIds[title]!;
  const shotRows: { kind: ShotKind; description: string; stepId?: string; status: ShotStatus; priority: number; framing?: string; cameraNotes?: string }[] = [
    { kind: "broll", description: "Screws coming out of the old boards, close", stepId: steps.strip, status: "selected", priority: 1, framing: "tight, handheld" },
    { kind: "slow_motion", description: "First planer pass: shavings flying", stepId: steps.strip, status: "captured", priority: 1, framing: "side, low", cameraNotes: "120 fps, 50 mm" },
    { kind: "time_lapse", description: "Seat glue-up clamped overnight", stepId: steps.seat, status: "captured", priority: 2, framing: "overhead" },
    { kind: "close_up", description: "The cupped panel on the bench with a straightedge", stepId: steps.seat, status: "rejected", priority: 1, framing: "eye level", cameraNotes: "reshoot: straightedge out of focus" },
    { kind: "broll", description: "Strips drying in front of the fan, moisture meter reading", stepId: steps.rejoin, status: "planned", priority: 1 },
    { kind: "overhead", description: "Battens screwed on through slotted holes", stepId: steps.battens, status: "planned", priority: 2 },
    { kind: "to_camera", description: "Closing lines beside the finished bench", stepId: steps.assemble, status: "planned", priority: 1 },
  ];
  const shotIds: string[] = [];
  for (const [position, r] of shotRows.entries()) {
    const [row] = await tx.insert(schema.shots).values({ ...r, episodeId, position }).returning();
    shotIds.push(row!.id);
  }
  if (opts.putObject) {
    const fs = await import("node:fs");
    const path = await import("node:path");
    const { fileURLToPath } = await import("node:url");
    const bytes = fs.readFileSync(path.join(path.dirname(fileURLToPath(import.meta.url)), "demo-media", "test-pattern.mp4"));
    const names = ["A001_screws_out.mp4", "A002_planer_shavings.mp4", "A003_glueup_timelapse.mp4"];
    for (const [i, name] of names.entries()) {
      const key = `channel/${channelId}/footage/${crypto.randomUUID()}.mp4`;
      const etag = await opts.putObject(key, bytes, "video/mp4");
      const [clip] = await tx
        .insert(schema.clips)
        .values({ channelId, episodeId, shotId: shotIds[i]!, storageKey: key, state: "stored", originalName: name, sizeBytes: bytes.length, contentType: "video/mp4", durationMs: 4000, frameRate: "29.970", width: 320, height: 180, startTimecode: "01:00:00;00", checksum: etag ? `s3-etag:${etag}` : null, createdBy: editorId })
        .returning();
      // Lay the first two over the opening voice-over; leave later narration uncovered.
      if (i < 2) await tx.insert(schema.coverageRanges).values({ episodeId, clipId: clip!.id, startFrame: Math.round((17 + i * 4) * 29.97), endFrame: Math.round((21 + i * 4) * 29.97) });
    }
  }
  await tx.insert(schema.gaps).values({ episodeId, source: "marked", status: "open", startFrame: Math.round(100 * 29.97), endFrame: Math.round(106 * 29.97), note: "Need a wide of the whole bench before assembly" });
}

/**
 * Invented shoot days in December 2026 (Dublin time, GMT then): the walnut
 * table's glue-up cures overnight, so its build needs a second day; the
 * editor is away on the Sunday; a friend helps on camera two. The saved
 * schedule below is what the scheduler gives for these steps (worked by
 * hand: mill, bridles and the glue-up first, so the cure starts early).
 */
async function seedShootDays(tx: SeedTx, channelId: string, episodeIds: Record<string, string>, stepIds: Record<string, Record<string, string>>, users: Record<string, string>) {
  const table = episodeIds["Walnut side table with a floating top"]!;
  const stool = episodeIds["Shaker-style step stool"]!;
  const utc = (date: string, hhmm: string) => new Date(`${date}T${hhmm}:00Z`);
  const day = async (v: { date: string; call: string; wrap: string; episodeId: string; location: string; status?: "planned" | "confirmed" | "shot"; crew: [string, string][]; helpers?: { name: string; duty: string; email: string }[]; equipment?: string; safety?: string; weather?: string }) => {
    const [row] = await tx
      .insert(schema.shootDays)
      .values({ channelId, episodeId: v.episodeId, day: v.date, timeZone: "Europe/Dublin", callAt: utc(v.date, v.call), wrapAt: utc(v.date, v.wrap), location: v.location, status: v.status ?? "confirmed", equipmentNotes: v.equipment ?? "", safetyNotes: v.safety ?? "", weatherNote: v.weather ?? "", contacts: "Dev Halloran (producer) for changes on the day." })
      .returning();
    for (const [email, duty] of v.crew) await tx.insert(schema.shootDayCrew).values({ shootDayId: row!.id, userId: users[email]!, duty });
    for (const h of v.helpers ?? []) await tx.insert(schema.shootDayHelpers).values({ shootDayId: row!.id, ...h });
    return row!.id;
  };
  const crew: [string, string][] = [
    ["presenter@jigboard.example", "on camera, at the bench"],
    ["producer@jigboard.example", "camera one, sound"],
  ];
  const sat = await day({ date: "2026-12-12", call: "09:00", wrap: "17:00", episodeId: table, location: "Main shop, bench two", crew: [...crew, ["editor@jigboard.example", "data wrangling"]], helpers: [{ name: "Rowan Vale", duty: "camera two (overhead)", email: "rowan.vale@helpers.example" }], equipment: "Two cameras, overhead rig, lav mic, LED panels; clamps laid out the night before.", safety: "Riving knife on for all rips; the dust extractor runs whenever the planer does.", weather: "Shop heater on by 08:00 so the glue is above 15 °C." });
  const sun = await day({ date: "2026-12-13", call: "09:00", wrap: "18:00", episodeId: table, location: "Main shop, bench two", crew, equipment: "One camera, lav mic, time-lapse camera for the oil coats.", safety: "Oily rags flat on the rack outside, then into the metal bin with water." });
  await day({ date: "2026-12-05", call: "10:00", wrap: "15:00", episodeId: stool, location: "Main shop", crew, status: "shot" });
  await tx.insert(schema.daysAway).values([
    { channelId, userId: users["editor@jigboard.example"]!, day: "2026-12-13", note: "family visit" },
    { channelId, userId: users["sponsors@jigboard.example"]!, day: "2026-12-12", note: "trade show" },
    { channelId, userId: users["presenter@jigboard.example"]!, day: "2026-12-19", note: "" },
  ]);
  const s = stepIds["Walnut side table with a floating top"]!;
  const plan: [string, string, string, string, string][] = [
    ["mill", sat, "2026-12-12", "09:00", "11:30"],
    ["bridles", sat, "2026-12-12", "11:30", "14:30"],
    ["glue", sat, "2026-12-12", "14:30", "15:10"],
    ["top", sat, "2026-12-12", "15:10", "16:40"],
    ["fit", sun, "2026-12-13", "15:10", "16:25"],
    ["oil", sun, "2026-12-13", "16:25", "17:10"],
  ];
  for (const [key, dayId, date, from, to] of plan) await tx.insert(schema.scheduledSteps).values({ stepId: s[key]!, episodeId: table, shootDayId: dayId, startsAt: utc(date, from), endsAt: utc(date, to) });
}

/**
 * Invented sponsors and deals: a paid integration whose read misses a
 * talking point (a failing check), a gifted sander, and the loaned clamps.
 */
async function seedDeals(tx: SeedTx, channelId: string, episodeIds: Record<string, string>) {
  const [brindle] = await tx.select().from(schema.sponsors).where(sql`${schema.sponsors.channelId} = ${channelId} and ${schema.sponsors.name} = 'Brindle Clamp Company'`);
  const [clamps] = await tx.select().from(schema.tools).where(sql`${schema.tools.channelId} = ${channelId} and ${schema.tools.name} like 'Parallel clamps%'`);
  const [kestrel] = await tx.insert(schema.sponsors).values({ channelId, name: "Kestrel Abrasives", website: "https://kestrel-abrasives.example", contactName: "Juno Pell", contactEmail: "juno@kestrel-abrasives.example" }).returning();
  const [harrow] = await tx.insert(schema.sponsors).values({ channelId, name: "Harrow Power Tools", website: "https://harrow-tools.example", contactName: "Bram Okonkwo", contactEmail: "bram@harrow-tools.example" }).returning();
  for (const s of [brindle!, kestrel!, harrow!]) await tx.insert(schema.sponsorContacts).values({ sponsorId: s.id, name: s.contactName || "Odile Marchetti", email: s.contactEmail || "odile@brindle-clamps.example" });
  const [sander] = await tx.insert(schema.tools).values({ channelId, name: "Random orbit sander", kind: "power_tool", acquisition: "gifted", sponsorId: harrow!.id, caution: "Dust extraction on; eye protection." }).returning();
  const deal = async (v: Omit<typeof schema.deals.$inferInsert, "channelId">, episodes: string[], toolIds: string[], deliverables: Omit<typeof schema.deliverables.$inferInsert, "dealId">[]) => {
    const [row] = await tx.insert(schema.deals).values({ ...v, channelId, episodeId: episodes[0] ?? null }).returning();
    for (const e of episodes) await tx.insert(schema.dealEpisodes).values({ dealId: row!.id, episodeId: e });
    for (const t of toolIds) await tx.insert(schema.dealTools).values({ dealId: row!.id, toolId: t });
    for (const [i, d] of deliverables.entries()) await tx.insert(schema.deliverables).values({ ...d, dealId: row!.id, position: i });
  };
  const fence = episodeIds["Router table fence with dust port"]!;
  const table = episodeIds["Walnut side table with a floating top"]!;
  await deal({ sponsorId: brindle!.id, title: "Clamp loan for the router table fence", kind: "loaned_tool", status: "in_review", returnBy: "2027-01-31", publishFrom: "2026-12-15", publishTo: "2026-12-31" }, [fence], [clamps!.id], [
    { kind: "spoken_disclosure" },
    { kind: "mention_min_seconds", seconds: 10 },
    { kind: "talking_points", phrases: ["jaws stay parallel"] },
  ]);
  await deal({ sponsorId: kestrel!.id, title: "Sanding read in the walnut table", kind: "paid_integration", feeMinor: 120000, currency: "USD", status: "signed", signedOn: "2026-11-20", scriptDue: "2026-12-08", reviewDue: "2026-12-15", publishFrom: "2027-01-15", publishTo: "2027-02-15" }, [table], [], [
    { kind: "mention_before", seconds: 180 },
    { kind: "talking_points", phrases: ["hook-and-loop discs", "no clogging on walnut"] },
    { kind: "spoken_disclosure" },
    { kind: "description_link", url: "https://kestrel-abrasives.example/walnut" },
  ]);
  await deal({ sponsorId: harrow!.id, title: "Gifted sander", kind: "gifted_tool", status: "signed" }, [table], [sander!.id], [{ kind: "spoken_disclosure" }]);
}

/** An invented publish package in progress: title and texts written, no thumbnail yet, the script not marked final, no "Ad" label yet for the paid read. */
async function seedPublish(tx: SeedTx, episodeIds: Record<string, string>) {
  await tx.insert(schema.publishPackages).values({
    episodeId: episodeIds["Walnut side table with a floating top"]!,
    title: "Walnut side table with a floating top (bridle joints, hardwax oil)",
    summary: "One 8/4 walnut board becomes a side table: bridle joints cut on the table saw, a top that floats on cleats with a shadow gap, and three coats of hardwax oil.",
    closing: "Plans and a printable cut list: https://crooked-kerf.example/side-table\nQuestions go in the comments; we read them all.",
  });
}
