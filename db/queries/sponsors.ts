import "server-only";
import { and, asc, eq, gt, inArray, isNull, sql } from "drizzle-orm";
import { db, type Q, type Tx } from "../client";
import { dealEpisodes, dealTools, deals, deliverables, episodes, guestLinks, invoices, paymentEvents, reviewComments, sponsorContacts, sponsors, tools, users, type Deal } from "../schema";

/** Rows of sponsors, deals and deliverables. Rules live in lib/server/services/sponsors.ts. */

export async function listSponsorsByChannel({ channelId, archived = false }: { channelId: string; archived?: boolean }) {
  const rows = await db()
    .select()
    .from(sponsors)
    .where(and(eq(sponsors.channelId, channelId), archived ? undefined : isNull(sponsors.archivedAt)))
    .orderBy(asc(sponsors.name));
  return rows;
}

export async function getSponsorById({ id }: { id: string }) {
  const [row] = await db().select().from(sponsors).where(eq(sponsors.id, id)).limit(1);
  return row ?? null;
}

export async function listContactsBySponsors(q: Q, sponsorIds: string[]) {
  if (!sponsorIds.length) return [];
  return q.select().from(sponsorContacts).where(inArray(sponsorContacts.sponsorId, sponsorIds)).orderBy(asc(sponsorContacts.name));
}

export async function insertSponsor(tx: Tx, v: typeof sponsors.$inferInsert) {
  const [row] = await tx.insert(sponsors).values(v).returning();
  return row!;
}

export async function updateSponsorRow(tx: Tx, id: string, set: Partial<typeof sponsors.$inferInsert>) {
  const [row] = await tx.update(sponsors).set(set).where(eq(sponsors.id, id)).returning();
  return row ?? null;
}

export async function replaceContacts(tx: Tx, sponsorId: string, contacts: { name: string; email: string }[]) {
  await tx.delete(sponsorContacts).where(eq(sponsorContacts.sponsorId, sponsorId));
  if (contacts.length) await tx.insert(sponsorContacts).values(contacts.map((c) => ({ sponsorId, ...c })));
}

export async function getDealById({ id }: { id: string }) {
  const [row] = await db().select().from(deals).where(eq(deals.id, id)).limit(1);
  return row ?? null;
}

export async function listDealsByChannel({ channelId }: { channelId: string }) {
  return db()
    .select()
    .from(deals)
    .where(and(eq(deals.channelId, channelId), isNull(deals.archivedAt)))
    .orderBy(asc(deals.createdAt));
}

export async function listDealsByEpisode({ episodeId }: { episodeId: string }) {
  return db()
    .select({ deal: deals })
    .from(dealEpisodes)
    .innerJoin(deals, eq(deals.id, dealEpisodes.dealId))
    .where(and(eq(dealEpisodes.episodeId, episodeId), isNull(deals.archivedAt)))
    .then((r) => r.map((x) => x.deal));
}

export async function dealLinks(q: Q, dealIds: string[]) {
  if (!dealIds.length) return { episodes: [], tools: [], deliverables: [] };
  const [e, t, d] = await Promise.all([
    q.select().from(dealEpisodes).where(inArray(dealEpisodes.dealId, dealIds)),
    q.select().from(dealTools).where(inArray(dealTools.dealId, dealIds)),
    q.select().from(deliverables).where(inArray(deliverables.dealId, dealIds)).orderBy(asc(deliverables.position), asc(deliverables.createdAt)),
  ]);
  return { episodes: e, tools: t, deliverables: d };
}

export async function insertDeal(tx: Tx, v: typeof deals.$inferInsert) {
  const [row] = await tx.insert(deals).values(v).returning();
  return row!;
}

export async function updateDealRow(tx: Tx, id: string, set: Partial<typeof deals.$inferInsert>) {
  const [row] = await tx
    .update(deals)
    .set({ ...set, updatedAt: new Date() })
    .where(eq(deals.id, id))
    .returning();
  return row ?? null;
}

export async function replaceDealEpisodes(tx: Tx, dealId: string, episodeIds: string[]) {
  await tx.delete(dealEpisodes).where(eq(dealEpisodes.dealId, dealId));
  if (episodeIds.length) await tx.insert(dealEpisodes).values(episodeIds.map((episodeId) => ({ dealId, episodeId })));
}

export async function replaceDealTools(tx: Tx, dealId: string, toolIds: string[]) {
  await tx.delete(dealTools).where(eq(dealTools.dealId, dealId));
  if (toolIds.length) await tx.insert(dealTools).values(toolIds.map((toolId) => ({ dealId, toolId })));
}

/** Which of these ids are the channel's episodes, and which its tools. */
export async function channelOwns(q: Q, channelId: string, episodeIds: string[], toolIds: string[], sponsorId?: string) {
  const [e, t, s] = await Promise.all([
    episodeIds.length ? q.select({ id: episodes.id }).from(episodes).where(and(eq(episodes.channelId, channelId), inArray(episodes.id, episodeIds))) : [],
    toolIds.length ? q.select({ id: tools.id }).from(tools).where(and(eq(tools.channelId, channelId), inArray(tools.id, toolIds))) : [],
    sponsorId ? q.select({ id: sponsors.id }).from(sponsors).where(and(eq(sponsors.channelId, channelId), eq(sponsors.id, sponsorId))) : [],
  ]);
  return { episodes: new Set(e.map((x) => x.id)), tools: new Set(t.map((x) => x.id)), sponsor: s.length > 0 };
}

