import { z } from "zod";
import { CHECKLIST_KEYS, THUMBNAIL_MAX_BYTES, THUMBNAIL_TYPES } from "../publish";
import { STAGES } from "../stages";

const sectionsSchema = z.object({ chapters: z.boolean(), credits: z.boolean(), materials: z.boolean(), safety: z.boolean() }).strict();

/**
 * Body of PATCH /api/episodes/{episodeId}/publish. Texts over the platform's
 * limits may be saved (the checklist says what is wrong), but not without bound.
 */
export const publishUpdateSchema = z
  .object({
    title: z.string().max(500, "at most 500 characters"),
    summary: z.string().max(20000, "at most 20,000 characters"),
    closing: z.string().max(10000, "at most 10,000 characters"),
    sections: sectionsSchema.partial(),
    thumbnailAdLabel: z.boolean(),
  })
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .meta({ id: "PublishUpdate" });
export type PublishUpdate = z.output<typeof publishUpdateSchema>;

/** Body of POST /api/episodes/{episodeId}/publish/thumbnail-upload. */
export const thumbnailUploadSchema = z
  .object({
    contentType: z.enum(THUMBNAIL_TYPES, { message: "use a JPEG or PNG image" }),
    size: z.number().int().min(1, "the file is empty").max(THUMBNAIL_MAX_BYTES, "a thumbnail can be at most 2 MB"),
  })
  .strict()
  .meta({ id: "ThumbnailUpload" });

/** Body of PUT /api/episodes/{episodeId}/publish/thumbnail: the key the upload was issued. */
export const thumbnailSetSchema = z.object({ key: z.string().min(1, "the uploaded file's key").max(400) }).strict().meta({ id: "ThumbnailSet" });

/** Body of PUT /api/episodes/{episodeId}/publish/script-final. */
export const scriptFinalSchema = z.object({ final: z.boolean() }).strict().meta({ id: "ScriptFinal" });

const checklistItemSchema = z.object({ key: z.enum(CHECKLIST_KEYS), label: z.string(), pass: z.boolean(), detail: z.string(), tab: z.string(), action: z.enum(["mark_final"]).nullable() });
export const checklistSchema = z.object({ items: z.array(checklistItemSchema), pass: z.boolean(), failing: z.array(z.enum(CHECKLIST_KEYS)) }).meta({ id: "PublishChecklist" });
export type ChecklistDto = z.infer<typeof checklistSchema>;

export const publishSchema = z
  .object({
    stage: z.enum(STAGES),
    package: z.object({
      title: z.string(),
      summary: z.string(),
      closing: z.string(),
      sections: sectionsSchema,
      thumbnailUrl: z.string().nullable(),
      thumbnailAdLabel: z.boolean(),
      scriptFinalAt: z.string().nullable(),
    }),
    parts: z.object({ disclosures: z.array(z.string()), chapters: z.string(), credits: z.array(z.string()), materials: z.array(z.string()), safety: z.string().nullable() }),
    description: z.string(),
    texts: z.object({ titleChars: z.number(), descriptionBytes: z.number(), descriptionChars: z.number(), problems: z.array(z.object({ field: z.enum(["title", "description", "chapters", "thumbnail"]), message: z.string() })) }),
    chapters: z.object({ valid: z.boolean(), problems: z.array(z.string()), lines: z.array(z.object({ line: z.string(), problems: z.array(z.string()) })) }),
    adLabel: z.object({ needed: z.boolean(), inTitle: z.boolean(), onThumbnail: z.boolean() }),
    checklist: checklistSchema,
    overrides: z.array(z.object({ id: z.string(), userName: z.string().nullable(), reason: z.string(), failing: z.array(z.string()), createdAt: z.string() })),
    limits: z.object({ titleMaxChars: z.number(), descriptionMaxBytes: z.number(), thumbnailMaxBytes: z.number() }),
  })
  .meta({ id: "PublishPackage" });
export type PublishDto = z.infer<typeof publishSchema>;

/** GET /api/channels/{channelId}/overview: the channel at a glance; every row names the record it links to. */
export const overviewSchema = z
  .object({
    today: z.string(),
    pipeline: z.array(z.object({ stage: z.enum(STAGES), label: z.string(), count: z.number() })),
    shootDays: z.array(z.object({ id: z.string(), date: z.string(), status: z.string(), episodeId: z.string().nullable(), episodeTitle: z.string().nullable() })),
    publishing: z.array(z.object({ episodeId: z.string(), title: z.string(), publishDate: z.string(), stage: z.enum(STAGES) })),
    openGaps: z.array(z.object({ episodeId: z.string(), title: z.string(), openGaps: z.number() })),
    deliverables: z.array(z.object({ dealId: z.string(), dealTitle: z.string(), sponsorName: z.string(), what: z.enum(["script", "review", "publish_window", "return"]), due: z.string(), episodes: z.array(z.object({ id: z.string(), title: z.string(), state: z.enum(["none", "met", "open", "blocked"]).nullable() })) })),
    runtime: z.array(z.object({ episodeId: z.string(), title: z.string(), stage: z.enum(STAGES), scriptSeconds: z.number().nullable(), targetSeconds: z.number().nullable() })),
  })
  .meta({ id: "ChannelOverview" });
export type OverviewDto = z.infer<typeof overviewSchema>;

/** Query of POST /api/channels/import. */
export const importQuerySchema = z.object({ name: z.string().trim().min(1, "give the new channel a name").max(120, "at most 120 characters").optional() }).strict().meta({ id: "ImportQuery" });
