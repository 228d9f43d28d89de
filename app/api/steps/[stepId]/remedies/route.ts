import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadStep } from "@/lib/server/loaders";
import { assertCan } from "@/lib/server/access";
import { stepCreateSchema } from "@/lib/schemas/build";
import { createStep } from "@/db/queries/build";
import { checkLinks } from "@/lib/server/plan";
import { AppError } from "@/lib/server/errors";
import { recordAudit } from "@/db/queries/audit";

type P = { stepId: string };

/** Adds a remedy step right after the failed one; the failed step stays in the plan's history. */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, stepCreateSchema, "remedy step");
  const user = await sessionUser(req);
  const { step, channelId, access } = await loadStep(user.id, params.stepId);
  assertCan(access, "build.edit");
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