export async function insertDeliverable(tx: Tx, v: typeof deliverables.$inferInsert) {
  const [row] = await tx.insert(deliverables).values(v).returning();
  return row!;
}

export async function getDeliverableById({ id }: { id: string }) {
  const [row] = await db().select({ deliverable: deliverables, channelId: deals.channelId }).from(deliverables).innerJoin(deals, eq(deals.id, deliverables.dealId)).where(eq(deliverables.id, id)).limit(1);
  return row ?? null;
}

export async function deleteDeliverableRow(tx: Tx, id: string) {
  const [row] = await tx.delete(deliverables).where(eq(deliverables.id, id)).returning();
  return row ?? null;
}

/** Episodes (of these) that have a deal or use a tool that was not bought. */
/** Episodes of a channel with a live deal or a gifted, loaned or paid tool in their plan. */
export async function episodesWithSponsorWork({ channelId }: { channelId: string }) {
  const r = await db().execute(sql`
    select e.id from episodes e
    where e.channel_id = ${channelId}
      and (exists (select 1 from deal_episodes de join deals d on d.id = de.deal_id where de.episode_id = e.id and d.archived_at is null)
        or exists (select 1 from build_steps s join step_tools st on st.step_id = s.id join tools t on t.id = st.tool_id where s.episode_id = e.id and t.acquisition <> 'bought'))`);
  return (r.rows as { id: string }[]).map((x) => x.id);
}


export async function insertGuestLink(tx: Tx, v: typeof guestLinks.$inferInsert) {
  const [row] = await tx.insert(guestLinks).values(v).returning();
  return row!;
}

/** A review link that still works (not revoked, not expired), with its deal. */
export async function getLiveGuestLinkByHash({ hash }: { hash: string }) {
  const [row] = await db()
    .select({ link: guestLinks, deal: deals })
    .from(guestLinks)
    .innerJoin(deals, eq(deals.id, guestLinks.dealId))
    .where(and(eq(guestLinks.tokenHash, hash), isNull(guestLinks.revokedAt), gt(guestLinks.expiresAt, new Date()), isNull(deals.archivedAt)))
    .limit(1);
  return row ?? null;
}

export async function getGuestLinkById({ id }: { id: string }) {
  const [row] = await db().select({ link: guestLinks, channelId: deals.channelId }).from(guestLinks).innerJoin(deals, eq(deals.id, guestLinks.dealId)).where(eq(guestLinks.id, id)).limit(1);
  return row ?? null;
}

export async function revokeGuestLinkRow(tx: Tx, id: string) {
  const [row] = await tx.update(guestLinks).set({ revokedAt: new Date() }).where(and(eq(guestLinks.id, id), isNull(guestLinks.revokedAt))).returning();
  return row ?? null;
}

export async function listGuestLinks({ dealId }: { dealId: string }) {
  return db().select().from(guestLinks).where(eq(guestLinks.dealId, dealId)).orderBy(asc(guestLinks.createdAt));
}

export async function insertReviewComment(tx: Tx, v: typeof reviewComments.$inferInsert) {
  const [row] = await tx.insert(reviewComments).values(v).returning();
  return row!;
}

export async function listReviewComments({ dealId }: { dealId: string }) {
  return db()
    .select({ comment: reviewComments, userName: users.name })
    .from(reviewComments)
    .leftJoin(users, eq(users.id, reviewComments.userId))
    .where(eq(reviewComments.dealId, dealId))
    .orderBy(asc(reviewComments.createdAt));
}


export async function insertInvoice(tx: Q, v: typeof invoices.$inferInsert) {
  const [row] = await tx.insert(invoices).values(v).returning();
  return row!;
}

export async function updateInvoiceRow(tx: Q, id: string, set: Partial<typeof invoices.$inferInsert>) {
  const [row] = await tx.update(invoices).set(set).where(eq(invoices.id, id)).returning();
  return row ?? null;
}

/** Every invoice recorded for one provider invoice (a channel and its imported copy share it). */
export async function listInvoicesByProviderId(q: Q, providerId: string) {
  return q.select().from(invoices).where(eq(invoices.providerId, providerId));
}


/** Records an event id once; false when it was seen before (the same event twice changes nothing). */
export async function recordPaymentEvent(tx: Tx, id: string, type: string) {
  const rows = await tx.insert(paymentEvents).values({ id, type }).onConflictDoNothing().returning();
  return rows.length > 0;
}

export async function listInvoicesByChannel({ channelId }: { channelId: string }) {
  return db()
    .select({ invoice: invoices, dealTitle: deals.title, sponsorId: deals.sponsorId, sponsorName: sponsors.name })
    .from(invoices)
    .innerJoin(deals, eq(deals.id, invoices.dealId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .where(eq(deals.channelId, channelId))
    .orderBy(asc(invoices.createdAt));
}

export type { Deal };
