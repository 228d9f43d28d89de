/**
 * s3rver 3.7 stores multipart parts but does not answer three S3 operations
 * that resumable uploads need: ListParts, AbortMultipartUpload and
 * ListMultipartUploads. This Koa middleware answers them from s3rver's own
 * upload folders (<dir>/<bucket>/._S3rver_uploads/<uploadId>/), so the local
 * fake behaves like a real S3-compatible store for these calls. Local use only.
 */
import fs from "node:fs/promises";
import path from "node:path";

interface Ctx {
  method: string;
  path: string;
  query: Record<string, string | string[] | undefined>;
  status: number;
  body: unknown;
  type: string;
}

const esc = (s: string) => s.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;");
const XMLNS = 'xmlns="http://s3.amazonaws.com/doc/2006-03-01/"';

function uploadsDir(root: string, bucket: string) {
  return path.join(root, bucket, "._S3rver_uploads");
}

function noSuchUpload(ctx: Ctx, uploadId: string) {
  ctx.status = 404;
  ctx.type = "application/xml";
  ctx.body = `<?xml version="1.0" encoding="UTF-8"?><Error><Code>NoSuchUpload</Code><Message>The specified upload does not exist.</Message><UploadId>${esc(uploadId)}</UploadId></Error>`;
}

export function multipartExtension(root: string) {
  return async (ctx: Ctx, next: () => Promise<void>) => {
    const [, bucket, ...keyParts] = decodeURIComponent(ctx.path).split("/");
    const key = keyParts.join("/");
    const uploadId = typeof ctx.query.uploadId === "string" ? ctx.query.uploadId : undefined;
    if (!bucket) return next();
    if (!/^[0-9a-f]{32}$/.test(uploadId ?? "x") && uploadId !== undefined) return noSuchUpload(ctx, uploadId);

    // ListParts: GET /bucket/key?uploadId=…
    if (ctx.method === "GET" && key && uploadId) {
      const dir = path.join(uploadsDir(root, bucket), uploadId);
      const files = await fs.readdir(dir).catch(() => null);
      if (!files) return noSuchUpload(ctx, uploadId);
      const numbers = files.filter((f) => /^\d+$/.test(f)).map(Number).sort((a, b) => a - b);
      const parts = await Promise.all(
        numbers.map(async (n) => {
          const [stat, md5] = await Promise.all([fs.stat(path.join(dir, String(n))), fs.readFile(path.join(dir, `${n}.md5`), "utf8").catch(() => "")]);
          return `<Part><PartNumber>${n}</PartNumber><LastModified>${stat.mtime.toISOString()}</LastModified><ETag>"${esc(md5.trim())}"</ETag><Size>${stat.size}</Size></Part>`;
        }),
      );
      ctx.status = 200;
      ctx.type = "application/xml";
      ctx.body = `<?xml version="1.0" encoding="UTF-8"?><ListPartsResult ${XMLNS}><Bucket>${esc(bucket)}</Bucket><Key>${esc(key)}</Key><UploadId>${uploadId}</UploadId><MaxParts>10000</MaxParts><IsTruncated>false</IsTruncated>${parts.join("")}</ListPartsResult>`;
      return;
    }
    // AbortMultipartUpload: DELETE /bucket/key?uploadId=…
    if (ctx.method === "DELETE" && key && uploadId) {
      const dir = path.join(uploadsDir(root, bucket), uploadId);
      const exists = await fs.stat(dir).catch(() => null);
      if (!exists) return noSuchUpload(ctx, uploadId);
      await fs.rm(dir, { recursive: true, force: true });
      ctx.status = 204;
      ctx.body = null;
      return;
    }
    // ListMultipartUploads: GET /bucket?uploads[&prefix=…]
    if (ctx.method === "GET" && !key && "uploads" in ctx.query) {
      const prefix = typeof ctx.query.prefix === "string" ? ctx.query.prefix : "";
      const ids = await fs.readdir(uploadsDir(root, bucket)).catch(() => [] as string[]);
      const uploads: string[] = [];
      for (const id of ids) {
        const dir = path.join(uploadsDir(root, bucket), id);
        const k = await fs.readFile(path.join(dir, "key"), "utf8").catch(() => null);
        if (k == null || !k.startsWith(prefix)) continue;
        const stat = await fs.stat(path.join(dir, "key"));
        uploads.push(`<Upload><Key>${esc(k)}</Key><UploadId>${id}</UploadId><Initiated>${stat.mtime.toISOString()}</Initiated><StorageClass>STANDARD</StorageClass></Upload>`);
      }
      ctx.status = 200;
      ctx.type = "application/xml";
      ctx.body = `<?xml version="1.0" encoding="UTF-8"?><ListMultipartUploadsResult ${XMLNS}><Bucket>${esc(bucket)}</Bucket><Prefix>${esc(prefix)}</Prefix><MaxUploads>1000</MaxUploads><IsTruncated>false</IsTruncated>${uploads.join("")}</ListMultipartUploadsResult>`;
      return;
    }
    return next();
  };
}
