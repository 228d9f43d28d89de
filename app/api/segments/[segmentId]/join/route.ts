import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { segmentJoinSchema } from "@/lib/schemas/script";
import { joinWithNext } from "@/lib/server/services/script";
import { toSegmentDto } from "@/lib/server/views/script";
import { AppError } from "@/lib/server/http/errors";

/** Joins the next segment onto this one; both versions must be the ones the writer saw. */
export const POST = channelRoute({ load: "segment", action: "script.write", body: segmentJoinSchema, what: "join" }, async ({ segment, user, body }) => {
  const input = body;
  const r = await joinWithNext({ id: segment.id, userId: user.id, ...input });
  if ("missing" in r) throw new AppError("not_found:segment", "This segment was deleted meanwhile.");
  if ("noNext" in r) throw new AppError("conflict:segment.last", "This is the last segment: there is nothing after it to join.");
  if ("conflict" in r) throw new AppError("conflict:segment.version", "One of the two segments changed since you loaded it; nothing was joined.", { current: toSegmentDto(r.conflict!) });
  return json({ segment: toSegmentDto(r.segment) });
});
