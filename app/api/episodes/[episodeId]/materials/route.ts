import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { materialCreateSchema } from "@/lib/schemas/build";
import { listMaterialsByEpisode } from "@/db/queries/materials";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { createMaterials } from "@/lib/server/services/materials";
import { materialsView } from "@/lib/server/views/materials";
import { AppError } from "@/lib/server/http/errors";

/** The cut list with board feet, volume, sheets and cost per row, by material and in total. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  return json(materialsView(await listMaterialsByEpisode({ episodeId: episode.id })));
});

export const POST = channelRoute({ load: "episode", action: "build.edit", body: materialCreateSchema, what: "cut-list row" }, async ({ episode, body }) => {
  const input = body;
  if (input.stepId) {
    const steps = await listStepTitlesByEpisode({ episodeId: episode.id });
    if (!steps.some((s) => s.id === input.stepId)) throw new AppError("unprocessable:material.step", "That build step is not in this episode.", { fields: { stepId: ["not a step of this episode"] } });
  }
  const [row] = await createMaterials({ episodeId: episode.id, rows: [input] });
  return json({ material: materialsView([row!]).rows[0] }, 201);
});
