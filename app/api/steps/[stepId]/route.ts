import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepUpdateSchema } from "@/lib/schemas/build";
import { deleteStep, updateStep } from "@/db/queries/build";
import { assertStepPatchAllowed, checkLinks } from "@/lib/server/views/plan";
import { AppError } from "@/lib/server/http/errors";
import { recordAudit } from "@/db/queries/audit";

export const PATCH = channelRoute({ load: "step", action: ["build.edit", "build.timing"], body: stepUpdateSchema, what: "build step" }, async ({ step, channelId, access, user, body }) => {
  const patch = body;
  assertStepPatchAllowed(access, patch);
  if (patch.status === "failed") {
    throw new AppError("unprocessable:step.status", "Mark a step failed with its failure form, so the team knows what went wrong.", { fields: { status: ["use POST /api/steps/{stepId}/failure"] } });
  }
  const result = await updateStep({
    stepId: step.id,
    episodeId: step.episodeId,
    channelId,
    // A step that leaves "failed" keeps its failure note: it is part of the build's story.
    patch,
    check: (ctx) => checkLinks(ctx, step.id, patch.dependsOn, patch.toolIds),
  });
  if (!result) throw new AppError("not_found:step", "No such build step.");
  await recordAudit({ channelId, userId: user.id, action: "update", entity: "build_step", entityId: step.id, before: result.before, after: result.after });
  return json({ step: { id: step.id } });
});

export const DELETE = channelRoute({ load: "step", action: "build.edit" }, async ({ step, channelId, user }) => {
  const row = await deleteStep({ stepId: step.id, episodeId: step.episodeId });
  if (!row) throw new AppError("not_found:step", "No such build step.");
  await recordAudit({ channelId, userId: user.id, action: "delete", entity: "build_step", entityId: step.id, before: row });
  return json({ ok: true });
});
