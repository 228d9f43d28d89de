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
import { insertPublishOverride } from "../../../db/queries/publish";
import { publishViewFor } from "../views/publish";
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
  const { stage, position, publishOverride, ...fields } = patch;
  // The publish checklist is read before the move; it reads many tables and takes no lock.
  const before = stage === "published" ? await getEpisodeInChannel(db(), id, channelId) : null;
  const gate = before && before.stage !== "published" ? (await publishViewFor(before)).checklist : null;
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
      if (gate && !gate.pass && current.stage !== "published" && stage === "published") {
        const failing = gate.items.filter((i) => !i.pass);
        const list = failing.map((i) => `${i.label.toLowerCase()} (${i.detail})`).join("; ");
        if (!publishOverride) throw new AppError("conflict:publish.checklist", `The publish checklist fails: ${list}.`, { current: { checklist: gate } });
        if (!access.roles.includes("owner")) throw new AppError("forbidden:publish.override", "Only an owner can publish while the checklist fails.");
        await insertPublishOverride(tx, { episodeId: id, userId, reason: publishOverride, failing: failing.map((i) => i.key) });
      }
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
