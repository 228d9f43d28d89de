/**
 * Starts whichever local services the environment does not point elsewhere:
 * PostgreSQL (DATABASE_URL), the S3 fake (S3_ENDPOINT) and the SMTP fake
 * (SMTP_URL) and the payments fake (STRIPE_SECRET_KEY). Used by `npm start`
 * and by the test harness. Node-only.
 */
import path from "node:path";
import fs from "node:fs";
import crypto from "node:crypto";
import { startLocalPostgres } from "./postgres";
import { startLocalS3 } from "../../../storage/local/s3";
import { startLocalSmtp } from "./smtp";
import { startLocalPayments } from "./payments";
import { runMigrations } from "../../../db/migrate";

export interface ServicePorts {
  postgres: number;
  s3: number;
  smtp: number;
  payments: number;
}

export interface StartedServices {
  env: Record<string, string>;
  localDatabase: boolean;
  stop(): Promise<void>;
}

export async function startLocalServices(opts: {
  dataRoot: string;
  ports: ServicePorts;
  database: string;
  fast?: boolean;
  log?: (msg: string) => void;
  /** Where the payments fake posts its signed webhooks (the app's address). */
  appUrl?: string;
}): Promise<StartedServices> {
  const log = opts.log ?? ((m: string) => console.log(m));
  const stops: (() => Promise<void>)[] = [];
  const out: Record<string, string> = {};
  fs.mkdirSync(opts.dataRoot, { recursive: true });

  try {
    let databaseUrl = process.env.DATABASE_URL;
    const localDatabase = !databaseUrl;
    if (!databaseUrl) {
      const pgc = await startLocalPostgres({
        dataDir: path.join(opts.dataRoot, "pg"),
        port: opts.ports.postgres,
        database: opts.database,
        fast: opts.fast,
      });
      stops.push(() => pgc.stop());
      databaseUrl = pgc.url;
      log(`[postgres] ${pgc.startedHere ? "started" : "already running"} on 127.0.0.1:${pgc.port}`);
    }
    out.DATABASE_URL = databaseUrl;
    await runMigrations(databaseUrl);
    log("[postgres] migrations applied");

    if (!process.env.S3_ENDPOINT) {
      const bucket = process.env.S3_BUCKET ?? "jigboard-media";
      const s3 = await startLocalS3({ directory: path.join(opts.dataRoot, "s3"), port: opts.ports.s3, bucket });
      stops.push(() => s3.stop());
      out.S3_ENDPOINT = s3.endpoint;
      out.S3_BUCKET = bucket;
      out.S3_ACCESS_KEY_ID = "S3RVER";
      out.S3_SECRET_ACCESS_KEY = "S3RVER";
      out.S3_FORCE_PATH_STYLE = "true";
      log(`[s3] fake store on ${s3.endpoint}, bucket ${bucket}`);
    }

    if (!process.env.SMTP_URL) {
      const smtp = await startLocalSmtp({ port: opts.ports.smtp, databaseUrl });
      stops.push(() => smtp.stop());
      out.SMTP_URL = smtp.url;
      out.DEV_MAILBOX = process.env.DEV_MAILBOX ?? "true";
      log(`[smtp] fake mail server on ${smtp.url}; owners read what it receives under Dev mailbox in the app`);
    } else if (!process.env.DEV_MAILBOX) {
      out.DEV_MAILBOX = "false";
    }

    if (!process.env.STRIPE_SECRET_KEY) {
      const secret = process.env.STRIPE_WEBHOOK_SECRET ?? `whsec_local_${crypto.randomBytes(12).toString("hex")}`;
      const pay = await startLocalPayments({ port: opts.ports.payments, webhookUrl: `${opts.appUrl ?? "http://127.0.0.1:3000"}/api/payments/webhook`, webhookSecret: secret });
      stops.push(() => pay.stop());
      out.STRIPE_SECRET_KEY = "sk_test_local";
      out.STRIPE_WEBHOOK_SECRET = secret;
      out.STRIPE_API_HOST = "127.0.0.1";
      out.STRIPE_API_PORT = String(pay.port);
      out.STRIPE_API_PROTOCOL = "http";
      log(`[payments] fake payments service on ${pay.url}`);
    }

    return {
      env: out,
      localDatabase,
      async stop() {
        for (const s of stops.reverse()) await s().catch((e: Error) => console.error(e.message));
      },
    };
  } catch (e) {
    for (const s of stops.reverse()) await s().catch(() => {});
    throw e;
  }
}

/** NEXTAUTH_SECRET from the environment, or generated once into the ignored data folder. */
export function authSecret(dataRoot: string): string {
  if (process.env.NEXTAUTH_SECRET) return process.env.NEXTAUTH_SECRET;
  const file = path.join(dataRoot, "auth-secret");
  if (fs.existsSync(file)) return fs.readFileSync(file, "utf8").trim();
  const secret = crypto.randomBytes(32).toString("base64url");
  fs.mkdirSync(dataRoot, { recursive: true });
  fs.writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

/** A putObject for the demo seed, talking to whichever store the services use. */
export async function demoPutObject(env: Record<string, string>) {
  const { S3Client, PutObjectCommand } = await import("@aws-sdk/client-s3");
  const client = new S3Client({
    endpoint: env.S3_ENDPOINT ?? process.env.S3_ENDPOINT,
    region: process.env.S3_REGION ?? "us-east-1",
    forcePathStyle: true,
    credentials: { accessKeyId: env.S3_ACCESS_KEY_ID ?? process.env.S3_ACCESS_KEY_ID ?? "S3RVER", secretAccessKey: env.S3_SECRET_ACCESS_KEY ?? process.env.S3_SECRET_ACCESS_KEY ?? "S3RVER" },
    requestChecksumCalculation: "WHEN_REQUIRED",
    responseChecksumValidation: "WHEN_REQUIRED",
  });
  const bucket = env.S3_BUCKET ?? process.env.S3_BUCKET ?? "jigboard-media";
  return async (key: string, bytes: Uint8Array, contentType: string) => {
    const r = await client.send(new PutObjectCommand({ Bucket: bucket, Key: key, Body: bytes, ContentType: contentType }));
    return r.ETag?.replace(/"/g, "") ?? null;
  };
}
