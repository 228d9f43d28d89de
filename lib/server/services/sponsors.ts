import "server-only";
/** Sponsors, deals and deliverables. A deal's sponsor, episodes and tools must all be the channel's. */
import type { DealCreate, DealUpdate, DeliverableCreate, SponsorCreate } from "../../schemas/sponsors";
import { AppError } from "../http/errors";
import { db, type Tx } from "../../../db/client";
import type { Deal, Sponsor } from "../../../db/schema";
import { channelOwns, deleteDeliverableRow, insertDeal, insertDeliverable, insertSponsor, replaceContacts, replaceDealEpisodes, replaceDealTools, updateDealRow, updateSponsorRow } from "../../../db/queries/sponsors";

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
