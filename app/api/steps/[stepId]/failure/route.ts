import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepFailureSchema } from "@/lib/schemas/build";
import { failStep } from "@/lib/server/services/build-plan";
import { AppError } from "@/lib/server/http/errors";
import { recordAudit } from "@/db/queries/audit";
import { claimUpload } from "@/lib/server/services/uploads";

/** Marks a step failed with what went wrong (and an optional photo already uploaded). */
export const POST = channelRoute({ load: "step", action: "build.edit", body: stepFailureSchema, what: "failure" }, async ({ step, channelId, user, body }) => {
  const input = body;
  if (input.photoKey) await claimUpload({ key: input.photoKey, channelId, purpose: "failure_photo", field: "photoKey" });
  const result = await failStep({ stepId: step.id, episodeId: step.episodeId, channelId, note: input.note, photoKey: input.photoKey });
  if (!result) throw new AppError("not_found:step", "No such build step.");
  await recordAudit({ channelId, userId: user.id, action: "fail", entity: "build_step", entityId: step.id, after: input });
  return json({ step: { id: step.id, status: "failed" } });
});
