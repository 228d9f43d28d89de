import "server-only";
/**
 * Board writes. Every one locks the channel row first, so positions stay
 * dense and unique per stage; a frame-rate change then locks the episode and
 * re-expresses its stored frame counts so they keep their time.
 */
import { placeInColumn } from "../../board";
import { allowsDropFrame } from "../../frame-rate";
import { rateOf } from "../../timecode";
import type { EpisodeCreate, EpisodeUpdate } from "../../schemas/episode";
import { assertCan, assertCanMove, type ChannelAccess } from "../access/access";
import { AppError } from "../http/errors";
import { db } from "../../../db/client";
import { lockEpisode } from "../../../db/queries/episode-lock";
import { getMembership } from "../../../db/queries/channels";
import {
  archiveEpisodeRow,
  columnIds,
  convertStoredFrames,
  countActiveInStage,
  getEpisodeInChannel,
  insertEpisode,
  lockChannel,
  updateEpisodeRow,
  writeEpisodePositions,
} from "../../../db/queries/episodes";

/** A new episode goes to the end of its stage's column. */
export async function createEpisode({ channelId, userId, input }: { channelId: string; userId: string; input: EpisodeCreate }) {
  return db().transaction(async (tx) => {
    await lockChannel(tx, channelId);
    const n = await countActiveInStage(tx, channelId, input.stage);
    return insertEpisode(tx, { ...input, channelId, position: n, createdBy: userId, updatedBy: userId });
  });
}

/**
 * Field edits and/or a move in one transaction. Field edits need
 * episode.edit; a move is checked against the stages (editors move only
 * within editing) and puts the episode at `position` in the target stage
 * (clamped), renumbering both columns densely.
 */
export async function updateEpisode({ id, channelId, userId, access, patch }: { id: string; channelId: string; userId: string; access: ChannelAccess; patch: EpisodeUpdate }) {
  const { stage, position, ...fields } = patch;
  const moving = stage !== undefined || position !== undefined;
  if (Object.keys(fields).length > 0) assertCan(access, "episode.edit");
  if (patch.presenterId && !(await getMembership({ userId: patch.presenterId, channelId }))) {
    throw new AppError("unprocessable:episode.presenter", "The presenter must be a member of this channel.", { fields: { presenterId: ["not a member of this channel"] } });
  }
  return db().transaction(async (tx) => {
    await lockChannel(tx, channelId);
    const current = await getEpisodeInChannel(tx, id, channelId);
    if (!current) return null;
    if (moving) {
      assertCanMove(access, current.stage, stage ?? current.stage);
      if (current.archivedAt) throw new AppError("conflict:episode.archived", "This episode is archived; restore it before moving it.");
    }
    const rate = patch.frameRate ?? current.frameRate;
    if ((patch.dropFrame ?? current.dropFrame) && !allowsDropFrame(rate)) {
      throw new AppError("unprocessable:episode.dropFrame", "Drop-frame applies only at 29.97 and 59.94 fps.", { fields: { dropFrame: ["drop-frame applies only at 29.97 and 59.94 fps"] } });
    }
    if (patch.frameRate && patch.frameRate !== current.frameRate) {
      // The episode row before its rows, as every content write does. Pins, fixed
      // lengths, B-roll ranges, gaps and clip in/out points keep their time at the new rate.
      await lockEpisode(tx, id);
      await convertStoredFrames(tx, id, rateOf(current.frameRate), rateOf(patch.frameRate));
    }
    const toStage = stage ?? current.stage;
    let after = current;
    if (Object.keys(fields).length > 0 || moving) after = (await updateEpisodeRow(tx, id, { ...fields, stage: toStage, updatedBy: userId }))!;
    if (moving && !current.archivedAt) {
      const target = await columnIds(tx, channelId, toStage, id);
      await writeEpisodePositions(tx, placeInColumn(target, id, position ?? (toStage === current.stage ? current.position : target.length)));
      if (toStage !== current.stage) await writeEpisodePositions(tx, await columnIds(tx, channelId, current.stage));
      after = (await getEpisodeInChannel(tx, id, channelId))!;
    }
    return { before: current, after };
  });
}

/** Archives an episode and closes the gap in its column; null when it is archived already. */
export async function archiveEpisode({ id, channelId, userId }: { id: string; channelId: string; userId: string }) {
  return db().transaction(async (tx) => {
    await lockChannel(tx, channelId);
    const row = await archiveEpisodeRow(tx, id, channelId, userId);
    if (row) await writeEpisodePositions(tx, await columnIds(tx, channelId, row.stage));
    return row;
  });
}

/** Brings an archived episode back to the end of its stage's column. */
export async function restoreEpisode({ id, channelId, userId }: { id: string; channelId: string; userId: string }) {
  return db().transaction(async (tx) => {
    await lockChannel(tx, channelId);
    const current = await getEpisodeInChannel(tx, id, channelId, { archived: true });
    if (!current) return null;
    const column = await columnIds(tx, channelId, current.stage);
    return updateEpisodeRow(tx, id, { archivedAt: null, position: column.length, updatedBy: userId });
  });
}
