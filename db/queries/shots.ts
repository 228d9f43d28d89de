import "server-only";
import { and, asc, eq, inArray } from "drizzle-orm";
import { db } from "../client";
import { lockEpisode } from "./episode-lock";
import { buildSteps, episodes, gaps, scriptSegments, shots, type Gap, type Shot } from "../schema";
import type { ShotCreate, ShotKind, ShotUpdate, ShotStatus } from "../../lib/schemas/footage";

export function toShotDto(s: Shot) {
  return {
    id: s.id,
    kind: s.kind,
    description: s.description,
    framing: s.framing,
    cameraNotes: s.cameraNotes,
    priority: s.priority,
    status: s.status,
    stepId: s.stepId,
    segmentId: s.segmentId,
    shootDayId: s.shootDayId,
    gapId: s.gapId,
    position: s.position,
  };
}

export async function listShotsByEpisode({ episodeId }: { episodeId: string }) {
  return db().select().from(shots).where(eq(shots.episodeId, episodeId)).orderBy(asc(shots.position), asc(shots.createdAt));
}

export async function getShotById({ id }: { id: string }) {
  const [row] = await db()
    .select({ shot: shots, channelId: episodes.channelId })
    .from(shots)
    .innerJoin(episodes, eq(episodes.id, shots.episodeId))
    .where(eq(shots.id, id))
    .limit(1);
  return row ?? null;
}

/** True when every given step/segment belongs to the episode. */
export async function linksBelong({ episodeId, stepId, segmentId }: { episodeId: string; stepId?: string | null; segmentId?: string | null }) {
  if (stepId) {
    const [s] = await db().select({ id: buildSteps.id }).from(buildSteps).where(and(eq(buildSteps.id, stepId), eq(buildSteps.episodeId, episodeId)));
    if (!s) return "stepId" as const;
  }
  if (segmentId) {
    const [s] = await db().select({ id: scriptSegments.id }).from(scriptSegments).where(and(eq(scriptSegments.id, segmentId), eq(scriptSegments.episodeId, episodeId)));
    if (!s) return "segmentId" as const;
  }
  return null;
}

export async function createShots({ episodeId, rows }: { episodeId: string; rows: (ShotCreate & { gapId?: string | null })[] }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const existing = await tx.select({ id: shots.id }).from(shots).where(eq(shots.episodeId, episodeId));
    if (!rows.length) return [];
    return tx
      .insert(shots)
      .values(rows.map((r, i) => ({ ...r, episodeId, position: existing.length + i })))
      .returning();
  });
}

export async function updateShot({ id, episodeId, patch }: { id: string; episodeId: string; patch: ShotUpdate }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const [row] = await tx.update(shots).set(patch).where(and(eq(shots.id, id), eq(shots.episodeId, episodeId))).returning();
    return row ?? null;
  });
}

export async function deleteShot({ id, episodeId }: { id: string; episodeId: string }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const [row] = await tx.delete(shots).where(and(eq(shots.id, id), eq(shots.episodeId, episodeId))).returning();
    return row ?? null;
  });
}

/** Sets one status on many shots of one episode in one statement; ids of other episodes are not touched. */
export async function setShotStatus({ episodeId, ids, status }: { episodeId: string; ids: string[]; status: ShotStatus }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const found = await tx.select({ id: shots.id }).from(shots).where(and(eq(shots.episodeId, episodeId), inArray(shots.id, ids)));
    if (found.length !== ids.length) return null;
    await tx.update(shots).set({ status }).where(and(eq(shots.episodeId, episodeId), inArray(shots.id, ids)));
    return found.length;
  });
}

/** A pickup shot for a gap, linked to the gap and its segment, in one transaction with the gap row. */
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
    let gapId = gap.id;
    if (!gapId) {
      const [kept] = await tx
        .select({ id: gaps.id })
        .from(gaps)
        .where(and(eq(gaps.episodeId, episodeId), eq(gaps.source, "computed"), eq(gaps.startFrame, gap.startFrame), eq(gaps.endFrame, gap.endFrame)))
        .limit(1);
      gapId = kept?.id;
    }
    if (gapId) {
      const [already] = await tx.select().from(shots).where(and(eq(shots.episodeId, episodeId), eq(shots.gapId, gapId))).limit(1);
      if (already) return { duplicate: already };
    } else {
      const [g] = await tx
        .insert(gaps)
        .values({ episodeId, startFrame: gap.startFrame, endFrame: gap.endFrame, segmentId: gap.segmentId, source: "computed", reason: gap.reason, status: "open", note: gap.note ?? "" })
        .returning();
      gapId = g!.id;
    }
    const existing = await tx.select({ id: shots.id }).from(shots).where(eq(shots.episodeId, episodeId));
    const [shot] = await tx.insert(shots).values({ episodeId, kind, description, status: "planned", priority: 1, segmentId: gap.segmentId, gapId, position: existing.length }).returning();
    return { shot: shot!, gapId };
  });
}

/** Shots captured or better, and all shots not rejected, per episode. */
export async function countShotsByEpisodes({ episodeIds }: { episodeIds: string[] }) {
  const out = new Map<string, { done: number; total: number }>();
  if (!episodeIds.length) return out;
  const rows = await db().select({ episodeId: shots.episodeId, status: shots.status }).from(shots).where(inArray(shots.episodeId, episodeIds));
  for (const r of rows) {
    if (r.status === "rejected") continue;
    const c = out.get(r.episodeId) ?? { done: 0, total: 0 };
    c.total += 1;
    if (r.status === "captured" || r.status === "selected") c.done += 1;
    out.set(r.episodeId, c);
  }
  return out;
}
