import "server-only";
import { AppError } from "../http/errors";
import { newObjectKey } from "../../../storage/keys";
import { presignPut } from "../../../storage/presign";
import { headObject } from "../../../storage/s3";
import { createPendingUpload, getPendingUploadByKey, markPendingUploadUsed } from "../../../db/queries/uploads";
import type { PendingUpload } from "../../../db/schema";

type Purpose = PendingUpload["purpose"];

/** Issues a key and a signed PUT for one photo, and records what the key was issued for. */
export async function issuePhotoUpload({ channelId, userId, purpose, contentType, size }: { channelId: string; userId: string; purpose: Purpose; contentType: string; size: number }) {
  const key = newObjectKey(channelId, "photo", contentType);
  await createPendingUpload({ key, channelId, purpose, contentType, sizeBytes: size, createdBy: userId });
  return { key, uploadUrl: await presignPut(key, contentType, size), headers: { "content-type": contentType } };
}

/**
 * A storage key a client sends back must be one this server issued to this
 * channel for this purpose, compared exactly (no prefix test, nothing
 * normalised), and the stored object must be the type and size it was
 * issued for. Anything else is 422.
 */
export async function claimUpload({ key, channelId, purpose, field }: { key: string; channelId: string; purpose: Purpose; field: string }): Promise<void> {
  const refuse = () => new AppError("unprocessable:upload.key", "That file was not uploaded here for this. Upload it again.", { fields: { [field]: ["not an upload issued to this channel for this purpose"] } });
  const issued = await getPendingUploadByKey({ key, channelId, purpose });
  if (!issued) throw refuse();
  const head = await headObject(issued.key);
  if (!head || head.size !== issued.sizeBytes || (head.contentType && head.contentType !== issued.contentType)) throw refuse();
  await markPendingUploadUsed({ key: issued.key });
}
