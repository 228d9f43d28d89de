/**
 * A local fake of the payments service: the part of its HTTP API the app
 * uses (customers, invoice items, invoices: create, finalize, send,
 * retrieve) on 127.0.0.1, spoken to by the service's official Node SDK
 * pointed here. Marking an invoice paid (POST /test/invoices/{id}/pay, as a
 * customer paying would) posts a signed `invoice.paid` event to the app's
 * webhook, signed the way the service signs (HMAC-SHA256 of
 * "<timestamp>.<payload>" in a Stripe-Signature header). Node-only; state
 * lives in this process. Never used when real keys are configured.
 */
import http from "node:http";
import crypto from "node:crypto";

export interface LocalPayments {
  url: string;
  port: number;
  stop(): Promise<void>;
}

type Obj = Record<string, unknown>;

function parseForm(body: string): Obj {
  const out: Obj = {};
  for (const [k, v] of new URLSearchParams(body)) {
    const m = /^(\w+)\[(\w+)\]$/.exec(k);
    if (m) ((out[m[1]!] ??= {}) as Obj)[m[2]!] = v;
    else out[k] = v;
  }
  return out;
}

export function signPayload(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const sig = crypto.createHmac("sha256", secret).update(`${timestamp}.${payload}`).digest("hex");
  return `t=${timestamp},v1=${sig}`;
}

export async function startLocalPayments(opts: { port: number; webhookUrl: string; webhookSecret: string }): Promise<LocalPayments> {
  const customers = new Map<string, Obj>();
  const items = new Map<string, Obj>();
  const invoices = new Map<string, Obj>();
  const id = (p: string) => `${p}_${crypto.randomBytes(12).toString("hex")}`;
  const now = () => Math.floor(Date.now() / 1000);
  const recompute = (inv: Obj) => {
    const lines = [...items.values()].filter((i) => i.invoice === inv.id);
    inv.amount_due = lines.reduce((a, i) => a + Number(i.amount), 0);
    inv.total = inv.amount_due;
    inv.lines = { object: "list", data: lines, has_more: false };
  };
  const server = http.createServer((req, res) => {
    let body = "";
    req.on("data", (c) => (body += c));
    req.on("end", async () => {
      const send = (status: number, obj: unknown) => {
        res.writeHead(status, { "content-type": "application/json", "request-id": id("req") });
        res.end(JSON.stringify(obj));
      };
      const fail = (status: number, message: string, param?: string) => send(status, { error: { type: "invalid_request_error", message, param } });
      if (!/^Bearer sk_/.test(req.headers.authorization ?? "")) return fail(401, "Invalid API key provided.");
      const url = new URL(req.url ?? "/", "http://x");
      const f = parseForm(body);
      const parts = url.pathname.split("/").filter(Boolean);
      try {
        if (req.method === "POST" && url.pathname === "/v1/customers") {
          const c = { id: id("cus"), object: "customer", name: f.name ?? null, email: f.email ?? null, metadata: f.metadata ?? {} };
          customers.set(c.id, c);
          return send(200, c);
        }
        if (req.method === "POST" && url.pathname === "/v1/invoices") {
          if (!customers.has(String(f.customer))) return fail(400, "No such customer", "customer");
          const inv: Obj = { id: id("in"), object: "invoice", customer: f.customer, currency: String(f.currency ?? "usd").toLowerCase(), status: "draft", collection_method: f.collection_method ?? "charge_automatically", days_until_due: f.days_until_due ? Number(f.days_until_due) : null, description: f.description ?? null, metadata: f.metadata ?? {}, created: now(), number: null, hosted_invoice_url: null, status_transitions: {} };
          recompute(inv);
          invoices.set(String(inv.id), inv);
          return send(200, inv);
        }
        if (req.method === "POST" && url.pathname === "/v1/invoiceitems") {
          const inv = f.invoice ? invoices.get(String(f.invoice)) : undefined;
          if (f.invoice && !inv) return fail(400, "No such invoice", "invoice");
          if (inv && inv.status !== "draft") return fail(400, "Invoice is no longer a draft", "invoice");
          if (!Number.isInteger(Number(f.amount)) || Number(f.amount) <= 0) return fail(400, "Invalid positive integer", "amount");
          const item = { id: id("ii"), object: "invoiceitem", customer: f.customer, amount: Number(f.amount), currency: String(f.currency ?? "usd").toLowerCase(), description: f.description ?? null, invoice: f.invoice ?? null };
          items.set(item.id, item);
          if (inv) recompute(inv);
          return send(200, item);
        }
        if (parts[0] === "v1" && parts[1] === "invoices" && parts[2]) {
          const inv = invoices.get(parts[2]);
          if (!inv) return fail(404, `No such invoice: '${parts[2]}'`);
          if (req.method === "GET" && parts.length === 3) return send(200, inv);
          if (req.method === "POST" && parts[3] === "finalize") {
            if (inv.status !== "draft") return fail(400, "This invoice is already finalized");
            inv.status = "open";
            inv.number = `LOCAL-${String(invoices.size).padStart(4, "0")}`;
            inv.hosted_invoice_url = `http://127.0.0.1:${opts.port}/hosted/${inv.id}`;
            (inv.status_transitions as Obj).finalized_at = now();
            return send(200, inv);
          }
          if (req.method === "POST" && parts[3] === "send") {
            if (inv.status !== "open") return fail(400, "You can only send an open invoice");
            return send(200, inv);
          }
        }
        // The fake's own helper: the customer pays; the app hears of it by webhook.
        if (req.method === "POST" && parts[0] === "test" && parts[1] === "invoices" && parts[3] === "pay") {
          const inv = invoices.get(parts[2] ?? "");
          if (!inv) return fail(404, "No such invoice");
          inv.status = "paid";
          inv.amount_paid = inv.amount_due;
          (inv.status_transitions as Obj).paid_at = now();
          const event = { id: id("evt"), object: "event", type: "invoice.paid", created: now(), data: { object: inv } };
          const payload = JSON.stringify(event);
          const r = await fetch(opts.webhookUrl, { method: "POST", headers: { "content-type": "application/json", "stripe-signature": signPayload(payload, opts.webhookSecret) }, body: payload }).catch((e: Error) => ({ status: 0, text: async () => e.message }));
          return send(200, { event, webhookStatus: r.status, payload });
        }
        return fail(404, `Unrecognized request URL (${req.method}: ${url.pathname})`);
      } catch (e) {
        return fail(500, (e as Error).message);
      }
    });
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(opts.port, "127.0.0.1", () => resolve());
  });
  return {
    url: `http://127.0.0.1:${opts.port}`,
    port: opts.port,
    stop: () => new Promise<void>((r) => server.close(() => r())),
  };
}
