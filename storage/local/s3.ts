/**
 * The local S3-compatible fake (s3rver) on 127.0.0.1, with the bucket created
 * at start. Replace it with a real store by setting S3_ENDPOINT and friends.
 */
import fs from "node:fs";
import path from "node:path";
// s3rver ships no types.
// @ts-expect-error untyped package
import S3rver from "s3rver";
import { multipartExtension } from "./s3-multipart";
import { presignedSignatureCheck } from "./s3-presigned";

const CORS = `<CORSConfiguration>
  <CORSRule>
    <AllowedOrigin>*</AllowedOrigin>
    <AllowedMethod>GET</AllowedMethod>
    <AllowedMethod>PUT</AllowedMethod>
    <AllowedMethod>POST</AllowedMethod>
    <AllowedMethod>HEAD</AllowedMethod>
    <AllowedMethod>DELETE</AllowedMethod>
    <AllowedHeader>*</AllowedHeader>
    <ExposeHeader>ETag</ExposeHeader>
    <MaxAgeSeconds>3000</MaxAgeSeconds>
  </CORSRule>
</CORSConfiguration>`;

export interface LocalS3 {
  endpoint: string;
  stop(): Promise<void>;
}

export async function startLocalS3(opts: { directory: string; port: number; bucket: string; region?: string }): Promise<LocalS3> {
  fs.mkdirSync(opts.directory, { recursive: true });
  const server = new S3rver({
    address: "127.0.0.1",
    port: opts.port,
    directory: path.resolve(opts.directory),
    silent: true,
    configureBuckets: [{ name: opts.bucket, configs: [CORS] }],
  });
  // Answer the multipart calls s3rver lacks before its own router sees them.
  (server as { middleware: unknown[] }).middleware.unshift(multipartExtension(path.resolve(opts.directory)));
  // Check presigned signatures as a real store does, before anything else.
  (server as { middleware: unknown[] }).middleware.unshift(presignedSignatureCheck({ accessKeyId: "S3RVER", secretAccessKey: "S3RVER", region: opts.region ?? "us-east-1" }));
  await server.run();
  return {
    endpoint: `http://127.0.0.1:${opts.port}`,
    async stop() {
      await server.close();
    },
  };
}
