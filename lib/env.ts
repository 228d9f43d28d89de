/**
 * Every environment variable Jigboard reads, validated once with zod.
 * Defaults point at the local services that `npm start` runs on 127.0.0.1;
 * set the variable to use a real PostgreSQL, S3-compatible store or SMTP relay.
 */
import { z } from "zod";

const bool = z
  .enum(["true", "false", "1", "0", "yes", "no"])
  .transform((v) => v === "true" || v === "1" || v === "yes");

export const LOCAL_PORTS = { postgres: 54329, s3: 54330, smtp: 54325, payments: 54326 } as const;

const envSchema = z.object({
  DATABASE_URL: z.url().default(`postgres://jigboard@127.0.0.1:${LOCAL_PORTS.postgres}/jigboard`),
  DATABASE_POOL_MAX: z.coerce.number().int().min(1).max(100).default(10),
  S3_ENDPOINT: z.url().default(`http://127.0.0.1:${LOCAL_PORTS.s3}`),
  S3_REGION: z.string().min(1).default("us-east-1"),
  S3_BUCKET: z.string().min(3).default("jigboard-media"),
  S3_ACCESS_KEY_ID: z.string().min(1).default("S3RVER"),
  S3_SECRET_ACCESS_KEY: z.string().min(1).default("S3RVER"),
  S3_FORCE_PATH_STYLE: bool.default(true),
  SMTP_URL: z.url().default(`smtp://127.0.0.1:${LOCAL_PORTS.smtp}`),
  MAIL_FROM: z.string().min(3).default("Jigboard <no-reply@jigboard.example>"),
  NEXTAUTH_URL: z.url().default("http://127.0.0.1:3000"),
  NEXTAUTH_SECRET: z.string().min(32, "NEXTAUTH_SECRET must be at least 32 characters"),
  /** First wait before a failed job (a mail the server refused) is tried again; it doubles each time. */
  JOB_RETRY_DELAY_SECONDS: z.coerce.number().int().min(1).max(3600).default(20),
  /** Signs channel exports; installations that share it can import each other's exports (defaults to one derived from NEXTAUTH_SECRET). */
  EXPORT_SIGNING_SECRET: z.string().min(32, "EXPORT_SIGNING_SECRET must be at least 32 characters").optional(),
  /** The dev-only mailbox page that shows what the local SMTP fake received. */
  DEV_MAILBOX: bool.default(true),
  /** Largest footage file accepted (bytes); 64 GiB by default. */
  UPLOAD_MAX_BYTES: z.coerce.number().int().min(1).default(64 * 1024 ** 3),
  /** Preferred multipart part size (bytes), at least 5 MiB. */
  UPLOAD_PART_BYTES: z.coerce.number().int().min(5 * 1024 * 1024).default(16 * 1024 * 1024),
  SIGN_IN_MAX_FAILURES: z.coerce.number().int().min(1).default(5),
  SIGN_IN_WINDOW_SECONDS: z.coerce.number().int().min(10).default(900),
  /** Only behind a proxy that sets X-Forwarded-For: then the rightmost entry is the client. Otherwise the socket address counts. */
  TRUST_PROXY: bool.default(false),
  /** The payments service (its official SDK). Defaults talk to the local fake that npm start runs. */
  STRIPE_SECRET_KEY: z.string().min(1).default("sk_test_local"),
  STRIPE_WEBHOOK_SECRET: z.string().min(1).default("whsec_local"),
  STRIPE_API_HOST: z.string().min(1).optional(),
  STRIPE_API_PORT: z.coerce.number().int().min(1).max(65535).optional(),
  STRIPE_API_PROTOCOL: z.enum(["http", "https"]).optional(),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

/** Parsed lazily so that `next build` does not need runtime secrets. */
export function env(): Env {
  if (cached) return cached;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const lines = parsed.error.issues.map((i) => `  ${i.path.join(".")}: ${i.message}`).join("\n");
    throw new Error(`Invalid environment:\n${lines}`);
  }
  cached = parsed.data;
  return cached;
}

/** For tests that change variables between cases. */
export function resetEnvCache(): void {
  cached = undefined;
}
