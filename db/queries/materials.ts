import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db, type Tx } from "../client";
import { materials } from "../schema";

export async function listMaterialsByEpisode({ episodeId }: { episodeId: string }) {
  return db().select().from(materials).where(eq(materials.episodeId, episodeId)).orderBy(asc(materials.position), asc(materials.partName));
}

export async function getMaterialById({ id }: { id: string }) {
  const [row] = await db().select().from(materials).where(eq(materials.id, id)).limit(1);
  return row ?? null;
}


export async function countMaterials(tx: Tx, episodeId: string) {
  const rows = await tx.select({ id: materials.id }).from(materials).where(eq(materials.episodeId, episodeId));
  return rows.length;
}

export async function insertMaterials(tx: Tx, rows: (typeof materials.$inferInsert)[]) {
  if (!rows.length) return [];
  return tx.insert(materials).values(rows).returning();
}

export async function updateMaterialRow(tx: Tx, id: string, episodeId: string, set: Partial<typeof materials.$inferInsert>) {
  const [row] = await tx.update(materials).set(set).where(and(eq(materials.id, id), eq(materials.episodeId, episodeId))).returning();
  return row ?? null;
}

export async function deleteMaterialRow(tx: Tx, id: string, episodeId: string) {
  const [row] = await tx.delete(materials).where(and(eq(materials.id, id), eq(materials.episodeId, episodeId))).returning();
  return row ?? null;
}
