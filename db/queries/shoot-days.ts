import "server-only";
import { and, asc, desc, eq, gte, inArray, lte, ne } from "drizzle-orm";
import { db, type Q, type Tx } from "../client";
import { buildSteps, callSheetSends, channels, daysAway, memberships, scheduledSteps, shootDayCrew, shootDayHelpers, shootDays, users, type ShootDay } from "../schema";

/** Rows of shoot days, their crew, days away, the saved schedule and call-sheet sends. Rules live in lib/server/services/shoot-days.ts. */

export async function getShootDayById({ id }: { id: string }) {
  const [row] = await db().select().from(shootDays).where(eq(shootDays.id, id)).limit(1);
  return row ?? null;
}

export async function listShootDaysByChannel({ channelId, from, to, includeCancelled = true }: { channelId: string; from?: string; to?: string; includeCancelled?: boolean }) {
  const where = [eq(shootDays.channelId, channelId)];
  if (from) where.push(gte(shootDays.day, from));
  if (to) where.push(lte(shootDays.day, to));
  if (!includeCancelled) where.push(ne(shootDays.status, "cancelled"));
  return db()
    .select()
    .from(shootDays)
    .where(and(...where))
    .orderBy(asc(shootDays.day), asc(shootDays.callAt));
}

export async function listCrewByDays(q: Q, dayIds: string[]) {
  if (!dayIds.length) return [];
  return q
    .select({ shootDayId: shootDayCrew.shootDayId, userId: shootDayCrew.userId, duty: shootDayCrew.duty, callAt: shootDayCrew.callAt, name: users.name, email: users.email })
    .from(shootDayCrew)
    .innerJoin(users, eq(users.id, shootDayCrew.userId))
    .where(inArray(shootDayCrew.shootDayId, dayIds))
    .orderBy(asc(users.name));
}

export async function listHelpersByDays(q: Q, dayIds: string[]) {
  if (!dayIds.length) return [];
  return q.select().from(shootDayHelpers).where(inArray(shootDayHelpers.shootDayId, dayIds)).orderBy(asc(shootDayHelpers.name));
}

/** The channel row, locked: every shoot-day write of a channel runs one at a time. */
export async function lockChannelForDays(tx: Tx, channelId: string) {
  const [row] = await tx.select().from(channels).where(eq(channels.id, channelId)).for("update");
  return row ?? null;
}

export async function insertShootDay(tx: Tx, values: typeof shootDays.$inferInsert) {
  const [row] = await tx.insert(shootDays).values(values).returning();
  return row!;
}

export async function updateShootDayRow(tx: Tx, id: string, set: Partial<typeof shootDays.$inferInsert>) {
  const [row] = await tx
    .update(shootDays)
    .set({ ...set, updatedAt: new Date() })
    .where(eq(shootDays.id, id))
    .returning();
  return row ?? null;
}

export async function deleteShootDayRow(tx: Tx, id: string) {
  const [row] = await tx.delete(shootDays).where(eq(shootDays.id, id)).returning();
  return row ?? null;
}

export async function replaceCrew(tx: Tx, shootDayId: string, crew: { userId: string; duty: string; callAt: Date | null }[]) {
  await tx.delete(shootDayCrew).where(eq(shootDayCrew.shootDayId, shootDayId));
  if (crew.length) await tx.insert(shootDayCrew).values(crew.map((c) => ({ shootDayId, ...c })));
}

export async function replaceHelpers(tx: Tx, shootDayId: string, helpers: { name: string; duty: string; email: string | null; callAt: Date | null }[]) {
  await tx.delete(shootDayHelpers).where(eq(shootDayHelpers.shootDayId, shootDayId));
  if (helpers.length) await tx.insert(shootDayHelpers).values(helpers.map((h) => ({ shootDayId, ...h })));
}

/** Which of these user ids are members of the channel. */
export async function memberIdsOf(q: Q, channelId: string, userIds: string[]) {
  if (!userIds.length) return new Set<string>();
  const rows = await q.select({ userId: memberships.userId }).from(memberships).where(and(eq(memberships.channelId, channelId), inArray(memberships.userId, userIds)));
  return new Set(rows.map((r) => r.userId));
}

export async function listMemberIds(q: Q, channelId: string) {
  const rows = await q.select({ userId: memberships.userId }).from(memberships).where(eq(memberships.channelId, channelId));
  return rows.map((r) => r.userId);
}

