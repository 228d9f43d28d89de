import "server-only";
import { and, eq, gt, isNull, sql } from "drizzle-orm";
import { db, type Tx } from "../client";
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

/** An open invitation by its token hash, locked for this transaction. */
export async function lockOpenInvitation(tx: Tx, tokenHash: string) {
  const [row] = await tx
    .select()
    .from(invitations)
    .where(and(eq(invitations.tokenHash, tokenHash), isNull(invitations.acceptedAt), isNull(invitations.revokedAt), gt(invitations.expiresAt, new Date())))
    .for("update")
    .limit(1);
  return row ?? null;
}

export async function markInvitationAccepted(tx: Tx, id: string) {
  await tx.update(invitations).set({ acceptedAt: new Date() }).where(eq(invitations.id, id));
}

export async function getUserByEmailTx(tx: Tx, email: string) {
  const [row] = await tx.select().from(users).where(eq(users.email, email)).limit(1);
  return row ?? null;
}

export async function insertUser(tx: Tx, v: { email: string; name: string; passwordHash: string }) {
  const [row] = await tx.insert(users).values(v).returning();
  return row!;
}

export async function getMembershipRow(tx: Tx, channelId: string, userId: string) {
  const [row] = await tx.select().from(memberships).where(and(eq(memberships.channelId, channelId), eq(memberships.userId, userId))).limit(1);
  return row ?? null;
}

export async function insertMembership(tx: Tx, v: { channelId: string; userId: string; roles: Role[] }) {
  await tx.insert(memberships).values(v);
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

/** Spends one unexpired, unused reset token; the row, or null. */
export async function spendResetToken(tx: Tx, tokenHash: string) {
  const [row] = await tx
    .update(passwordResets)
    .set({ usedAt: new Date() })
    .where(and(eq(passwordResets.tokenHash, tokenHash), isNull(passwordResets.usedAt), gt(passwordResets.expiresAt, new Date())))
    .returning();
  return row ?? null;
}

export async function spendAllResetTokens(tx: Tx, userId: string) {
  await tx.update(passwordResets).set({ usedAt: new Date() }).where(and(eq(passwordResets.userId, userId), isNull(passwordResets.usedAt)));
}

/** Sets a new password hash and bumps the session version, which ends every older session. */
export async function setPasswordAndEndSessions(tx: Tx, userId: string, passwordHash: string) {
  await tx
    .update(users)
    .set({ passwordHash, sessionVersion: sql`${users.sessionVersion} + 1` })
    .where(eq(users.id, userId));
}
