import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import { db, type Q, type Tx } from "../client";
import { channels, memberships, users } from "../schema";
import type { Role } from "../../lib/roles";

export async function getMembership({ userId, channelId }: { userId: string; channelId: string }) {
  const [row] = await db()
    .select({ roles: memberships.roles })
    .from(memberships)
    .innerJoin(channels, eq(channels.id, memberships.channelId))
    .where(and(eq(memberships.userId, userId), eq(memberships.channelId, channelId), isNull(channels.archivedAt)))
    .limit(1);
  return row ?? null;
}

export async function listChannelsByUser({ userId }: { userId: string }) {
  return db()
    .select({ id: channels.id, name: channels.name, roles: memberships.roles, units: channels.units, currency: channels.currency })
    .from(memberships)
    .innerJoin(channels, eq(channels.id, memberships.channelId))
    .where(and(eq(memberships.userId, userId), isNull(channels.archivedAt)))
    .orderBy(asc(channels.name));
}

export async function getChannelById({ id }: { id: string }) {
  const [row] = await db().select().from(channels).where(eq(channels.id, id)).limit(1);
  return row ?? null;
}

export async function listMembersByChannel({ channelId }: { channelId: string }) {
  return db()
    .select({ userId: users.id, name: users.name, email: users.email, roles: memberships.roles, joinedAt: memberships.createdAt })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.channelId, channelId))
    .orderBy(asc(users.name));
}

/** Every membership of the channel, locked for this transaction (so two owners cannot demote each other at once). */
export async function lockMemberships(tx: Tx, channelId: string) {
  return tx.select({ userId: memberships.userId, roles: memberships.roles }).from(memberships).where(eq(memberships.channelId, channelId)).for("update");
}

export async function setMemberRoles(tx: Q, channelId: string, userId: string, roles: Role[]) {
  await tx.update(memberships).set({ roles }).where(and(eq(memberships.channelId, channelId), eq(memberships.userId, userId)));
}

export async function deleteMembership(tx: Tx, channelId: string, userId: string) {
  await tx.delete(memberships).where(and(eq(memberships.channelId, channelId), eq(memberships.userId, userId)));
}

export async function updateChannel({ id, patch }: { id: string; patch: Partial<Pick<typeof channels.$inferInsert, "name" | "units" | "currency" | "brollGapMs" | "toCameraMaxMs" | "timeZone">> }) {
  const [row] = await db().update(channels).set(patch).where(eq(channels.id, id)).returning();
  return row ?? null;
}
