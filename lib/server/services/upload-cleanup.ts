import "server-only";
import { subDays } from "date-fns";
import { abortUpload } from "../../../storage/multipart";
import { abortStaleUploads } from "../../../storage/cleanup";
import { channelKeyPrefix } from "../../../storage/keys";
import { deleteClipRow, listStaleUploadingClips } from "../../../db/queries/footage";

/**
 * Aborts multipart uploads older than a day under a channel's prefix (or all
 * channels) and removes their unfinished clip rows. Safe to run often.
 */
export async function cleanupAbandonedUploads(channelId?: string, olderThan = subDays(new Date(), 1)) {
  const abortedUploads = await abortStaleUploads(channelKeyPrefix(channelId), olderThan);
  const rows = await listStaleUploadingClips({ channelId, before: olderThan });
  for (const c of rows) {
    if (c.uploadId) await abortUpload(c.storageKey, c.uploadId);
    await deleteClipRow({ id: c.id });
  }
  return { abortedUploads, removedClips: rows.length };
}
