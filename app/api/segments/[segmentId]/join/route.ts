import { json, parseBody, route, sessionUser } from "@/lib/server/api";
import { loadSegment } from "@/lib/server/segment-loader";
import { assertCan } from "@/lib/server/access";
import { segmentJoinSchema } from "@/lib/schemas/script";
import { joinWithNext, toSegmentDto } from "@/db/queries/script";
import { AppError } from "@/lib/server/errors";

type P = { segmentId: string };

/** Joins the next segment onto this one; both versions must be the ones the writer saw. */
export const POST = route<P>(async (req, params) => {
  const input = await parseBody(req, segmentJoinSchema, "join");
  const user = await sessionUser(req);
  const { segment, access } = await loadSegment(user.id, params.segmentId);
  assertCan(access, "script.write");
  const r = await joinWithNext({ id: segment.id, userId: user.id, ...input });
  if ("missing" in r) throw new AppError("not_found:segment", "This segment was deleted meanwhile.");
  if ("noNext" in r) throw new AppError("conflict:segment.last", "This is the last segment: there is nothing after it to join.");
  if ("conflict" in r) throw new AppError("conflict:segment.version", "One of the two segments changed since you loaded it; nothing was joined.", { current: toSegmentDto(r.conflict!) });
  return json({ segment: toSegmentDto(r.segment) });
});
