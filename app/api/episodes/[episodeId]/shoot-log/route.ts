import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { noteCreateSchema } from "@/lib/schemas/shoot-log";
import { listNotesByEpisode } from "@/db/queries/shoot-log";
import { addNote } from "@/lib/server/services/shoot-log";
import { toNoteDto } from "@/lib/server/views/shoot-log";

/** The episode's shoot log, newest first. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  const rows = await listNotesByEpisode({ episodeId: episode.id });
  return json({ notes: rows.map((r) => toNoteDto(r.note, r.authorName)) });
});

/** Adds a note under the id the device made: 201 the first time, 200 with the stored note when the same id comes again. */
export const POST = channelRoute({ load: "episode", action: "shootlog.write", body: noteCreateSchema, what: "note" }, async ({ episode, user, body }) => {
  const { note, created } = await addNote({ episode, userId: user.id, input: body });
  return json({ note: toNoteDto(note, user.name), created }, created ? 201 : 200);
});
