import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepCreateSchema } from "@/lib/schemas/build";
import { listStepsByEpisode } from "@/db/queries/build";
import { listToolsByChannel } from "@/db/queries/tools";
import { listMembersByChannel } from "@/db/queries/channels";
import { planView } from "@/lib/server/views/plan";
import { addStep } from "@/lib/server/services/build-plan";
import { recordAudit } from "@/db/queries/audit";

/** The build plan: steps with links, cautions and timing, plus every tool it uses. */
export const GET = channelRoute({ load: "episode", action: "channel.read" }, async ({ episode }) => {
  const [steps, shelf, members] = await Promise.all([listStepsByEpisode({ episodeId: episode.id }), listToolsByChannel({ channelId: episode.channelId }), listMembersByChannel({ channelId: episode.channelId })]);
  return json(await planView(steps, shelf, members.length));
});

export const POST = channelRoute({ load: "episode", action: "build.edit", body: stepCreateSchema, what: "build step" }, async ({ episode, user, body }) => {
  const step = await addStep({ episodeId: episode.id, channelId: episode.channelId, input: body });
  await recordAudit({ channelId: episode.channelId, userId: user.id, action: "create", entity: "build_step", entityId: step.id, after: body });
  return json({ step: { id: step.id, title: step.title, position: step.position } }, 201);
});