export async function listDaysAwayByChannel({ channelId, from, to }: { channelId: string; from?: string; to?: string }) {
  const where = [eq(daysAway.channelId, channelId)];
  if (from) where.push(gte(daysAway.day, from));
  if (to) where.push(lte(daysAway.day, to));
  return db()
    .select({ userId: daysAway.userId, name: users.name, date: daysAway.day, note: daysAway.note })
    .from(daysAway)
    .innerJoin(users, eq(users.id, daysAway.userId))
    .where(and(...where))
    .orderBy(asc(daysAway.day), asc(users.name));
}

export async function addDaysAway(tx: Tx, channelId: string, userId: string, dates: string[], note: string) {
  if (!dates.length) return;
  await tx
    .insert(daysAway)
    .values(dates.map((day) => ({ channelId, userId, day, note })))
    .onConflictDoUpdate({ target: [daysAway.channelId, daysAway.userId, daysAway.day], set: { note } });
}

export async function removeDaysAway(tx: Tx, channelId: string, userId: string, dates: string[]) {
  if (!dates.length) return;
  await tx.delete(daysAway).where(and(eq(daysAway.channelId, channelId), eq(daysAway.userId, userId), inArray(daysAway.day, dates)));
}

export async function listScheduledSteps(q: Q, episodeId: string) {
  return q.select().from(scheduledSteps).where(eq(scheduledSteps.episodeId, episodeId));
}

export async function replaceScheduledSteps(tx: Tx, episodeId: string, rows: { stepId: string; shootDayId: string | null; startsAt: Date; endsAt: Date }[]) {
  await tx.delete(scheduledSteps).where(eq(scheduledSteps.episodeId, episodeId));
  if (rows.length) await tx.insert(scheduledSteps).values(rows.map((r) => ({ ...r, episodeId })));
}

/** Saved steps on these days that belong to other episodes (their time is taken). */
export async function listTakenOnDays(q: Q, dayIds: string[], exceptEpisodeId: string) {
  if (!dayIds.length) return [];
  return q
    .select({ shootDayId: scheduledSteps.shootDayId, startsAt: scheduledSteps.startsAt, endsAt: scheduledSteps.endsAt })
    .from(scheduledSteps)
    .where(and(inArray(scheduledSteps.shootDayId, dayIds), ne(scheduledSteps.episodeId, exceptEpisodeId)));
}

/** Steps of any episode saved on a shoot day, in time order (the call sheet's running order). */
export async function listScheduledOnDay({ shootDayId }: { shootDayId: string }) {
  return db()
    .select({ step: buildSteps, startsAt: scheduledSteps.startsAt, endsAt: scheduledSteps.endsAt })
    .from(scheduledSteps)
    .innerJoin(buildSteps, eq(buildSteps.id, scheduledSteps.stepId))
    .where(eq(scheduledSteps.shootDayId, shootDayId))
    .orderBy(asc(scheduledSteps.startsAt));
}

export async function insertCallSheetSend(tx: Tx, v: { shootDayId: string; sentBy: string; recipients: string[] }) {
  const [row] = await tx.insert(callSheetSends).values(v).returning();
  return row!;
}

export async function getCallSheetSend({ id }: { id: string }) {
  const [row] = await db().select().from(callSheetSends).where(eq(callSheetSends.id, id)).limit(1);
  return row ?? null;
}

export async function markCallSheetSend({ id, status, error }: { id: string; status: "sent" | "failed" | "queued"; error?: string | null }) {
  await db()
    .update(callSheetSends)
    .set({ status, error: error ?? null, sentAt: status === "sent" ? new Date() : null })
    .where(eq(callSheetSends.id, id));
  if (status === "sent") {
    const [row] = await db().select({ shootDayId: callSheetSends.shootDayId }).from(callSheetSends).where(eq(callSheetSends.id, id));
    if (row) await db().update(shootDays).set({ callSheetSentAt: new Date() }).where(eq(shootDays.id, row.shootDayId));
  }
}

export async function listCallSheetSends({ shootDayId }: { shootDayId: string }) {
  return db().select().from(callSheetSends).where(eq(callSheetSends.shootDayId, shootDayId)).orderBy(desc(callSheetSends.queuedAt)).limit(20);
}

export async function setCalendarTokenHash(tx: Q, channelId: string, hash: string | null) {
  await tx.update(channels).set({ calendarTokenHash: hash }).where(eq(channels.id, channelId));
}

export async function getChannelByCalendarTokenHash({ hash }: { hash: string }) {
  const [row] = await db().select().from(channels).where(eq(channels.calendarTokenHash, hash)).limit(1);
  return row ?? null;
}

export type { ShootDay };
