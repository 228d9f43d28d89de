import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadEpisode } from "@/lib/server/loaders";
import { stepCreateSchema } from "@/lib/schemas/build";
import { createStep, listStepsByEpisode } from "@/db/queries/build";
import { listToolsByChannel } from "@/db/queries/tools";
import { listMembersByChannel } from "@/db/queries/channels";
import { checkLinks, planView } from "@/lib/server/plan";
import { AppError } from "@/lib/server/errors";
import { recordAudit } from "@/db/queries/audit";

type P = { episodeId: string };

/** The build plan: steps with links, cautions and timing, plus every tool it uses. */
export const GET = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId);
  const [steps, shelf, members] = await Promise.all([listStepsByEpisode({ episodeId: episode.id }), listToolsByChannel({ channelId: episode.channelId }), listMembersByChannel({ channelId: episode.channelId })]);
  return json(await planView(steps, shelf, members.length));
});

export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, stepCreateSchema, "build step");
  const user = await sessionUser(req);
  const { episode } = await loadEpisode(user.id, params.episodeId, "build.edit");
  if (input.status === "failed") {
    throw new AppError("unprocessable:step.status", "Add the step first, then mark it failed with what went wrong.", { fields: { status: ["mark a step failed through its failure form"] } });
  }
  const step = await createStep({
    episodeId: episode.id,
    channelId: episode.channelId,
    input,
    check: (ctx) => checkLinks(ctx, null, input.dependsOn, input.toolIds),
  });
  await recordAudit({ channelId: episode.channelId, userId: user.id, action: "create", entity: "build_step", entityId: step.id, after: input });
  return json({ step: { id: step.id, title: step.title, position: step.position } }, 201);
});
