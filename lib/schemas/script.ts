import { z } from "zod";
import { SEGMENT_KINDS, MIN_WPM, MAX_WPM } from "../script-timing";
import { FRAME_RATE_IDS, type FrameRateId } from "../frame-rate";

const frames = (what: string) => z.number({ message: `${what} must be a whole number of frames` }).int(`${what} must be whole frames`).min(0, `${what} cannot be negative`).max(10 * 3600 * 60, `${what} is longer than 10 hours`);

const segmentFields = {
  kind: z.enum(SEGMENT_KINDS),
  text: z.string().max(20000, "keep a segment under 20,000 characters; split it"),
  stepId: z.uuid({ message: "must be a valid step id" }).nullable(),
  pinnedStartFrame: frames("pinned start").nullable(),
  explicitDurationFrames: frames("duration").nullable(),
  editorNotes: z.string().max(4000),
  chapterStart: z.boolean(),
  chapterTitle: z.string().trim().max(100, "keep chapter titles under 100 characters").nullable(),
};

/** Fields an editor may change: notes to the editor and chapter flags. */
export const ANNOTATION_FIELDS = ["editorNotes", "chapterStart", "chapterTitle"] as const;

export const segmentCreateSchema = z
  .object({
    afterId: z.uuid({ message: "must be a valid segment id" }).nullable().default(null),
    kind: segmentFields.kind.default("voice_over"),
    text: segmentFields.text.default(""),
    stepId: segmentFields.stepId.default(null),
    pinnedStartFrame: segmentFields.pinnedStartFrame.default(null),
    explicitDurationFrames: segmentFields.explicitDurationFrames.default(null),
    editorNotes: segmentFields.editorNotes.default(""),
    chapterStart: segmentFields.chapterStart.default(false),
    chapterTitle: segmentFields.chapterTitle.default(null),
  })
  .strict()
  .meta({ id: "SegmentCreate" });
export type SegmentCreate = z.output<typeof segmentCreateSchema>;

/** Every save names the version it was based on; a stale one is refused with 409 and the newer text. */
export const segmentSaveSchema = z
  .object({
    version: z.number({ message: "send the version this edit is based on" }).int().min(1),
    ...Object.fromEntries(Object.entries(segmentFields).map(([k, v]) => [k, v.optional()])),
  })
  .strict()
  .refine((v) => Object.keys(v).length > 1, { message: "send at least one field to change" })
  .meta({ id: "SegmentSave" }) as unknown as z.ZodType<SegmentSave>;
export type SegmentSave = { version: number } & Partial<{
  kind: (typeof SEGMENT_KINDS)[number];
  text: string;
  stepId: string | null;
  pinnedStartFrame: number | null;
  explicitDurationFrames: number | null;
  editorNotes: string;
  chapterStart: boolean;
  chapterTitle: string | null;
}>;

export const segmentSplitSchema = z
  .object({
    version: z.number().int().min(1),
    before: z.string().max(20000),
    after: z.string().max(20000),
  })
  .strict()
  .meta({ id: "SegmentSplit" });

export const segmentJoinSchema = z
  .object({ version: z.number().int().min(1), nextVersion: z.number().int().min(1) })
  .strict()
  .meta({ id: "SegmentJoin" });

export const segmentOrderSchema = z
  .object({ ids: z.array(z.uuid()).min(1, "send the segments in their new order").refine((a) => new Set(a).size === a.length, "list each once") })
  .strict()
  .meta({ id: "SegmentOrder" });

export const timingQuerySchema = z
  .object({
    rate: z.enum(FRAME_RATE_IDS as [FrameRateId, ...FrameRateId[]]).optional(),
    dropFrame: z.enum(["true", "false"]).optional(),
  })
  .strict();

export const exportQuerySchema = z.object({ format: z.enum(["text", "json"]).default("text") }).strict();

export const readingRateSchema = z
  .object({ readingRateWpm: z.number().int("whole words a minute").min(MIN_WPM, `at least ${MIN_WPM} words a minute`).max(MAX_WPM, `at most ${MAX_WPM} words a minute`) })
  .strict()
  .meta({ id: "ReadingRate" });

// ---- Responses: one schema per resource, used by the views (typed), the OpenAPI document and the browser.

export const segmentSchema = z
  .object({
    id: z.string(),
    position: z.number(),
    kind: z.enum(SEGMENT_KINDS),
    text: z.string(),
    stepId: z.string().nullable(),
    pinnedStartFrame: z.number().nullable(),
    explicitDurationFrames: z.number().nullable(),
    editorNotes: z.string(),
    chapterStart: z.boolean(),
    chapterTitle: z.string().nullable(),
    version: z.number(),
    updatedBy: z.string().nullable(),
    updatedAt: z.string(),
  })
  .meta({ id: "Segment" });
export type SegmentDto = z.infer<typeof segmentSchema>;

export const segmentTimingSchema = z.object({
  start: z.number(),
  end: z.number(),
  duration: z.number(),
  estimatedStart: z.number(),
  drift: z.number().nullable(),
  words: z.number(),
  source: z.enum(["explicit", "reading", "caption"]),
  startTimecode: z.string(),
  endTimecode: z.string(),
  durationSeconds: z.number(),
});
export const chaptersSchema = z.object({
  chapters: z.array(z.object({ segmentId: z.string(), title: z.string(), startSeconds: z.number(), line: z.string(), problems: z.array(z.string()) })),
  problems: z.array(z.string()),
  valid: z.boolean(),
  text: z.string(),
});
export const totalsSchema = z.object({
  frames: z.number(),
  timecode: z.string(),
  seconds: z.number(),
  targetFrames: z.number().nullable(),
  overFrames: z.number().nullable(),
  overSeconds: z.number().nullable(),
  byKind: z.record(z.string(), z.number()),
  byStep: z.record(z.string(), z.number()),
});
export const rateSchema = z.object({ id: z.enum(FRAME_RATE_IDS as [FrameRateId, ...FrameRateId[]]), dropFrame: z.boolean(), num: z.number(), den: z.number() });
export const timedSegmentSchema = segmentSchema.extend({ timing: segmentTimingSchema });
export const scriptSchema = z
  .object({ rate: rateSchema, wordsPerMinute: z.number(), segments: z.array(timedSegmentSchema), totals: totalsSchema, chapters: chaptersSchema })
  .meta({ id: "Script" });
export type ScriptDto = z.infer<typeof scriptSchema>;
