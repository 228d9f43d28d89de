import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepUpdateSchema } from "@/lib/schemas/build";
import { editStep, removeStep } from "@/lib/server/services/build-plan";
import { AppError } from "@/lib/server/http/errors";
import { recordAudit } from "@/db/queries/audit";

export const PATCH = channelRoute({ load: "step", action: ["build.edit", "build.timing"], body: stepUpdateSchema, what: "build step" }, async ({ step, channelId, access, user, body }) => {
  const result = await editStep({ stepId: step.id, episodeId: step.episodeId, channelId, access, patch: body });
  if (!result) throw new AppError("not_found:step", "No such build step.");
  await recordAudit({ channelId, userId: user.id, action: "update", entity: "build_step", entityId: step.id, before: result.before, after: result.after });
  return json({ step: { id: step.id } });
});

export const DELETE = channelRoute({ load: "step", action: "build.edit" }, async ({ step, channelId, user }) => {
  const row = await removeStep({ stepId: step.id, episodeId: step.episodeId });
  if (!row) throw new AppError("not_found:step", "No such build step.");
  await recordAudit({ channelId, userId: user.id, action: "delete", entity: "build_step", entityId: step.id, before: row });
  return json({ ok: true });
});
