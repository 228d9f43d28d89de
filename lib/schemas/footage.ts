import { z } from "zod";
import { rateSchema } from "./script";
import { SEGMENT_KINDS } from "../script-timing";

export const SHOT_KINDS = ["to_camera", "broll", "overhead", "close_up", "insert", "time_lapse", "slow_motion", "pickup"] as const;
export type ShotKind = (typeof SHOT_KINDS)[number];
export const SHOT_KIND_LABELS: Record<ShotKind, string> = {
  to_camera: "To camera",
  broll: "B-roll",
  overhead: "Overhead",
  close_up: "Close-up",
  insert: "Insert",
  time_lapse: "Time-lapse",
  slow_motion: "Slow motion",
  pickup: "Pickup",
};
/** "waived": the team decided the shot is not needed; the publish checklist counts it as done. */
export const SHOT_STATUSES = ["planned", "captured", "selected", "rejected", "waived"] as const;
export type ShotStatus = (typeof SHOT_STATUSES)[number];
export const SHOT_STATUS_LABELS: Record<ShotStatus, string> = { planned: "Planned", captured: "Captured", selected: "Selected", rejected: "Rejected", waived: "Not needed" };

/** Footage, sound and stills the store accepts; anything else is refused before a byte moves. */
export const MEDIA_TYPES = [
  "video/mp4",
  "video/quicktime",
  "video/webm",
  "video/x-matroska",
  "video/x-msvideo",
  "video/mpeg",
  "application/mxf",
  "audio/wav",
  "audio/x-wav",
  "audio/mpeg",
  "audio/mp4",
  "audio/aac",
  "audio/flac",
  "image/jpeg",
  "image/png",
  "image/webp",
  "image/tiff",
] as const;

const id = (what: string) => z.uuid({ message: `must be a valid ${what} id` });

const shotFields = {
  kind: z.enum(SHOT_KINDS),
  description: z.string().trim().max(2000),
  framing: z.string().trim().max(200),
  cameraNotes: z.string().trim().max(1000),
  priority: z.number().int().min(1, "1 (must have) to 3 (nice to have)").max(3, "1 (must have) to 3 (nice to have)"),
  status: z.enum(SHOT_STATUSES),
  stepId: id("step").nullable(),
  segmentId: id("segment").nullable(),
  shootDayId: id("shoot day").nullable(),
};

export const shotCreateSchema = z
  .object({
    ...shotFields,
    kind: shotFields.kind.default("broll"),
    description: shotFields.description.min(1, "say what the shot shows"),
    framing: shotFields.framing.default(""),
    cameraNotes: shotFields.cameraNotes.default(""),
    priority: shotFields.priority.default(2),
    status: shotFields.status.default("planned"),
    stepId: shotFields.stepId.default(null),
    segmentId: shotFields.segmentId.default(null),
    shootDayId: shotFields.shootDayId.default(null),
  })
  .strict()
  .meta({ id: "ShotCreate" });
export type ShotCreate = z.output<typeof shotCreateSchema>;

