import "server-only";
import crypto from "node:crypto";

/**
 * The extension a stored object gets comes from its allow-listed content
 * type, never from a client's file name, so a key always says what the bytes
 * were accepted as.
 */
export const EXTENSION_BY_TYPE: Record<string, string> = {
  "video/mp4": "mp4",
  "video/quicktime": "mov",
  "video/webm": "webm",
  "video/x-matroska": "mkv",
  "video/x-msvideo": "avi",
  "video/mpeg": "mpg",
  "application/mxf": "mxf",
  "audio/wav": "wav",
  "audio/x-wav": "wav",
  "audio/mpeg": "mp3",
  "audio/mp4": "m4a",
  "audio/aac": "aac",
  "audio/flac": "flac",
  "image/jpeg": "jpg",
  "image/png": "png",
  "image/webp": "webp",
  "image/tiff": "tif",
};

const TYPE_BY_EXTENSION: Record<string, string> = Object.fromEntries(Object.entries(EXTENSION_BY_TYPE).map(([t, e]) => [e, t]));

/** channel/<channelId>/<kind>/<random>.<ext>, generated here and nowhere else. */
export function newObjectKey(channelId: string, kind: "footage" | "photo", contentType: string): string {
  const ext = EXTENSION_BY_TYPE[contentType] ?? "bin";
  return `${channelKeyPrefix(channelId)}${kind}/${crypto.randomUUID()}.${ext}`;
}

/**
 * How a stored object is served: its type from the key's extension, shown
 * inline only for pictures, video and sound a browser plays; anything else is
 * a download of application/octet-stream, so stored bytes never render as a page.
 */
export function servedAs(key: string): { contentType: string; disposition: "inline" | "attachment" } {
  const ext = key.split(".").pop()?.toLowerCase() ?? "";
  const type = TYPE_BY_EXTENSION[ext];
  if (type && /^(image\/(jpeg|png|webp)|video\/(mp4|webm|quicktime)|audio\/)/.test(type)) return { contentType: type, disposition: "inline" };
  return { contentType: "application/octet-stream", disposition: "attachment" };
}

/** The prefix every key of one channel (or, without an id, of every channel) starts with: for listing, never for access checks. */
export function channelKeyPrefix(channelId?: string): string {
  return channelId ? `channel/${channelId}/` : "channel/";
}
