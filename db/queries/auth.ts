import "server-only";
import { and, eq, gt, isNull, sql } from "drizzle-orm";
import { db } from "../client";
import { invitations, memberships, passwordResets, signInAttempts, users, channels } from "../schema";
import type { Role } from "../../lib/roles";

export async function recordSignInAttempt({ keys, succeeded }: { keys: string[]; succeeded: boolean }) {
  await db().insert(signInAttempts).values(keys.map((key) => ({ key, succeeded })));
}

/**
 * Failures for a key since its last success, inside the window; the oldest of
 * them tells when the next attempt is allowed again.
 */
export async function countRecentFailures({ key, windowSeconds }: { key: string; windowSeconds: number }) {
  const rows = await db().execute(sql`
    select count(*)::int as failures, min(attempted_at) as oldest, max(attempted_at) as newest
    from sign_in_attempts
    where key = ${key}
      and not succeeded
      and attempted_at > now() - make_interval(secs => ${windowSeconds})
      and attempted_at > coalesce((select max(attempted_at) from sign_in_attempts where key = ${key} and succeeded), '-infinity')`);
  const r = rows.rows[0] as { failures: number; oldest: string | Date | null; newest: string | Date | null };
  return { failures: r.failures, oldest: r.oldest ? new Date(r.oldest) : null, newest: r.newest ? new Date(r.newest) : null };
}

export async function createInvitation(v: { channelId: string; email: string; roles: Role[]; tokenHash: string; invitedBy: string; expiresAt: Date }) {
  const [row] = await db().insert(invitations).values(v).returning();
  return row!;
}

export async function listInvitationsByChannel({ channelId }: { channelId: string }) {
  return db()
    .select({ id: invitations.id, email: invitations.email, roles: invitations.roles, expiresAt: invitations.expiresAt, createdAt: invitations.createdAt })
    .from(invitations)
    .where(and(eq(invitations.channelId, channelId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .orderBy(invitations.createdAt);
}

export async function revokeInvitation({ id, channelId }: { id: string; channelId: string }) {
  const [row] = await db()
    .update(invitations)
    .set({ revokedAt: new Date() })
    .where(and(eq(invitations.id, id), eq(invitations.channelId, channelId), isNull(invitations.acceptedAt), isNull(invitations.revokedAt)))
    .returning();
  return row ?? null;
}

export async function getOpenInvitationByTokenHash({ tokenHash }: { tokenHash: string }) {
  const [row] = await db()
    .select({ id: invitations.id, email: invitations.email, roles: invitations.roles, channelId: invitations.channelId, channelName: channels.name, expiresAt: invitations.expiresAt })
    .from(invitations)
    .innerJoin(channels, eq(channels.id, invitations.channelId))
    .where(and(eq(invitations.tokenHash, tokenHash), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .limit(1);
  return row ?? null;
}

/**
 * Accepts an invitation in one transaction: creates the account (or uses the
 * existing one with that e-mail, when the password matches, checked by the
 * caller), adds or merges the membership, and spends the token.
 */
export async function acceptInvitation({ tokenHash, name, passwordHash }: { tokenHash: string; name: string; passwordHash: string }) {
  return db().transaction(async (tx) => {
    const [inv] = await tx
      .select()
      .from(invitations)
      .where(and(eq(invitations.tokenHash, tokenHash), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
      .for("update")
      .limit(1);
    if (!inv) return null;
    let [user] = await tx.select().from(users).where(eq(users.email, inv.email)).limit(1);
    if (!user) {
      [user] = await tx.insert(users).values({ email: inv.email, name, passwordHash }).returning();
    }
    const [existing] = await tx
      .select()
      .from(memberships)
      .where(and(eq(memberships.channelId, inv.channelId), eq(memberships.userId, user!.id)))
      .limit(1);
    if (existing) {
      const merged = Array.from(new Set([...existing.roles, ...inv.roles]));
      await tx.update(memberships).set({ roles: merged }).where(and(eq(memberships.channelId, inv.channelId), eq(memberships.userId, user!.id)));
    } else {
      await tx.insert(memberships).values({ channelId: inv.channelId, userId: user!.id, roles: inv.roles });
    }
    await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, inv.id));
    return { userId: user!.id, email: inv.email, channelId: inv.channelId };
  });
}

/** Ends every session of the account: tokens carry the version they were signed with. */
export async function bumpSessionVersion({ userId }: { userId: string }) {
  await db()
    .update(users)
    .set({ sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId));
}

export async function createPasswordReset(v: { userId: string; tokenHash: string; expiresAt: Date }) {
  await db().insert(passwordResets).values(v);
}

/** Spends a reset token and sets the new password in one transaction; null when the token is unknown, used or expired. */
export async function consumePasswordReset({ tokenHash, passwordHash }: { tokenHash: string; passwordHash: string }) {
  return db().transaction(async (tx) => {
    const [row] = await tx
      .update(passwordResets)
      .set({ usedAt: new Date() })
      .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
      .returning();
    if (!row) return null;
    // Every other outstanding link for the account dies with this one, and every session signed before now ends.
    await tx.update(passwordResets).set({ usedAt: new Date() }).where(and(eq(passwordResets.userId, row.userId), isNull(passwordResets.usedAt)));
    await tx
      .update(users)
      .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
      .where(eq(users.id, row.userId));
    return row.userId;
  });
}