export const shotUpdateSchema = z
  .object(shotFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .meta({ id: "ShotUpdate" });
export type ShotUpdate = z.output<typeof shotUpdateSchema>;

export const shotBulkSchema = z
  .object({ ids: z.array(id("shot")).min(1, "select at least one shot").max(1000), status: z.enum(SHOT_STATUSES) })
  .strict()
  .meta({ id: "ShotBulkStatus" });

/**
 * A file name is kept only as a label: no folders, no control characters, and
 * no bidirectional controls (U+061C, U+200E/F, U+202A-E, U+2066-9), which can
 * make "clip_gpj.mp4" read as something else.
 */
export const fileNameSchema = z
  .string()
  .trim()
  .min(1, "the file needs a name")
  .max(255, "file names can be at most 255 characters")
  .refine((n) => !/[\\/]/.test(n) && !/[\u0000-\u001f\u007f]/.test(n) && n !== "." && n !== "..", "file names cannot contain folders (/ or \\) or control characters")
  .refine((n) => !/[\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/.test(n), "file names cannot contain right-to-left or other direction controls");

export function uploadCreateSchema(maxBytes: number) {
  return z
    .object({
      fileName: fileNameSchema,
      size: z.number({ message: "send the file size in bytes" }).int("size must be whole bytes").min(1, "the file is empty (0 bytes)").max(maxBytes, `files can be at most ${formatBytes(maxBytes)}`),
      contentType: z.enum(MEDIA_TYPES, { message: "only video, audio and image files are accepted" }),
      shotId: id("shot").nullable().default(null),
    })
    .strict()
    .meta({ id: "UploadCreate" });
}

export const partsRequestSchema = z
  .object({ partNumbers: z.array(z.number().int("part numbers are whole numbers").min(1, "part numbers start at 1").max(10_000)).min(1).max(100, "ask for at most 100 parts at a time") })
  .strict()
  .meta({ id: "PartsRequest" });

export const clipUpdateSchema = z
  .object({
    shotId: id("shot").nullable(),
    inFrame: z.number().int().min(0).nullable(),
    outFrame: z.number().int().min(1).nullable(),
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .refine((v) => v.inFrame == null || v.outFrame == null || v.outFrame > v.inFrame, { message: "the out point must come after the in point", path: ["outFrame"] })
  .meta({ id: "ClipUpdate" });

const frame = z.number().int("whole frames").min(0, "cannot be negative").max(10 * 3600 * 60);

export const coverageRangeSchema = z
  .object({
    clipId: id("clip").nullable().default(null),
    startFrame: frame,
    endFrame: frame.nullable().default(null),
    note: z.string().max(500).default(""),
  })
  .strict()
  .refine((v) => v.clipId || v.endFrame != null, { message: "a marked range needs an end", path: ["endFrame"] })
  .refine((v) => v.endFrame == null || v.endFrame > v.startFrame, { message: "the end must come after the start", path: ["endFrame"] })
  .meta({ id: "CoverageRangeCreate" });

export const gapCreateSchema = z
  .object({
    startFrame: frame,
    endFrame: frame,
    note: z.string().max(500).default(""),
    /** Marked by hand, or a computed gap being kept (to dismiss, resolve or pick up). */
    source: z.enum(["marked", "computed"]).default("marked"),
    status: z.enum(["open", "resolved", "dismissed"]).default("open"),
    segmentId: id("segment").nullable().default(null),
    reason: z.enum(["voice_over", "to_camera"]).nullable().default(null),
  })
  .strict()
  .refine((v) => v.endFrame > v.startFrame, { message: "the end must come after the start", path: ["endFrame"] })
  .meta({ id: "GapCreate" });
export type GapCreate = z.output<typeof gapCreateSchema>;

export const gapUpdateSchema = z
  .object({ status: z.enum(["open", "resolved", "dismissed"]), note: z.string().max(500) })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .meta({ id: "GapUpdate" });

/** Turns a stored gap (gapId), or a computed one given by its frames, into a pickup shot. */
export const pickupCreateSchema = z
  .object({
    gapId: z.uuid({ message: "must be a valid gap id" }).nullable().default(null),
    startFrame: frame.optional(),
    endFrame: frame.optional(),
    segmentId: z.uuid({ message: "must be a valid segment id" }).nullable().default(null),
    reason: z.enum(["voice_over", "to_camera"]).nullable().default(null),
    description: z.string().trim().max(2000).optional(),
    kind: z.enum(SHOT_KINDS).default("pickup"),
  })
  .strict()
  .refine((v) => v.gapId || (v.startFrame != null && v.endFrame != null && v.endFrame > v.startFrame), { message: "name a stored gap, or the start and end of a computed one", path: ["gapId"] })
  .meta({ id: "PickupCreate" });

export function formatBytes(n: number): string {
  const units = ["B", "KiB", "MiB", "GiB", "TiB"];
  let i = 0;
  let v = n;
  while (v >= 1024 && i < units.length - 1) {
    v /= 1024;
    i++;
  }
  return `${Number.isInteger(v) ? v : v.toFixed(1)} ${units[i]}`;
}

// ---- Responses: one schema per resource, used by the views (typed), the OpenAPI document and the browser.

export const shotSchema = z
  .object({ id: z.string(), kind: z.enum(SHOT_KINDS), description: z.string(), framing: z.string(), cameraNotes: z.string(), priority: z.number(), status: z.enum(SHOT_STATUSES), stepId: z.string().nullable(), segmentId: z.string().nullable(), shootDayId: z.string().nullable(), gapId: z.string().nullable(), position: z.number() })
  .meta({ id: "Shot" });
export type ShotDto = z.infer<typeof shotSchema>;

export const clipSchema = z
  .object({
    id: z.string(),
    episodeId: z.string(),
    shotId: z.string().nullable(),
    state: z.enum(["uploading", "stored"]),
    originalName: z.string(),
    sizeBytes: z.number(),
    partSize: z.number().nullable(),
    contentType: z.string(),
    durationMs: z.number().nullable(),
    frameRate: z.string().nullable(),
    width: z.number().nullable(),
    height: z.number().nullable(),
    startTimecode: z.string().nullable(),
    checksum: z.string().nullable(),
    inFrame: z.number().nullable(),
    outFrame: z.number().nullable(),
    createdAt: z.string(),
  })
  .meta({ id: "Clip" });
export type ClipDto = z.infer<typeof clipSchema>;

export const gapViewSchema = z.object({
  id: z.string().nullable(),
  key: z.string(),
  source: z.enum(["computed", "marked"]),
  reason: z.string().nullable(),
  status: z.enum(["open", "resolved", "dismissed"]),
  startFrame: z.number(),
  endFrame: z.number(),
  startTimecode: z.string(),
  endTimecode: z.string(),
  segmentId: z.string().nullable(),
  note: z.string(),
  pickupShotId: z.string().nullable(),
});
export const coverageSchema = z
  .object({
    rate: rateSchema,
    totalFrames: z.number(),
    segments: z.array(z.object({ id: z.string(), kind: z.enum(SEGMENT_KINDS), stepId: z.string().nullable(), text: z.string(), start: z.number(), end: z.number(), startTimecode: z.string(), endTimecode: z.string() })),
    thresholds: z.object({ voiceOverGapFrames: z.number(), toCameraMaxFrames: z.number() }),
    gaps: z.array(gapViewSchema),
    openGaps: z.number(),
    voiceOverFrames: z.number(),
    coveredVoiceOverFrames: z.number(),
    coverage: z.number(),
    ranges: z.array(z.object({ id: z.string(), clipId: z.string().nullable(), clipInFrame: z.number(), startFrame: z.number(), endFrame: z.number(), startTimecode: z.string(), endTimecode: z.string(), note: z.string() })),
  })
  .meta({ id: "Coverage" });
export type CoverageDto = z.infer<typeof coverageSchema>;
