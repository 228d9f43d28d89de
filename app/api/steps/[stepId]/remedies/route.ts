import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepCreateSchema } from "@/lib/schemas/build";
import { createStep } from "@/db/queries/build";
import { checkLinks } from "@/lib/server/views/plan";
import { AppError } from "@/lib/server/http/errors";
import { recordAudit } from "@/db/queries/audit";

/** Adds a remedy step right after the failed one; the failed step stays in the plan's history. */
export const POST = channelRoute({ load: "step", action: "build.edit", body: stepCreateSchema, what: "remedy step" }, async ({ step, channelId, user, body }) => {
  const input = body;
  if (step.status !== "failed") throw new AppError("conflict:step.not-failed", "Only a failed step gets remedies. Mark it failed first.");
  const row = await createStep({
    episodeId: step.episodeId,
    channelId,
    input: { ...input, status: input.status === "failed" ? "planned" : input.status },
    remedyOf: step.id,
    check: (ctx) => checkLinks(ctx, null, input.dependsOn, input.toolIds),
  });
  await recordAudit({ channelId, userId: user.id, action: "remedy", entity: "build_step", entityId: row.id, after: { remedyOf: step.id, ...input } });
  return json({ step: { id: row.id, title: row.title, remedyOfStepId: step.id } }, 201);
});
