import { publicRoute } from "@/lib/server/http/route-builder";
import { pingDatabase } from "@/db/queries/health";
import { storageHealthy } from "@/storage/s3";

export const dynamic = "force-dynamic";

/** Public: liveness of the app and its two stateful dependencies; no data revealed. */
export const GET = publicRoute({}, async () => {
  const [dbOk, storage] = await Promise.all([pingDatabase(), storageHealthy()]);
  const ok = dbOk && storage.ok;
  return Response.json({ ok, database: { ok: dbOk }, storage: { ok: storage.ok } }, { status: ok ? 200 : 503 });
});
