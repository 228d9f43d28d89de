import { pingDatabase } from "@/db/queries/health";
import { storageHealthy } from "@/storage/s3";

export const dynamic = "force-dynamic";

/** Liveness of the app and its two stateful dependencies; no session needed, no data revealed. */
export async function GET() {
  const [dbOk, storage] = await Promise.all([pingDatabase(), storageHealthy()]);
  const ok = dbOk && storage.ok;
  return Response.json({ ok, database: { ok: dbOk }, storage: { ok: storage.ok } }, { status: ok ? 200 : 503 });
}
