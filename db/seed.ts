/**
 * The demo scenario: an invented two-person-plus channel and an outsider's
 * channel for isolation checks. Everything here is made up for the demo.
 * Runs once, on an empty database.
 */
import bcrypt from "bcryptjs";
import { sql } from "drizzle-orm";
import type { NodePgDatabase } from "drizzle-orm/node-postgres";
import * as schema from "./schema";
import type { Role } from "../lib/roles";
import type { Stage } from "../lib/stages";

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

export async function seedDemo(db: NodePgDatabase<typeof schema>): Promise<boolean> {
  const existing = await db.execute(sql`select count(*)::int as n from channels`);
  if ((existing.rows[0] as { n: number }).n > 0) return false;

  const hash = await bcrypt.hash(DEMO_PASSWORD, 10);
  await db.transaction(async (tx) => {
    const [channel] = await tx.insert(schema.channels).values({ name: "Crooked Kerf Workshop", currency: "USD" }).returning();
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
    for (const e of EPISODES) {
      const position = positions[e.stage] ?? 0;
      positions[e.stage] = position + 1;
      await tx.insert(schema.episodes).values({
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
      });
    }
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
