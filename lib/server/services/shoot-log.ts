import "server-only";
/** The shoot log: notes taken while filming, stored once per device id; a note becomes a voice-over segment or a pickup shot, keeping the link. */
import type { NoteCreate } from "../../schemas/shoot-log";
import { AppError } from "../http/errors";
import { db } from "../../../db/client";
import type { Episode, ShootLogNote } from "../../../db/schema";
import { lockEpisode } from "../../../db/queries/episode-lock";
import { insertNoteOnce, lockNote, noteLinksBelong, updateNoteRow } from "../../../db/queries/shoot-log";
import { countShots, insertShots } from "../../../db/queries/shots";
import { createSegmentIn } from "./script";

/** Stores the note; `created` is false when this id was stored before (the same note again). */
export async function addNote({ episode, userId, input }: { episode: Episode; userId: string; input: NoteCreate }): Promise<{ note: ShootLogNote; created: boolean }> {
  const bad = await noteLinksBelong({ episodeId: episode.id, channelId: episode.channelId, stepId: input.stepId, clipId: input.clipId, shootDayId: input.shootDayId });
  if (bad) throw new AppError(`unprocessable:note.${bad}`, "That link is not part of this episode.", { fields: { [bad]: [bad === "shootDayId" ? "not a shoot day of this channel" : "not in this episode"] } });
  return db().transaction(async (tx) => {
    const row = await insertNoteOnce(tx, { id: input.id, episodeId: episode.id, text: input.text, stepId: input.stepId, clipId: input.clipId, shootDayId: input.shootDayId, authorId: userId, notedAt: input.notedAt ? new Date(input.notedAt) : new Date() });
    if (row) return { note: row, created: true };
    const existing = await lockNote(tx, input.id);
    // The same id from another episode is not a retry of this note.
    if (!existing || existing.episodeId !== episode.id) throw new AppError("conflict:note.id", "That note id is taken. Make a new one.");
    return { note: existing, created: false };
  });
}

/** A voice-over segment with the note's words, after `afterId` (or at the end); the note keeps the link. */
export async function noteToScript({ note, userId, afterId }: { note: ShootLogNote; userId: string; afterId: string | null }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, note.episodeId);
    const current = (await lockNote(tx, note.id))!;
    if (current.segmentId) throw new AppError("conflict:note.segment", "This note is in the script already.");
    const made = await createSegmentIn(tx, { episodeId: note.episodeId, userId, input: { afterId, kind: "voice_over", text: current.text, stepId: current.stepId, pinnedStartFrame: null, explicitDurationFrames: null, editorNotes: "From the shoot log", chapterStart: false, chapterTitle: null } });
    if ("error" in made) throw new AppError("unprocessable:note.afterId", "That segment is not in this episode.", { fields: { afterId: ["not in this episode"] } });
    const updated = (await updateNoteRow(tx, note.id, { segmentId: made.segment.id }))!;
    return { note: updated, segment: made.segment };
  });
}

/** A pickup shot on the shot list with the note's words and step; the note keeps the link. */
export async function noteToPickup({ note }: { note: ShootLogNote }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, note.episodeId);
    const current = (await lockNote(tx, note.id))!;
    if (current.shotId) throw new AppError("conflict:note.shot", "This note has a pickup shot already.");
    const n = await countShots(tx, note.episodeId);
    const [shot] = await insertShots(tx, [{ episodeId: note.episodeId, kind: "pickup", description: current.text.slice(0, 500), stepId: current.stepId, shootDayId: null, position: n, priority: 2 }]);
    const updated = (await updateNoteRow(tx, note.id, { shotId: shot!.id }))!;
    return { note: updated, shot: shot! };
  });
}
