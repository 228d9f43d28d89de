import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { stepCreateSchema } from "@/lib/schemas/build";
import { addRemedy } from "@/lib/server/services/build-plan";
import { recordAudit } from "@/db/queries/audit";

/** Adds a remedy step right after the failed one; the failed step stays in the plan's history. */
export const POST = channelRoute({ load: "step", action: "build.edit", body: stepCreateSchema, what: "remedy step" }, async ({ step, channelId, user, body }) => {
  const row = await addRemedy({ failed: step, channelId, input: body });
  await recordAudit({ channelId, userId: user.id, action: "remedy", entity: "build_step", entityId: row.id, after: { remedyOf: step.id, ...body } });
  return json({ step: { id: row.id, title: row.title, remedyOfStepId: step.id } }, 201);
});
