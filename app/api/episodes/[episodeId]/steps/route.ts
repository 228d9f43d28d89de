import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepCreateSchema } from "@/lib/schemas/build";
import { createStep, listStepsByEpisode } from "@/db/queries/build";
import { listToolsByChannel } from "@/db/queries/tools";
import { listMembersByChannel } from "@/db/queries/channels";
import { checkLinks, planView } from "@/lib/server/views/plan";
import { AppError } from "@/lib/server/http/errors";
import { recordAudit } from "@/db/queries/audit";

/** The build plan: steps with links, cautions and timing, plus every tool it uses. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  const [steps, shelf, members] = await Promise.all([listStepsByEpisode({ episodeId: episode.id }), listToolsByChannel({ channelId: episode.channelId }), listMembersByChannel({ channelId: episode.channelId })]);
  return json(await planView(steps, shelf, members.length));
});

export const POST = channelRoute({ load: "episode", action: "build.edit", body: stepCreateSchema, what: "build step" }, async ({ episode, user, body }) => {
  const input = body;
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
