import { z } from "zod";

/**
 * Body of POST /api/episodes/{episodeId}/shoot-log. The id is made on the
 * device when the note is written, so a note sent twice (an offline queue
 * retrying) is stored once.
 */
export const noteCreateSchema = z
  .object({
    id: z.uuid({ message: "a note id made on the device (a UUID)" }),
    text: z.string().trim().min(1, "write the note").max(4000, "at most 4,000 characters"),
    notedAt: z.iso.datetime({ offset: true, message: "an ISO 8601 time with its offset" }).optional(),
    stepId: z.uuid({ message: "must be a step of this episode" }).nullable().default(null),
    clipId: z.uuid({ message: "must be a clip of this episode" }).nullable().default(null),
    shootDayId: z.uuid({ message: "must be a shoot day of this channel" }).nullable().default(null),
  })
  .strict()
  .meta({ id: "ShootLogNoteCreate" });
export type NoteCreate = z.output<typeof noteCreateSchema>;

/** Body of POST /api/shoot-log-notes/{noteId}/to-script: where the voice-over goes. */
export const noteToScriptSchema = z.object({ afterId: z.uuid({ message: "must be a segment of this episode" }).nullable().default(null) }).strict().meta({ id: "NoteToScript" });

export const noteSchema = z
  .object({
    id: z.string(),
    episodeId: z.string(),
    text: z.string(),
    notedAt: z.string(),
    receivedAt: z.string(),
    authorName: z.string().nullable(),
    stepId: z.string().nullable(),
    clipId: z.string().nullable(),
    shootDayId: z.string().nullable(),
    segmentId: z.string().nullable(),
    shotId: z.string().nullable(),
  })
  .meta({ id: "ShootLogNote" });
export type NoteDto = z.infer<typeof noteSchema>;

/** Query of GET /api/channels/{channelId}/live. */
export const liveQuerySchema = z
  .object({
    episodeId: z.uuid({ message: "must be an episode of this channel" }).optional(),
    lastEventId: z.coerce.number().int().min(0).optional(),
  })
  .strict()
  .meta({ id: "LiveQuery" });

/** Body of POST /api/episodes/{episodeId}/presence: the segment I am editing, or none. */
export const presenceSchema = z.object({ segmentId: z.uuid({ message: "must be a segment of this episode" }).nullable() }).strict().meta({ id: "Presence" });
