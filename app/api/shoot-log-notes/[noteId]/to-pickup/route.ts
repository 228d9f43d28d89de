import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { noteToPickup } from "@/lib/server/services/shoot-log";
import { toNoteDto } from "@/lib/server/views/shoot-log";
import { toShotDto } from "@/lib/server/views/shots";

/** The note becomes a pickup shot on the shot list, with the note's step; the note keeps the link. */
export const POST = channelRoute({ load: "note", action: "shots.edit" }, async ({ note }) => {
  const made = await noteToPickup({ note });
  return json({ note: toNoteDto(made.note, null), shot: toShotDto(made.shot) }, 201);
});
