import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { materialUpdateSchema } from "@/lib/schemas/build";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { deleteMaterial, updateMaterial } from "@/lib/server/services/materials";
import { materialsView } from "@/lib/server/views/materials";
import { AppError } from "@/lib/server/http/errors";

export const PATCH = channelRoute({ load: "material", action: "build.edit", body: materialUpdateSchema, what: "cut-list row" }, async ({ material, body }) => {
  const patch = body;
  if (patch.stepId) {
    const steps = await listStepTitlesByEpisode({ episodeId: material.episodeId });
    if (!steps.some((s) => s.id === patch.stepId)) throw new AppError("unprocessable:material.step", "That build step is not in this episode.", { fields: { stepId: ["not a step of this episode"] } });
  }
  const row = await updateMaterial({ id: material.id, episodeId: material.episodeId, patch });
  if (!row) throw new AppError("not_found:material", "No such cut-list row.");
  return json({ material: materialsView([row]).rows[0] });
});

export const DELETE = channelRoute({ load: "material", action: "build.edit" }, async ({ material }) => {
  await deleteMaterial({ id: material.id, episodeId: material.episodeId });
  return json({ ok: true });
});
