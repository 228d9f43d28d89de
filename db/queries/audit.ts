import "server-only";
import { db } from "../client";
import { auditEntries } from "../schema";

export async function recordAudit(v: {
  channelId: string | null;
  userId: string | null;
  action: string;
  entity: string;
  entityId?: string;
  before?: unknown;
  after?: unknown;
}) {
  await db()
    .insert(auditEntries)
    .values({ ...v, before: v.before ?? null, after: v.after ?? null })
    .catch((e: Error) => console.error("[audit] not recorded", e.message));
}
