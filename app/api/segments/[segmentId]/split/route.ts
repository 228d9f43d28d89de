import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { segmentSplitSchema } from "@/lib/schemas/script";
import { splitSegment } from "@/lib/server/services/script";
import { toSegmentDto } from "@/lib/server/views/script";
import { AppError } from "@/lib/server/http/errors";

/** Splits a segment in two at the writer's cursor: this one keeps `before`, a new one after it gets `after`. */
export const POST = channelRoute({ load: "segment", action: "script.write", body: segmentSplitSchema, what: "split" }, async ({ segment, user, body }) => {
  const input = body;
  const r = await splitSegment({ id: segment.id, userId: user.id, ...input });
  if ("missing" in r) throw new AppError("not_found:segment", "This segment was deleted meanwhile.");
  if ("conflict" in r) throw new AppError("conflict:segment.version", "Someone saved this segment after you loaded it; nothing was split. Merge first.", { current: toSegmentDto(r.conflict!) });
  return json({ first: toSegmentDto(r.first), second: toSegmentDto(r.second) }, 201);
});
