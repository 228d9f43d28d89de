import "server-only";
/** Shot-list writes: each locks the episode first; bulk changes are all or none; one pickup per gap. */
import type { ShotCreate, ShotKind, ShotStatus, ShotUpdate } from "../../schemas/footage";
import { db } from "../../../db/client";
import { lockEpisode } from "../../../db/queries/episode-lock";
import type { Gap } from "../../../db/schema";
import { countShots, deleteShotRow, findComputedGap, findPickupOfGap, findShotIds, insertGapRow, insertShots, setStatusOfShots, updateShotRow } from "../../../db/queries/shots";

export async function createShots({ episodeId, rows }: { episodeId: string; rows: (ShotCreate & { gapId?: string | null })[] }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const n = await countShots(tx, episodeId);
    return insertShots(tx, rows.map((r, i) => ({ ...r, episodeId, position: n + i })));
  });
}

export async function updateShot({ id, episodeId, patch }: { id: string; episodeId: string; patch: ShotUpdate }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    return updateShotRow(tx, id, episodeId, patch);
  });
}

export async function deleteShot({ id, episodeId }: { id: string; episodeId: string }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    return deleteShotRow(tx, id, episodeId);
  });
}

/** One status on many shots of one episode; null (nothing written) when any id is not a shot of it. */
export async function setShotStatus({ episodeId, ids, status }: { episodeId: string; ids: string[]; status: ShotStatus }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const found = await findShotIds(tx, episodeId, ids);
    if (found.length !== ids.length) return null;
    await setStatusOfShots(tx, episodeId, ids, status);
    return found.length;
  });
}

/** A pickup shot for a gap, linked to the gap and its segment; a computed gap gets its kept row here. */
export async function createPickup({
  episodeId,
  gap,
  description,
  kind,
}: {
  episodeId: string;
  gap: { id?: string; startFrame: number; endFrame: number; segmentId: string | null; reason: Gap["reason"]; note?: string };
  description: string;
  kind: ShotKind;
}) {
  return db().transaction(async (tx) => {
    // Under the episode lock, so two clicks on the same gap cannot both make a pickup.
    await lockEpisode(tx, episodeId);
    let gapId = gap.id ?? (await findComputedGap(tx, episodeId, gap.startFrame, gap.endFrame));
    if (gapId) {
      const already = await findPickupOfGap(tx, episodeId, gapId);
      if (already) return { duplicate: already };
    } else {
      gapId = (await insertGapRow(tx, { episodeId, startFrame: gap.startFrame, endFrame: gap.endFrame, segmentId: gap.segmentId, source: "computed", reason: gap.reason, status: "open", note: gap.note ?? "" })).id;
    }
    const n = await countShots(tx, episodeId);
    const [shot] = await insertShots(tx, [{ episodeId, kind, description, status: "planned", priority: 1, segmentId: gap.segmentId, gapId, position: n }]);
    return { shot: shot!, gapId };
  });
}
