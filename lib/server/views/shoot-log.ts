import "server-only";
import type { NoteDto } from "../../schemas/shoot-log";
import type { ShootLogNote } from "../../../db/schema";

export function toNoteDto(n: ShootLogNote, authorName: string | null): NoteDto {
  return {
    id: n.id,
    episodeId: n.episodeId,
    text: n.text,
    notedAt: n.notedAt.toISOString(),
    receivedAt: n.receivedAt.toISOString(),
    authorName,
    stepId: n.stepId,
    clipId: n.clipId,
    shootDayId: n.shootDayId,
    segmentId: n.segmentId,
    shotId: n.shotId,
  };
}
