import { z } from "zod";
import { STAGES } from "../stages";
import { FRAME_RATE_IDS, allowsDropFrame, type FrameRateId } from "../frame-rate";

export const stageSchema = z.enum(STAGES);
export const frameRateSchema = z.enum(FRAME_RATE_IDS as [FrameRateId, ...FrameRateId[]]);

const isoDate = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}$/, "use the form YYYY-MM-DD")
  .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)) && new Date(`${s}T00:00:00Z`).toISOString().startsWith(s), "is not a real date");

const episodeFields = {
  title: z.string().trim().min(1, "give the episode a title").max(160, "keep the title under 160 characters"),
  summary: z.string().trim().max(4000, "keep the summary under 4000 characters"),
  targetRuntimeSeconds: z
    .number({ message: "must be a number of seconds" })
    .int("must be whole seconds")
    .min(10, "must be at least 10 seconds")
    .max(6 * 3600, "must be at most 6 hours")
    .nullable(),
  publishDate: isoDate.nullable(),
  frameRate: frameRateSchema,
  dropFrame: z.boolean(),
};

function dropFrameRule<T extends { frameRate?: FrameRateId; dropFrame?: boolean }>(v: T, ctx: z.RefinementCtx) {
  if (v.dropFrame && v.frameRate && !allowsDropFrame(v.frameRate)) {
    ctx.addIssue({ code: "custom", path: ["dropFrame"], message: "drop-frame applies only at 29.97 and 59.94 fps" });
  }
}

/** Body of POST /api/channels/{channelId}/episodes, and the new-episode form. */
export const episodeCreateSchema = z
  .object({
    ...episodeFields,
    summary: episodeFields.summary.default(""),
    targetRuntimeSeconds: episodeFields.targetRuntimeSeconds.default(null),
    publishDate: episodeFields.publishDate.default(null),
    frameRate: episodeFields.frameRate.default("29.97"),
    dropFrame: episodeFields.dropFrame.default(false),
    stage: stageSchema.default("idea"),
  })
  .strict()
  .superRefine(dropFrameRule)
  .meta({ id: "EpisodeCreate" });
export type EpisodeCreateInput = z.input<typeof episodeCreateSchema>;
export type EpisodeCreate = z.output<typeof episodeCreateSchema>;

/** Body of PATCH /api/episodes/{episodeId}: any field, plus a move (stage and/or position). */
export const episodeUpdateSchema = z
  .object({
    title: episodeFields.title,
    summary: episodeFields.summary,
    targetRuntimeSeconds: episodeFields.targetRuntimeSeconds,
    publishDate: episodeFields.publishDate,
    frameRate: episodeFields.frameRate,
    dropFrame: episodeFields.dropFrame,
    stage: stageSchema,
    position: z.number().int("must be a whole number").min(0, "must be 0 or more").max(100000),
    presenterId: z.uuid({ message: "must be a member's id" }).nullable(),
    /** Why an owner publishes while the checklist fails; recorded with what was failing. */
    publishOverride: z.string().trim().min(10, "say why, in at least 10 characters").max(1000, "at most 1,000 characters"),
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .refine((v) => v.publishOverride === undefined || v.stage === "published", { message: "an override goes with a move to published", path: ["publishOverride"] })
  .superRefine(dropFrameRule)
  .meta({ id: "EpisodeUpdate" });
export type EpisodeUpdate = z.output<typeof episodeUpdateSchema>;

/** Query of GET /api/channels/{channelId}/episodes. */
export const episodeListQuerySchema = z
  .object({
    stage: stageSchema.optional(),
    month: z.string().regex(/^\d{4}-(0[1-9]|1[0-2])$/, "use the form YYYY-MM").optional(),
    archived: z.enum(["true", "false"]).optional(),
  })
  .strict();
export type EpisodeListQuery = z.infer<typeof episodeListQuerySchema>;

export const episodeSchema = z
  .object({
    id: z.string(),
    channelId: z.string(),
    title: z.string(),
    summary: z.string(),
    stage: stageSchema,
    position: z.number().int(),
    targetRuntimeSeconds: z.number().int().nullable(),
    publishDate: z.string().nullable(),
    frameRate: frameRateSchema,
    dropFrame: z.boolean(),
    presenterId: z.string().nullable(),
    createdBy: z.string().nullable(),
    updatedBy: z.string().nullable(),
    createdAt: z.string(),
    updatedAt: z.string(),
    archivedAt: z.string().nullable(),
    /** Estimated script runtime (board list only). */
    scriptSeconds: z.number().nullable().optional(),
    /** Open B-roll gaps (board list only; null without a script). */
    openGaps: z.number().nullable().optional(),
    shotsDone: z.number().optional(),
    shotsTotal: z.number().optional(),
    /** Sponsor checks (board list only; absent with nothing to check). */
    sponsorState: z.enum(["met", "open", "blocked"]).optional(),
  })
  .meta({ id: "Episode" });
export type EpisodeDto = z.infer<typeof episodeSchema>;

/** "14" → 840, "14:30" → 870, "" → null, anything else → NaN (the schema then names the field). */
export function minutesTextToSeconds(text: string): number | null {
  const t = text.trim();
  if (!t) return null;
  const m = /^(\d{1,3})(?::([0-5]\d))?$/.exec(t);
  if (!m) return Number.NaN;
  return Number(m[1]) * 60 + (m[2] ? Number(m[2]) : 0);
}

export function secondsToMinutesText(seconds: number | null): string {
  if (seconds == null) return "";
  const m = Math.floor(seconds / 60);
  const s = seconds % 60;
  return s ? `${m}:${String(s).padStart(2, "0")}` : String(m);
}
