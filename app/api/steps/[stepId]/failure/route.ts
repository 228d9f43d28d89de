import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadStep } from "@/lib/server/loaders";
import { assertCan } from "@/lib/server/access";
import { stepFailureSchema } from "@/lib/schemas/build";
import { updateStep } from "@/db/queries/build";
import { AppError } from "@/lib/server/errors";
import { recordAudit } from "@/db/queries/audit";
import { claimUpload } from "@/lib/server/uploads";

type P = { stepId: string };

/** Marks a step failed with what went wrong (and an optional photo already uploaded). */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, stepFailureSchema, "failure");
  const user = await sessionUser(req);
  const { step, channelId, access } = await loadStep(user.id, params.stepId);
  assertCan(access, "build.edit");
  if (input.photoKey) await claimUpload({ key: input.photoKey, channelId, purpose: "failure_photo", field: "photoKey" });
  const result = await updateStep({
    stepId: step.id,
    episodeId: step.episodeId,
    channelId,
    patch: { status: "failed", failureNote: input.note, failurePhotoKey: input.photoKey },
    check: () => {},
  });
  if (!result) throw new AppError("not_found:step", "No such build step.");
  await recordAudit({ channelId, userId: user.id, action: "fail", entity: "build_step", entityId: step.id, after: input });
  return json({ step: { id: step.id, status: "failed" } });
});
