import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadMaterial } from "@/lib/server/loaders";
import { assertCan } from "@/lib/server/access";
import { materialUpdateSchema } from "@/lib/schemas/build";
import { deleteMaterial, stepIdsOfEpisode, updateMaterial } from "@/db/queries/materials";
import { materialsView } from "@/lib/server/materials-view";
import { AppError } from "@/lib/server/errors";

type P = { materialId: string };

export const PATCH = route<P>(async (req, params) => {
  const patch = await parseBody(req, materialUpdateSchema, "cut-list row");
  const user = await sessionUser(req);
  const { material, access } = await loadMaterial(user.id, params.materialId);
  assertCan(access, "build.edit");
  if (patch.stepId) {
    const steps = await stepIdsOfEpisode({ episodeId: material.episodeId });
    if (!steps.some((s) => s.id === patch.stepId)) throw new AppError("unprocessable:material.step", "That build step is not in this episode.", { fields: { stepId: ["not a step of this episode"] } });
  }
  const row = await updateMaterial({ id: material.id, episodeId: material.episodeId, patch });
  if (!row) throw new AppError("not_found:material", "No such cut-list row.");
  return json({ material: materialsView([row]).rows[0] });
});

export const DELETE = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { material, access } = await loadMaterial(user.id, params.materialId);
  assertCan(access, "build.edit");
  await deleteMaterial({ id: material.id, episodeId: material.episodeId });
  return json({ ok: true });
});
