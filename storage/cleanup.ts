import "server-only";
import { abortUpload, listStaleUploads } from "./multipart";

/** Aborts multipart uploads under a prefix that were started before a date; returns how many. */
export async function abortStaleUploads(prefix: string, olderThan: Date): Promise<number> {
  const stale = await listStaleUploads(prefix, olderThan);
  for (const u of stale) await abortUpload(u.key, u.uploadId);
  return stale.length;
}
