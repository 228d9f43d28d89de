import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadStep } from "@/lib/server/loaders";
import { assertCan } from "@/lib/server/access";
import { stepUpdateSchema } from "@/lib/schemas/build";
import { deleteStep, updateStep } from "@/db/queries/build";
import { assertStepPatchAllowed, checkLinks } from "@/lib/server/plan";
import { AppError } from "@/lib/server/errors";
import { recordAudit } from "@/db/queries/audit";

type P = { stepId: string };

export const PATCH = route<P>(async (req, params) => {
  const patch = await parseBody(req, stepUpdateSchema, "build step");
  const user = await sessionUser(req);
  const { step, channelId, access } = await loadStep(user.id, params.stepId);
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

export const DELETE = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const { step, channelId, access } = await loadStep(user.id, params.stepId);
  assertCan(access, "build.edit");
  const row = await deleteStep({ stepId: step.id, episodeId: step.episodeId });
  if (!row) throw new AppError("not_found:step", "No such build step.");
  await recordAudit({ channelId, userId: user.id, action: "delete", entity: "build_step", entityId: step.id, before: row });
  return json({ ok: true });
});
