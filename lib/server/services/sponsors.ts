import "server-only";
/** Sponsors, deals and deliverables. A deal's sponsor, episodes and tools must all be the channel's. */
import type { DealCreate, DealUpdate, DeliverableCreate, SponsorCreate } from "../../schemas/sponsors";
import { AppError } from "../http/errors";
import { db, type Tx } from "../../../db/client";
import type { Deal, GuestLink, Sponsor } from "../../../db/schema";
import { channelOwns, deleteDeliverableRow, listInvoicesByProviderId, insertDeal, insertInvoice, recordPaymentEvent, updateInvoiceRow, insertDeliverable, insertGuestLink, insertReviewComment, insertSponsor, replaceContacts, replaceDealEpisodes, replaceDealTools, revokeGuestLinkRow, updateDealRow, updateSponsorRow } from "../../../db/queries/sponsors";
import { newToken } from "../infra/tokens";
import { appUrl, sendMail } from "../infra/mail";
import { dealScript } from "../views/sponsors";
import { payments } from "../infra/payments";

export async function createSponsor({ channelId, input }: { channelId: string; input: SponsorCreate }) {
  return db().transaction(async (tx) => {
    const { contacts, ...fields } = input;
    const row = await insertSponsor(tx, { ...fields, channelId, contactName: contacts[0]?.name ?? "", contactEmail: contacts[0]?.email ?? "" });
    await replaceContacts(tx, row.id, contacts);
    return row;
  });
}

export async function updateSponsor({ sponsor, patch }: { sponsor: Sponsor; patch: Partial<SponsorCreate> }) {
  return db().transaction(async (tx) => {
    const { contacts, ...fields } = patch;
    const row = (await updateSponsorRow(tx, sponsor.id, { ...fields, ...(contacts ? { contactName: contacts[0]?.name ?? "", contactEmail: contacts[0]?.email ?? "" } : {}) }))!;
    if (contacts) await replaceContacts(tx, sponsor.id, contacts);
    return row;
  });
}

export async function archiveSponsor({ sponsor }: { sponsor: Sponsor }) {
  return db().transaction((tx) => updateSponsorRow(tx, sponsor.id, { archivedAt: new Date() }));
}

async function checkDealLinks(tx: Tx, channelId: string, input: { sponsorId?: string; episodeIds?: string[]; toolIds?: string[] }) {
  const owned = await channelOwns(tx, channelId, input.episodeIds ?? [], input.toolIds ?? [], input.sponsorId);
  const fields: Record<string, string[]> = {};
  if (input.sponsorId && !owned.sponsor) fields.sponsorId = ["not a sponsor of this channel"];
  const strayE = (input.episodeIds ?? []).filter((e) => !owned.episodes.has(e));
  if (strayE.length) fields.episodeIds = [`${strayE.length} of these episodes are not on this channel`];
  const strayT = (input.toolIds ?? []).filter((t) => !owned.tools.has(t));
  if (strayT.length) fields.toolIds = [`${strayT.length} of these tools are not on this channel's shelf`];
  if (Object.keys(fields).length) throw new AppError("unprocessable:deal.links", "Some linked records do not belong to this channel.", { fields });
}

export async function createDeal({ channelId, input }: { channelId: string; input: DealCreate }) {
  return db().transaction(async (tx) => {
    await checkDealLinks(tx, channelId, input);
    const { episodeIds, toolIds, ...fields } = input;
    const row = await insertDeal(tx, { ...fields, channelId, episodeId: episodeIds[0] ?? null });
    await replaceDealEpisodes(tx, row.id, episodeIds);
    await replaceDealTools(tx, row.id, toolIds);
    return row;
  });
}

export async function updateDeal({ deal, patch }: { deal: Deal; patch: DealUpdate }) {
  return db().transaction(async (tx) => {
    await checkDealLinks(tx, deal.channelId, patch);
    const from = patch.publishFrom !== undefined ? patch.publishFrom : deal.publishFrom;
    const to = patch.publishTo !== undefined ? patch.publishTo : deal.publishTo;
    if (from && to && from > to) throw new AppError("validation:deal.window", "The publish window must end on or after its start.", { fields: { publishTo: ["the publish window must end on or after its start"] } });
    const { episodeIds, toolIds, ...fields } = patch;
    const row = (await updateDealRow(tx, deal.id, { ...fields, ...(episodeIds ? { episodeId: episodeIds[0] ?? null } : {}) }))!;
    if (episodeIds) await replaceDealEpisodes(tx, deal.id, episodeIds);
    if (toolIds) await replaceDealTools(tx, deal.id, toolIds);
    return row;
  });
}

export async function archiveDeal({ deal }: { deal: Deal }) {
  return db().transaction((tx) => updateDealRow(tx, deal.id, { archivedAt: new Date() }));
}

export async function addDeliverable({ deal, input }: { deal: Deal; input: DeliverableCreate }) {
  return db().transaction((tx) => insertDeliverable(tx, { ...input, dealId: deal.id }));
}

export async function removeDeliverable({ id }: { id: string }) {
  return db().transaction((tx) => deleteDeliverableRow(tx, id));
}

