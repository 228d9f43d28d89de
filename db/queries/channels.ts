import "server-only";
import { and, asc, eq, isNull } from "drizzle-orm";
import { db } from "../client";
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

export async function updateMemberRoles({ channelId, userId, roles }: { channelId: string; userId: string; roles: Role[] }) {
  return db().transaction(async (tx) => {
    // Lock the channel's memberships so two owners cannot demote each other at once.
    const rows = await tx
      .select({ userId: memberships.userId, roles: memberships.roles })
      .from(memberships)
      .where(eq(memberships.channelId, channelId))
      .for("update");
    const target = rows.find((r) => r.userId === userId);
    if (!target) return { ok: false as const, reason: "not_found" as const };
    const ownersAfter = rows.filter((r) => (r.userId === userId ? roles.includes("owner") : r.roles.includes("owner"))).length;
    if (ownersAfter === 0) return { ok: false as const, reason: "last_owner" as const };
    await tx.update(memberships).set({ roles }).where(and(eq(memberships.channelId, channelId), eq(memberships.userId, userId)));
    return { ok: true as const };
  });
}

export async function updateChannel({ id, patch }: { id: string; patch: Partial<Pick<typeof channels.$inferInsert, "name" | "units" | "currency" | "brollGapMs" | "toCameraMaxMs">> }) {
  const [row] = await db().update(channels).set(patch).where(eq(channels.id, id)).returning();
  return row ?? null;
}
