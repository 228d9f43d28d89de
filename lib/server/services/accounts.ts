import "server-only";
/** Account writes whose rules span rows: joining by invitation, resetting a password, changing roles. */
import type { Role } from "../../roles";
import { db } from "../../../db/client";
import {
  getMembershipRow,
  getUserByEmailTx,
  insertMembership,
  insertUser,
  lockOpenInvitation,
  markInvitationAccepted,
  setPasswordAndEndSessions,
  spendAllResetTokens,
  spendResetToken,
} from "../../../db/queries/auth";
import { deleteMembership, lockMemberships, setMemberRoles } from "../../../db/queries/channels";

/**
 * Accepts an invitation in one transaction: creates the account (or uses the
 * existing one with that e-mail, when the password matches, checked by the
 * caller), adds the membership or merges the roles into it, and spends the token.
 */
export async function acceptInvitation({ tokenHash, name, passwordHash }: { tokenHash: string; name: string; passwordHash: string }) {
  return db().transaction(async (tx) => {
    const inv = await lockOpenInvitation(tx, tokenHash);
    if (!inv) return null;
    const user = (await getUserByEmailTx(tx, inv.email)) ?? (await insertUser(tx, { email: inv.email, name, passwordHash }));
    const existing = await getMembershipRow(tx, inv.channelId, user.id);
    if (existing) await setMemberRoles(tx, inv.channelId, user.id, Array.from(new Set([...existing.roles, ...inv.roles])));
    else await insertMembership(tx, { channelId: inv.channelId, userId: user.id, roles: inv.roles });
    await markInvitationAccepted(tx, inv.id);
    return { userId: user.id, email: inv.email, channelId: inv.channelId };
  });
}

/** Spends a reset token and sets the new password; null when the token is unknown, used or expired. */
export async function consumePasswordReset({ tokenHash, passwordHash }: { tokenHash: string; passwordHash: string }) {
  return db().transaction(async (tx) => {
    const row = await spendResetToken(tx, tokenHash);
    if (!row) return null;
    // Every other outstanding link for the account dies with this one, and every session signed before now ends.
    await spendAllResetTokens(tx, row.userId);
    await setPasswordAndEndSessions(tx, row.userId, passwordHash);
    return row.userId;
  });
}

/** Takes someone out of the channel (their records stay); the last owner cannot be removed. Their open live streams end on the next event. */
export async function removeMember({ channelId, userId }: { channelId: string; userId: string }) {
  return db().transaction(async (tx) => {
    const rows = await lockMemberships(tx, channelId);
    const target = rows.find((r) => r.userId === userId);
    if (!target) return { ok: false as const, reason: "not_found" as const };
    if (target.roles.includes("owner") && rows.filter((r) => r.roles.includes("owner")).length === 1) return { ok: false as const, reason: "last_owner" as const };
    await deleteMembership(tx, channelId, userId);
    return { ok: true as const };
  });
}

/** A channel always keeps at least one owner. */
export async function updateMemberRoles({ channelId, userId, roles }: { channelId: string; userId: string; roles: Role[] }) {
  return db().transaction(async (tx) => {
    const rows = await lockMemberships(tx, channelId);
    const target = rows.find((r) => r.userId === userId);
    if (!target) return { ok: false as const, reason: "not_found" as const };
    const ownersAfter = rows.filter((r) => (r.userId === userId ? roles.includes("owner") : r.roles.includes("owner"))).length;
    if (ownersAfter === 0) return { ok: false as const, reason: "last_owner" as const };
    await setMemberRoles(tx, channelId, userId, roles);
    return { ok: true as const };
  });
}