/** Makes a review link for one deal and mails it to the sponsor's contact; the token is shown only in the mail. */
export async function sendReviewLink({ deal, userId, contactEmail, days }: { deal: Deal; userId: string; contactEmail: string; days: number }) {
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + days * 86_400_000);
  const link = await db().transaction(async (tx) => {
    const row = await insertGuestLink(tx, { dealId: deal.id, tokenHash: hash, contactEmail, expiresAt, createdBy: userId });
    if (deal.status === "proposed" || deal.status === "signed") await updateDealRow(tx, deal.id, { status: "in_review" });
    return row;
  });
  const url = appUrl(`/review/${token}`);
  await sendMail({
    to: contactEmail,
    subject: `Please review: ${deal.title}`,
    text: `Hello,\n\nThe part of our episode that concerns you is ready to review: the script with its timing, the clips, and the checks of what we agreed.\n\n${url}\n\nThe link works until ${expiresAt.toISOString().slice(0, 10)} and shows only this deal. Approve it, or tell us what should change.\n`,
    tag: { kind: "review_link", channelId: deal.channelId, refId: link.id },
  });
  return { link, url };
}

export async function revokeReviewLink({ id }: { id: string }) {
  return db().transaction((tx) => revokeGuestLinkRow(tx, id));
}

/** The sponsor's decision through their link, recorded against the script as it is now. */
export async function recordGuestDecision({ deal, link, decision, comment }: { deal: Deal; link: GuestLink; decision: "approved" | "changes_requested"; comment: string }) {
  const { fingerprint } = await dealScript(deal);
  return db().transaction(async (tx) => {
    const row = await insertReviewComment(tx, { dealId: deal.id, guestLinkId: link.id, decision, body: comment, scriptFingerprint: fingerprint });
    await updateDealRow(tx, deal.id, { status: decision === "approved" ? "approved" : "in_review" });
    return row;
  });
}

export async function recordTeamReply({ deal, userId, body }: { deal: Deal; userId: string; body: string }) {
  const { fingerprint } = await dealScript(deal);
  return db().transaction((tx) => insertReviewComment(tx, { dealId: deal.id, userId, body, scriptFingerprint: fingerprint }));
}

/**
 * Issues the invoice for a paid deal through the payments service: customer,
 * invoice (sent for payment within 30 days), its one line, finalize, send.
 * The row is written first, so a failure on the way leaves a draft to retry, never a lost charge.
 */
export async function issueInvoice({ deal, sponsor }: { deal: Deal; sponsor: Sponsor & { email: string } }) {
  if (deal.kind !== "paid_integration" && deal.kind !== "affiliate") throw new AppError("unprocessable:invoice.kind", "Only paid deals are invoiced; a gifted or loaned tool has nothing to bill.", { fields: { kind: ["not a paid deal"] } });
  if (deal.feeMinor <= 0) throw new AppError("unprocessable:invoice.fee", "Set the deal's fee before invoicing it.", { fields: { feeMinor: ["the fee is zero"] } });
  if (!sponsor.email) throw new AppError("unprocessable:invoice.contact", "Give the sponsor a contact e-mail to send the invoice to.", { fields: { contacts: ["no contact e-mail"] } });
  const row = await db().transaction((tx) => insertInvoice(tx, { dealId: deal.id, amountMinor: deal.feeMinor, currency: deal.currency, status: "draft" }));
  try {
    const api = payments();
    const customer = await api.customers.create({ name: sponsor.name, email: sponsor.email, metadata: { jigboardSponsor: sponsor.id } });
    const draft = await api.invoices.create({ customer: customer.id, collection_method: "send_invoice", days_until_due: 30, currency: deal.currency.toLowerCase(), description: deal.title, metadata: { jigboardInvoice: row.id } });
    await api.invoiceItems.create({ customer: customer.id, invoice: draft.id, amount: deal.feeMinor, currency: deal.currency.toLowerCase(), description: deal.title });
    const open = await api.invoices.finalizeInvoice(draft.id!);
    await api.invoices.sendInvoice(open.id!);
    // Read it back: what the service now holds is what we record.
    const sent = await api.invoices.retrieve(open.id!);
    if (sent.amount_due !== deal.feeMinor) throw new AppError("unavailable:payments", `The payments service holds ${sent.amount_due} instead of ${deal.feeMinor}; the invoice is kept as a draft.`);
    return await db().transaction(async (tx) => {
      const done = (await updateInvoiceRow(tx, row.id, { providerId: sent.id!, providerCustomerId: customer.id, hostedUrl: sent.hosted_invoice_url ?? null, status: sent.status === "paid" ? "paid" : "open", issuedAt: new Date() }))!;
      await updateDealRow(tx, deal.id, { status: "invoiced" });
      return done;
    });
  } catch (e) {
    if (e instanceof AppError) throw e;
    throw new AppError("unavailable:payments", `The payments service refused or did not answer (${(e as Error).message}). The invoice is kept as a draft; try again.`);
  }
}

/** A verified payments event: an invoice paid marks it and its deal paid. The same event twice changes nothing. */
export async function handlePaymentEvent(event: { id: string; type: string; data: { object: { id?: string; object?: string } } }) {
  return db().transaction(async (tx) => {
    if (!(await recordPaymentEvent(tx, event.id, event.type))) return "duplicate" as const;
    if (event.type !== "invoice.paid" || !event.data.object.id) return "ignored" as const;
    const found = await listInvoicesByProviderId(tx, event.data.object.id);
    if (found.length === 0) return "unknown" as const;
    for (const inv of found) {
      await updateInvoiceRow(tx, inv.id, { status: "paid", paidAt: new Date() });
      await updateDealRow(tx, inv.dealId, { status: "paid" });
    }
    return "paid" as const;
  });
}
