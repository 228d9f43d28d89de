import { json, parseId, route, sessionUser } from "@/lib/server/api";
import { requireChannel } from "@/lib/server/access";
import { getRevisionById, restoreRevision, toSegmentDto } from "@/db/queries/script";
import { AppError } from "@/lib/server/errors";

type P = { revisionId: string };

/** Puts the segment back as it was at this revision (a new version; history is kept). */
export const POST = route<P>(async (req, params) => {
  const user = await sessionUser(req);
  const id = parseId(params.revisionId, "revision");
  const row = await getRevisionById({ id });
  if (!row) throw new AppError("not_found:revision", "No such revision.");
  await requireChannel(user.id, row.channelId, "script.write", "revision");
  const segment = await restoreRevision({ revisionId: id, userId: user.id });
  if (!segment) throw new AppError("conflict:revision.empty", "This revision has nothing to restore.");
  return json({ segment: toSegmentDto(segment) });
});
