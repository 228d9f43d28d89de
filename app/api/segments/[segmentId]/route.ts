import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { assertCan } from "@/lib/server/access/access";
import { ANNOTATION_FIELDS, segmentSaveSchema } from "@/lib/schemas/script";
import { deleteSegment, saveSegment } from "@/lib/server/services/script";
import { toSegmentDto } from "@/lib/server/views/script";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { AppError } from "@/lib/server/http/errors";

/**
 * Saves a segment. The body names the version it was based on; if someone
 * saved in between, nothing is written and the answer is 409 with the newer
 * segment in error.current, so the writer can merge instead of overwriting.
 */
export const PATCH = channelRoute({ load: "segment", action: ["script.write", "script.annotate"], body: segmentSaveSchema, what: "segment" }, async ({ segment, access, user, body }) => {
  const save = body;
  const { version: _v, ...fields } = save;
  const annotationOnly = Object.keys(fields).every((k) => (ANNOTATION_FIELDS as readonly string[]).includes(k));
  assertCan(access, annotationOnly ? "script.annotate" : "script.write");
  if (fields.stepId && !(await listStepTitlesByEpisode({ episodeId: segment.episodeId })).some((s) => s.id === fields.stepId)) {
    throw new AppError("unprocessable:segment.step", "That build step is not in this episode.", { fields: { stepId: ["not a step of this episode"] } });
  }
  const r = await saveSegment({ id: segment.id, userId: user.id, save });
  if ("missing" in r) throw new AppError("not_found:segment", "This segment was deleted meanwhile.");
  if ("conflict" in r) {
    throw new AppError("conflict:segment.version", "Someone saved this segment after you loaded it. Nothing was overwritten: compare both versions and merge.", {
      current: toSegmentDto(r.conflict!),
    });
  }
  return json({ segment: toSegmentDto(r.segment) });
});

export const DELETE = channelRoute({ load: "segment", action: "script.write" }, async ({ segment, user }) => {
  await deleteSegment({ id: segment.id, userId: user.id });
  return json({ ok: true });
});
