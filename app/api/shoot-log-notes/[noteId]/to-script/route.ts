import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { noteToScriptSchema } from "@/lib/schemas/shoot-log";
import { noteToScript } from "@/lib/server/services/shoot-log";
import { toNoteDto } from "@/lib/server/views/shoot-log";
import { toSegmentDto } from "@/lib/server/views/script";

/** The note becomes a voice-over segment in the script (after `afterId`, or at the end); the note keeps the link. */
export const POST = channelRoute({ load: "note", action: "script.write", body: noteToScriptSchema, what: "note" }, async ({ note, user, body }) => {
  const made = await noteToScript({ note, userId: user.id, afterId: body.afterId });
  return json({ note: toNoteDto(made.note, null), segment: toSegmentDto(made.segment) }, 201);
});
