import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "../client";
import { sponsors, tools } from "../schema";
import type { ToolCreate, ToolUpdate } from "../../lib/schemas/build";

export async function listToolsByChannel({ channelId }: { channelId: string }) {
  return db()
    .select()
    .from(tools)
    .where(and(eq(tools.channelId, channelId), isNull(tools.archivedAt)))
    .orderBy(asc(tools.name));
}

export async function getToolById({ id }: { id: string }) {
  const [row] = await db().select().from(tools).where(eq(tools.id, id)).limit(1);
  return row ?? null;
}

export async function sponsorBelongsToChannel({ sponsorId, channelId }: { sponsorId: string; channelId: string }) {
  const [row] = await db().select({ id: sponsors.id }).from(sponsors).where(and(eq(sponsors.id, sponsorId), eq(sponsors.channelId, channelId))).limit(1);
  return Boolean(row);
}

export async function createTool({ channelId, input }: { channelId: string; input: ToolCreate }) {
  const [row] = await db().insert(tools).values({ ...input, channelId }).returning();
  return row!;
}

export async function updateTool({ id, channelId, patch }: { id: string; channelId: string; patch: ToolUpdate }) {
  const [row] = await db().update(tools).set(patch).where(and(eq(tools.id, id), eq(tools.channelId, channelId))).returning();
  return row ?? null;
}

export async function archiveTool({ id, channelId }: { id: string; channelId: string }) {
  const [row] = await db()
    .update(tools)
    .set({ archivedAt: new Date() })
    .where(and(eq(tools.id, id), eq(tools.channelId, channelId), isNull(tools.archivedAt)))
    .returning();
  return row ?? null;
}
