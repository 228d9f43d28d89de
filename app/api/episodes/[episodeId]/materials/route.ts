import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { materialCreateSchema } from "@/lib/schemas/build";
import { createMaterials, listMaterialsByEpisode, stepIdsOfEpisode } from "@/db/queries/materials";
import { materialsView } from "@/lib/server/materials-view";
import { AppError } from "@/lib/server/errors";

type P = { episodeId: string };

/** The cut list with board feet, volume, sheets and cost per row, by material and in total. */
export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId);
  return json(materialsView(await listMaterialsByEpisode({ episodeId: episode.id })));
});

export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, materialCreateSchema, "cut-list row");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "build.edit");
  if (input.stepId) {
    const steps = await stepIdsOfEpisode({ episodeId: episode.id });
    if (!steps.some((s) => s.id === input.stepId)) throw new AppError("unprocessable:material.step", "That build step is not in this episode.", { fields: { stepId: ["not a step of this episode"] } });
  }
  const [row] = await createMaterials({ episodeId: episode.id, rows: [input] });
  return json({ material: materialsView([row!]).rows[0] }, 201);
});
