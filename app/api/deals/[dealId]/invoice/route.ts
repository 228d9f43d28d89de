import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { issueInvoice } from "@/lib/server/services/sponsors";
import { getSponsorById, listContactsBySponsors } from "@/db/queries/sponsors";
import { db } from "@/db/client";
import { recordAudit } from "@/db/queries/audit";

/** Issues the deal's invoice through the payments service (liaison, owner). */
export const POST = channelRoute({ load: "deal", action: "invoices.manage" }, async ({ deal, channelId, user }) => {
  const sponsor = (await getSponsorById({ id: deal.sponsorId }))!;
  const [contact] = await listContactsBySponsors(db(), [sponsor.id]);
  const row = await issueInvoice({ deal, sponsor: { ...sponsor, email: contact?.email ?? sponsor.contactEmail } });
  await recordAudit({ channelId, userId: user.id, action: "invoice", entity: "deal", entityId: deal.id, after: { invoiceId: row.id, amountMinor: row.amountMinor, currency: row.currency } });
  return json({ invoice: { id: row.id, dealId: row.dealId, amountMinor: row.amountMinor, currency: row.currency, status: row.status, hostedUrl: row.hostedUrl, issuedAt: row.issuedAt?.toISOString() ?? null, paidAt: null } }, 201);
});
