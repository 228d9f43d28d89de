import "server-only";
import { and, asc, eq } from "drizzle-orm";
import { db } from "../client";
import { lockEpisode } from "./episode-lock";
import { buildSteps, materials, type MaterialRow } from "../schema";
import type { MaterialCreate, MaterialUpdate } from "../../lib/schemas/build";
import type { MaterialRowInput, PricingUnit } from "../../lib/materials";

export function toMaterialInput(r: MaterialRow): MaterialRowInput & { id: string; partName: string; stepId: string | null; currency: string; supplierNote: string } {
  return {
    id: r.id,
    partName: r.partName,
    material: r.material,
    unit: r.unit,
    thickness: Number(r.thickness),
    width: Number(r.width),
    length: Number(r.length),
    quantity: r.quantity,
    sizing: r.sizing,
    pricingUnit: r.pricingUnit as PricingUnit,
    unitPriceMinor: r.unitPriceMinor,
    currency: r.currency,
    wastePercent: Number(r.wastePercent),
    stepId: r.stepId,
    supplierNote: r.supplierNote,
  };
}

export async function listMaterialsByEpisode({ episodeId }: { episodeId: string }) {
  return db().select().from(materials).where(eq(materials.episodeId, episodeId)).orderBy(asc(materials.position), asc(materials.partName));
}

export async function getMaterialById({ id }: { id: string }) {
  const [row] = await db().select().from(materials).where(eq(materials.id, id)).limit(1);
  return row ?? null;
}

function toDb(input: Partial<MaterialCreate>) {
  const { thickness, width, length, wastePercent, ...rest } = input;
  return {
    ...rest,
    ...(thickness !== undefined ? { thickness: String(thickness) } : {}),
    ...(width !== undefined ? { width: String(width) } : {}),
    ...(length !== undefined ? { length: String(length) } : {}),
    ...(wastePercent !== undefined ? { wastePercent: String(wastePercent) } : {}),
  };
}

export async function stepIdsOfEpisode({ episodeId }: { episodeId: string }) {
  const rows = await db().select({ id: buildSteps.id, title: buildSteps.title }).from(buildSteps).where(eq(buildSteps.episodeId, episodeId));
  return rows;
}

/** Inserts rows in one transaction: all of them or none. */
export async function createMaterials({ episodeId, rows }: { episodeId: string; rows: MaterialCreate[] }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const existing = await tx.select({ id: materials.id }).from(materials).where(eq(materials.episodeId, episodeId));
    if (rows.length === 0) return [];
    return tx
      .insert(materials)
      .values(rows.map((r, i) => ({ ...toDb(r), partName: r.partName, thickness: String(r.thickness), width: String(r.width), length: String(r.length), episodeId, position: existing.length + i })))
      .returning();
  });
}

export async function updateMaterial({ id, episodeId, patch }: { id: string; episodeId: string; patch: MaterialUpdate }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const [row] = await tx
      .update(materials)
      .set(toDb(patch))
      .where(and(eq(materials.id, id), eq(materials.episodeId, episodeId)))
      .returning();
    return row ?? null;
  });
}

export async function deleteMaterial({ id, episodeId }: { id: string; episodeId: string }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const [row] = await tx.delete(materials).where(and(eq(materials.id, id), eq(materials.episodeId, episodeId))).returning();
    return row ?? null;
  });
}
