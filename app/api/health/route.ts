import { sql } from "drizzle-orm";
import { db } from "@/db/client";
import { storageHealthy } from "@/storage/s3";

export const dynamic = "force-dynamic";

/** Liveness of the app and its two stateful dependencies; no session needed, no data revealed. */
export async function GET() {
  const database = await db()
    .execute(sql`select 1`)
    .then(() => ({ ok: true }))
    .catch(() => ({ ok: false }));
  const storage = await storageHealthy();
  const ok = database.ok && storage.ok;
  return Response.json({ ok, database, storage: { ok: storage.ok } }, { status: ok ? 200 : 503 });
}
