/**
 * Invoices through the payments service's official SDK against the local
 * fake, and its signed webhooks: the signature scheme is the service's
 * documented one (HMAC-SHA256 over "<timestamp>.<raw body>", header
 * Stripe-Signature: t=…,v1=…), verified by the SDK's constructEvent.
 */
import { beforeAll, describe, expect, it } from "vitest";
import { eq } from "drizzle-orm";
import * as sponsorsRoute from "@/app/api/channels/[channelId]/sponsors/route";
import * as dealsRoute from "@/app/api/channels/[channelId]/deals/route";
import * as invoiceRoute from "@/app/api/deals/[dealId]/invoice/route";
import * as invoicesRoute from "@/app/api/channels/[channelId]/invoices/route";
import * as webhookRoute from "@/app/api/payments/webhook/route";
import { db } from "@/db/client";
import { deals, invoices } from "@/db/schema";
import { signPayload } from "@/lib/server/local/payments";
import { call, makeWorld } from "../support/fixtures";

type World = Awaited<ReturnType<typeof makeWorld>>;
let w: World;
let sponsorId = "";
beforeAll(async () => {
  w = await makeWorld();
  sponsorId = (await call(sponsorsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { name: "Quarry Dust Extraction", contacts: [{ name: "Ada Flint", email: "ada@quarry.example" }] } })).json.sponsor.id;
});

const newDeal = async (body: Record<string, unknown>) => (await call(dealsRoute.POST as never, { method: "POST", params: { channelId: w.channel.id }, user: w.members.owner, body: { sponsorId, ...body } })).json.deal;
const fake = () => `http://127.0.0.1:${process.env.STRIPE_API_PORT}`;

describe("invoices", () => {
  it("issues a paid deal's invoice, and the signed paid webhook marks it paid once", async () => {
    const deal = await newDeal({ title: "Extractor read", kind: "paid_integration", feeMinor: 125050, currency: "USD" });
    expect((await call(invoiceRoute.POST as never, { method: "POST", params: { dealId: deal.id }, user: w.members.presenter })).status).toBe(403);
    const r = await call(invoiceRoute.POST as never, { method: "POST", params: { dealId: deal.id }, user: w.members.sponsor_liaison });
    expect(r.status).toBe(201);
    expect(r.json.invoice).toMatchObject({ amountMinor: 125050, currency: "USD", status: "open" });
    expect(r.json.invoice.hostedUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/hosted\/in_/);
    const [row] = await db().select().from(invoices).where(eq(invoices.id, r.json.invoice.id));
    expect((await db().select().from(deals).where(eq(deals.id, deal.id)))[0]!.status).toBe("invoiced");
    // The fake holds the same amount on its invoice, read back through its API.
    const remote = await (await fetch(`${fake()}/v1/invoices/${row!.providerId}`, { headers: { authorization: "Bearer sk_test_local" } })).json();
    expect(remote).toMatchObject({ status: "open", amount_due: 125050, currency: "usd" });

    // The customer pays: the fake posts a signed invoice.paid to the served app.
    const paid = await (await fetch(`${fake()}/test/invoices/${row!.providerId}/pay`, { method: "POST", headers: { authorization: "Bearer sk_test_local" } })).json();
    expect(paid.webhookStatus).toBe(200);
    expect((await db().select().from(invoices).where(eq(invoices.id, row!.id)))[0]!.status).toBe("paid");
    expect((await db().select().from(deals).where(eq(deals.id, deal.id)))[0]!.status).toBe("paid");

    // The same event again (a retry by the service) changes nothing.
    const again = await call(webhookRoute.POST as never, { method: "POST", user: null, rawBody: paid.payload, headers: { "stripe-signature": signPayload(paid.payload, process.env.STRIPE_WEBHOOK_SECRET!) } });
    expect(again.status).toBe(200);
    expect(again.json.outcome).toBe("duplicate");

    // A forged or altered body is refused.
    const forged = await call(webhookRoute.POST as never, { method: "POST", user: null, rawBody: paid.payload.replace("invoice.paid", "invoice.voided"), headers: { "stripe-signature": signPayload(paid.payload, process.env.STRIPE_WEBHOOK_SECRET!) } });
    expect(forged.status).toBe(400);
    expect((await call(webhookRoute.POST as never, { method: "POST", user: null, rawBody: paid.payload, headers: { "stripe-signature": signPayload(paid.payload, "whsec_wrong") } })).status).toBe(400);

    const totals = await call(invoicesRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.owner });
    expect(totals.json.totals.bySponsor).toEqual([{ sponsorName: "Quarry Dust Extraction", currency: "USD", invoicedMinor: 125050, paidMinor: 125050 }]);
    expect(totals.json.totals.byMonth[0]).toMatchObject({ currency: "USD", invoicedMinor: 125050, paidMinor: 125050 });
    expect((await call(invoicesRoute.GET as never, { params: { channelId: w.channel.id }, user: w.members.editor })).status).toBe(403);
  }, 30_000);

  it("refuses to invoice a gifted tool or a deal without a fee, naming why", async () => {
    const gifted = await newDeal({ title: "Free extractor", kind: "gifted_tool" });
    const g = await call(invoiceRoute.POST as never, { method: "POST", params: { dealId: gifted.id }, user: w.members.owner });
    expect(g.status).toBe(422);
    expect(g.json.error.message).toMatch(/Only paid deals are invoiced/);
    const free = await newDeal({ title: "No fee yet", kind: "paid_integration" });
    const f = await call(invoiceRoute.POST as never, { method: "POST", params: { dealId: free.id }, user: w.members.owner });
    expect(f.status).toBe(422);
    expect(f.json.error.fields.feeMinor[0]).toBe("the fee is zero");
  });
});
