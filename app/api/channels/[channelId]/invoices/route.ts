import { channelRoute } from "@/lib/server/http/route-builder";
import { json } from "@/lib/server/http/api";
import { listInvoicesByChannel } from "@/db/queries/sponsors";
import type { InvoicesDto } from "@/lib/schemas/sponsors";

/** Invoices with totals per sponsor and per month (issued), in minor units per currency. Owner and liaison. */
export const GET = channelRoute({ load: "channel", action: "invoices.manage" }, async ({ channelId }) => {
  const rows = await listInvoicesByChannel({ channelId });
  const bySponsor = new Map<string, { sponsorName: string; currency: string; invoicedMinor: number; paidMinor: number }>();
  const byMonth = new Map<string, { month: string; currency: string; invoicedMinor: number; paidMinor: number }>();
  for (const r of rows) {
    if (r.invoice.status === "draft" || r.invoice.status === "void") continue;
    const paid = r.invoice.status === "paid" ? r.invoice.amountMinor : 0;
    const sk = `${r.sponsorId}|${r.invoice.currency}`;
    const s = bySponsor.get(sk) ?? { sponsorName: r.sponsorName, currency: r.invoice.currency, invoicedMinor: 0, paidMinor: 0 };
    s.invoicedMinor += r.invoice.amountMinor;
    s.paidMinor += paid;
    bySponsor.set(sk, s);
    const month = (r.invoice.issuedAt ?? r.invoice.createdAt).toISOString().slice(0, 7);
    const mk = `${month}|${r.invoice.currency}`;
    const m = byMonth.get(mk) ?? { month, currency: r.invoice.currency, invoicedMinor: 0, paidMinor: 0 };
    m.invoicedMinor += r.invoice.amountMinor;
    m.paidMinor += paid;
    byMonth.set(mk, m);
  }
  const body: InvoicesDto = {
    invoices: rows.map((r) => ({ id: r.invoice.id, dealId: r.invoice.dealId, dealTitle: r.dealTitle, sponsorName: r.sponsorName, amountMinor: r.invoice.amountMinor, currency: r.invoice.currency, status: r.invoice.status, hostedUrl: r.invoice.hostedUrl, issuedAt: r.invoice.issuedAt?.toISOString() ?? null, paidAt: r.invoice.paidAt?.toISOString() ?? null })),
    totals: { bySponsor: [...bySponsor.values()], byMonth: [...byMonth.values()].sort((a, b) => a.month.localeCompare(b.month)) },
  };
  return json(body);
});
