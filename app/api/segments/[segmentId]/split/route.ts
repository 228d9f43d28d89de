import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadSegment } from "@/lib/server/segment-loader";
import { assertCan } from "@/lib/server/access";
import { segmentSplitSchema } from "@/lib/schemas/script";
import { splitSegment, toSegmentDto } from "@/db/queries/script";
import { AppError } from "@/lib/server/errors";

type P = { segmentId: string };

/** Splits a segment in two at the writer's cursor: this one keeps `before`, a new one after it gets `after`. */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, segmentSplitSchema, "split");
  const user = await sessionUser(req);
  const { segment, access } = await loadSegment(user.id, params.segmentId);
  assertCan(access, "script.write");
  const r = await splitSegment({ id: segment.id, userId: user.id, ...input });
  if ("missing" in r) throw new AppError("not_found:segment", "This segment was deleted meanwhile.");
  if ("conflict" in r) throw new AppError("conflict:segment.version", "Someone saved this segment after you loaded it; nothing was split. Merge first.", { current: toSegmentDto(r.conflict!) });
  return json({ first: toSegmentDto(r.first), second: toSegmentDto(r.second) }, 201);
});
