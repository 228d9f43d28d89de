import "server-only";
/** Cut-list writes: each locks the episode first; an import inserts all its rows or none. */
import type { MaterialCreate, MaterialUpdate } from "../../schemas/build";
import { db } from "../../../db/client";
import { lockEpisode } from "../../../db/queries/episode-lock";
import { countMaterials, deleteMaterialRow, insertMaterials, updateMaterialRow } from "../../../db/queries/materials";

/** Sizes and percentages are stored as exact decimals (numeric columns take strings). */
function toColumns(input: Partial<MaterialCreate>) {
  const { thickness, width, length, wastePercent, ...rest } = input;
  return {
    ...rest,
    ...(thickness !== undefined ? { thickness: String(thickness) } : {}),
    ...(width !== undefined ? { width: String(width) } : {}),
    ...(length !== undefined ? { length: String(length) } : {}),
    ...(wastePercent !== undefined ? { wastePercent: String(wastePercent) } : {}),
  };
}

export async function createMaterials({ episodeId, rows }: { episodeId: string; rows: MaterialCreate[] }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    const n = await countMaterials(tx, episodeId);
    return insertMaterials(tx, rows.map((r, i) => ({ ...toColumns(r), partName: r.partName, thickness: String(r.thickness), width: String(r.width), length: String(r.length), episodeId, position: n + i })));
  });
}

export async function updateMaterial({ id, episodeId, patch }: { id: string; episodeId: string; patch: MaterialUpdate }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    return updateMaterialRow(tx, id, episodeId, toColumns(patch));
  });
}

export async function deleteMaterial({ id, episodeId }: { id: string; episodeId: string }) {
  return db().transaction(async (tx) => {
    await lockEpisode(tx, episodeId);
    return deleteMaterialRow(tx, id, episodeId);
  });
}
