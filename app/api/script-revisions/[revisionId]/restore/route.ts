import { json } from "@/lib/server/http/api";
import { channelRoute } from "@/lib/server/http/route-builder";
import { restoreRevision } from "@/lib/server/services/script";
import { toSegmentDto } from "@/lib/server/views/script";
import { AppError } from "@/lib/server/http/errors";

/** Puts the segment back as it was at this revision (a new version; history is kept). */
export const POST = channelRoute({ load: "revision", action: "script.write" }, async ({ revision, user }) => {
  const segment = await restoreRevision({ revisionId: revision.id, userId: user.id });
  if (!segment) throw new AppError("conflict:revision.empty", "This revision has nothing to restore.");
  return json({ segment: toSegmentDto(segment) });
});
