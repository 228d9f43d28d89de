/**
 * s3rver accepts any V4 presigned URL without checking its signature, so a
 * PUT with another content type or length would pass where a real store
 * refuses it. This middleware does what S3 does for presigned requests:
 * recomputes the signature over the headers the URL says it signed (with the
 * values this request carries) and refuses a mismatch or an expired URL.
 * Local fake only; a real store needs none of this.
 */
import crypto from "node:crypto";
import { SignatureV4 } from "@smithy/signature-v4";

type Data = string | ArrayBuffer | ArrayBufferView;
const buf = (d: Data) => (typeof d === "string" ? Buffer.from(d) : ArrayBuffer.isView(d) ? Buffer.from(d.buffer, d.byteOffset, d.byteLength) : Buffer.from(d));

class NodeSha256 {
  private h: crypto.Hash | crypto.Hmac;
  constructor(secret?: Data) {
    this.h = secret ? crypto.createHmac("sha256", buf(secret)) : crypto.createHash("sha256");
  }
  update(d: Data) {
    this.h.update(buf(d));
  }
  async digest() {
    return new Uint8Array(this.h.digest());
  }
}

interface Ctx {
  method: string;
  path: string;
  query: Record<string, string | string[] | undefined>;
  host: string;
  get(name: string): string;
  status: number;
  type: string;
  body: unknown;
}

function denied(ctx: Ctx, code: string, message: string) {
  ctx.status = 403;
  ctx.type = "application/xml";
  ctx.body = `<?xml version="1.0" encoding="UTF-8"?><Error><Code>${code}</Code><Message>${message}</Message></Error>`;
}

export function presignedSignatureCheck(opts: { accessKeyId: string; secretAccessKey: string; region: string }) {
  const signer = new SignatureV4({ credentials: { accessKeyId: opts.accessKeyId, secretAccessKey: opts.secretAccessKey }, region: opts.region, service: "s3", sha256: NodeSha256, uriEscapePath: false, applyChecksum: false });
  return async (ctx: Ctx, next: () => Promise<void>) => {
    const q = ctx.query;
    const given = q["X-Amz-Signature"];
    // A CORS preflight carries the URL but is not the signed request.
    if (typeof given !== "string" || ctx.method === "OPTIONS") return next();
    const amzDate = String(q["X-Amz-Date"] ?? "");
    const m = /^(\d{4})(\d{2})(\d{2})T(\d{2})(\d{2})(\d{2})Z$/.exec(amzDate);
    const expiresIn = Number(q["X-Amz-Expires"]);
    if (!m || !Number.isFinite(expiresIn)) return denied(ctx, "AuthorizationQueryParametersError", "Malformed presigned URL.");
    const signingDate = new Date(Date.UTC(+m[1]!, +m[2]! - 1, +m[3]!, +m[4]!, +m[5]!, +m[6]!));
    if (Date.now() > signingDate.getTime() + expiresIn * 1000) return denied(ctx, "AccessDenied", "Request has expired");
    const signed = String(q["X-Amz-SignedHeaders"] ?? "host").split(";").filter(Boolean);
    const headers: Record<string, string> = {};
    for (const h of signed) headers[h] = h === "host" ? ctx.host : ctx.get(h);
    // The SDK sends the payload hash as a header that it hoists into the query; give it back as a header.
    const payload = q["X-Amz-Content-Sha256"];
    if (typeof payload === "string") headers["X-Amz-Content-Sha256"] = payload;
    const OWN = new Set(["X-Amz-Algorithm", "X-Amz-Credential", "X-Amz-Date", "X-Amz-Expires", "X-Amz-SignedHeaders", "X-Amz-Signature", "X-Amz-Content-Sha256"]);
    const query: Record<string, string | string[]> = {};
    for (const [k, v] of Object.entries(q)) if (v !== undefined && !OWN.has(k)) query[k] = v;
    const [hostname, port] = ctx.host.split(":");
    const again = await signer.presign(
      { method: ctx.method, protocol: "http:", hostname: hostname!, port: port ? Number(port) : undefined, path: ctx.path, query, headers },
      { signingDate, expiresIn, signableHeaders: new Set(signed), unhoistableHeaders: new Set(signed) },
    );
    if (again.query?.["X-Amz-Signature"] !== given) return denied(ctx, "SignatureDoesNotMatch", "The request signature we calculated does not match the signature you provided.");
    return next();
  };
}
