import "server-only";
import { desc, eq } from "drizzle-orm";
import { db, type Tx } from "../client";
import { publishOverrides, publishPackages, users, type PublishPackage } from "../schema";

export async function getPublishPackage({ episodeId }: { episodeId: string }) {
  const [row] = await db().select().from(publishPackages).where(eq(publishPackages.episodeId, episodeId)).limit(1);
  return row ?? null;
}

/** Creates the episode's package or changes it; one row per episode. */
export async function upsertPublishPackage(tx: Tx, episodeId: string, values: Partial<Omit<PublishPackage, "id" | "episodeId" | "updatedAt">>) {
  const [row] = await tx
    .insert(publishPackages)
    .values({ episodeId, ...values })
    .onConflictDoUpdate({ target: publishPackages.episodeId, set: { ...values, updatedAt: new Date() } })
    .returning();
  return row!;
}

export async function insertPublishOverride(tx: Tx, values: { episodeId: string; userId: string; reason: string; failing: string[] }) {
  const [row] = await tx.insert(publishOverrides).values(values).returning();
  return row!;
}

export async function listPublishOverrides({ episodeId }: { episodeId: string }) {
  return db()
    .select({ override: publishOverrides, userName: users.name })
    .from(publishOverrides)
    .leftJoin(users, eq(users.id, publishOverrides.userId))
    .where(eq(publishOverrides.episodeId, episodeId))
    .orderBy(desc(publishOverrides.createdAt));
}
