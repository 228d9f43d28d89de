import "server-only";
/**
 * Script writes. No lost edits: every change names the version it was based
 * on and is refused (nothing written, the stored segment returned) when
 * someone saved in between. Each write locks the episode first, then the
 * segment rows, and records a revision.
 */
import { joinSegmentTexts } from "../../script-timing";
import type { SegmentCreate, SegmentSave } from "../../schemas/script";
import { AppError } from "../http/errors";
import { db, type Tx } from "../../../db/client";
import { lockEpisode } from "../../../db/queries/episode-lock";
import {
  deleteSegmentRow,
  episodeOfSegment,
  getRevision,
  insertSegment,
  lockSegment,
  orderedSegmentIds,
  updateSegmentRow,
  writeRevision,
  writeSegmentPositions,
  type Segment,
  type SegmentSnapshot,
} from "../../../db/queries/script";

/** Locks the segment's episode, then the segment: the one lock order of content writes. */
async function lockedSegment(tx: Tx, id: string) {
  const episodeId = await episodeOfSegment(tx, id);
  if (!episodeId) return null;
  await lockEpisode(tx, episodeId);
  return lockSegment(tx, id);
}

export async function createSegment({ episodeId, userId, input }: { episodeId: string; userId: string; input: SegmentCreate }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    return createSegmentIn(tx, { episodeId, userId, input });
  });
}

/** Inserts a segment after `afterId` (or at the end) inside a transaction that already holds the episode lock. */
export async function createSegmentIn(tx: Tx, { episodeId, userId, input }: { episodeId: string; userId: string; input: SegmentCreate }) {
  const ids = await orderedSegmentIds(tx, episodeId);
  const { afterId, ...fields } = input;
  if (afterId && !ids.includes(afterId)) return { error: "after_not_found" as const };
  const row = await insertSegment(tx, { ...fields, episodeId, position: ids.length, updatedBy: userId });
  const at = afterId ? ids.indexOf(afterId) + 1 : ids.length;
  ids.splice(at, 0, row.id);
  await writeSegmentPositions(tx, ids);
  await writeRevision(tx, episodeId, row.id, userId, null, row);
  return { segment: { ...row, position: at } };
}

/** Saves fields only if the stored version is the one the edit was based on. */
export async function saveSegment({ id, userId, save }: { id: string; userId: string; save: SegmentSave }) {
  return db().transaction(async (tx) => {
    const current = await lockedSegment(tx, id);
    if (!current) return { missing: true as const };
    if (current.version !== save.version) return { conflict: current };
    const { version, ...fields } = save;
    const after = (await updateSegmentRow(tx, id, { ...fields, version: version + 1, updatedBy: userId }, version))!;
    await writeRevision(tx, current.episodeId, id, userId, current, after);
    return { segment: after };
  });
}

/** Splits at the cursor: this segment keeps `before`, a new one right after it gets `after`. */
export async function splitSegment({ id, userId, version, before, after }: { id: string; userId: string; version: number; before: string; after: string }) {
  return db().transaction(async (tx) => {
    const current = await lockedSegment(tx, id);
    if (!current) return { missing: true as const };
    if (current.version !== version) return { conflict: current };
    const first = (await updateSegmentRow(tx, id, { text: before, version: version + 1, updatedBy: userId }))!;
    const second = await insertSegment(tx, { episodeId: current.episodeId, position: current.position + 1, kind: current.kind, text: after, stepId: current.stepId, updatedBy: userId });
    const ids = (await orderedSegmentIds(tx, current.episodeId)).filter((x) => x !== second.id);
    ids.splice(ids.indexOf(id) + 1, 0, second.id);
    await writeSegmentPositions(tx, ids);
    await writeRevision(tx, current.episodeId, id, userId, current, first);
    await writeRevision(tx, current.episodeId, second.id, userId, null, second);
    return { first, second };
  });
}

/** Appends the next segment's text to this one and removes the next; both versions must be current. */
export async function joinWithNext({ id, userId, version, nextVersion }: { id: string; userId: string; version: number; nextVersion: number }) {
  return db().transaction(async (tx) => {
    const current = await lockedSegment(tx, id);
    if (!current) return { missing: true as const };
    const ids = await orderedSegmentIds(tx, current.episodeId);
    const nextId = ids[ids.indexOf(id) + 1];
    if (!nextId) return { noNext: true as const };
    const next = (await lockSegment(tx, nextId))!;
    if (current.version !== version) return { conflict: current };
    if (next.version !== nextVersion) return { conflict: next };
    const joined = (await updateSegmentRow(tx, id, { text: joinSegmentTexts(current.text, next.text), version: version + 1, updatedBy: userId }))!;
    await deleteSegmentRow(tx, nextId);
    await writeSegmentPositions(tx, ids.filter((x) => x !== nextId));
    await writeRevision(tx, current.episodeId, id, userId, current, joined);
    await writeRevision(tx, current.episodeId, nextId, userId, next, null);
    return { segment: joined };
  });
}

export async function deleteSegment({ id, userId }: { id: string; userId: string }) {
  return db().transaction(async (tx) => {
    const current = await lockedSegment(tx, id);
    if (!current) return null;
    await deleteSegmentRow(tx, id);
    await writeSegmentPositions(tx, await orderedSegmentIds(tx, current.episodeId));
    await writeRevision(tx, current.episodeId, id, userId, current, null);
    return current;
  });
}

/** Sets the whole order; `ids` must be exactly the episode's segments as they are now. */
export async function reorderSegments({ episodeId, ids }: { episodeId: string; ids: string[] }) {
  await db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const current = await orderedSegmentIds(tx, episodeId);
    if (current.length !== ids.length || !current.every((id) => ids.includes(id))) {
      throw new AppError("conflict:segment.order", "The script changed since you loaded it: reload and reorder again.", { fields: { ids: ["must list every segment exactly once"] } });
    }
    await writeSegmentPositions(tx, ids);
  });
}

/**
 * Puts a segment back as it was after (or, for a deletion, before) a
 * revision. A segment that no longer exists is recreated at the end.
 */
export async function restoreRevision({ revisionId, userId }: { revisionId: string; userId: string }) {
  return db().transaction(async (tx) => {
    const rev = await getRevision(tx, revisionId);
    if (!rev || !rev.segmentId) return null;
    const state = (rev.after ?? rev.before) as SegmentSnapshot | null;
    if (!state) return null;
    await lockEpisode(tx, rev.episodeId);
    const fields = {
      kind: state.kind,
      text: state.text,
      stepId: state.stepId,
      pinnedStartFrame: state.pinnedStartFrame,
      explicitDurationFrames: state.explicitDurationFrames,
      editorNotes: state.editorNotes,
      chapterStart: state.chapterStart,
      chapterTitle: state.chapterTitle,
    };
    const current = await lockSegment(tx, rev.segmentId);
    let after: Segment;
    if (current) {
      after = (await updateSegmentRow(tx, current.id, { ...fields, version: current.version + 1, updatedBy: userId }))!;
    } else {
      const ids = await orderedSegmentIds(tx, rev.episodeId);
      // The step may have been deleted meanwhile; keep the text, drop the link.
      after = await insertSegment(tx, { ...fields, stepId: null, id: rev.segmentId, episodeId: rev.episodeId, position: ids.length, updatedBy: userId });
    }
    await writeRevision(tx, rev.episodeId, rev.segmentId, userId, current, after);
    return after;
  });
}
