"use client";
/** Sponsors and their deals: who, what was promised, when, and (for the liaison and owner) for how much. */
import { useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { ApiError, fetchJson } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";
import { Button } from "@/components/ui/button";
import { CheckboxLabel } from "@/components/ui/checkbox";
import { Notice, SelectField, TextField } from "@/components/ui/field";
import { DEAL_KINDS, DEAL_KIND_LABELS, DELIVERABLE_KINDS, DELIVERABLE_LABELS, type DeliverableKind } from "@/lib/sponsor-checks";
import { DEAL_STATUSES, DEAL_STATUS_LABELS, type DealDto, type DealReviewDto, type DealStatus, type InvoicesDto, type SponsorDto } from "@/lib/schemas/sponsors";
import { formatMoney } from "@/lib/materials";

interface Props {
  channelId: string;
  canManage: boolean;
  /** The liaison, owner and presenter answer the sponsor in the review thread. */
  canReply: boolean;
  currency: string;
  episodes: { id: string; title: string }[];
  tools: { id: string; name: string; acquisition: string }[];
}

const named = (e: unknown) => {
  const fields = e instanceof ApiError ? (e.fields ?? {}) : {};
  const list = Object.entries(fields).map(([k, v]) => `${k}: ${v.join("; ")}`);
  return list.length ? `Not saved. ${list.join(". ")}.` : (e as Error).message;
};

export function SponsorsView(p: Props) {
  const qc = useQueryClient();
  const write = useWrite({ scope: `sponsors:${p.channelId}` });
  const sponsors = useQuery({ queryKey: ["sponsors", p.channelId], queryFn: () => fetchJson<{ sponsors: SponsorDto[] }>(`/api/channels/${p.channelId}/sponsors`) });
  const deals = useQuery({ queryKey: ["deals", p.channelId], queryFn: () => fetchJson<{ deals: DealDto[] }>(`/api/channels/${p.channelId}/deals`) });
  const invoices = useQuery({ queryKey: ["invoices", p.channelId], queryFn: () => fetchJson<InvoicesDto>(`/api/channels/${p.channelId}/invoices`), enabled: p.canManage });
  const refresh = () => Promise.all([qc.invalidateQueries({ queryKey: ["sponsors", p.channelId] }), qc.invalidateQueries({ queryKey: ["deals", p.channelId] }), qc.invalidateQueries({ queryKey: ["invoices", p.channelId] })]);
  const [msg, setMsg] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [sp, setSp] = useState({ name: "", website: "", contactName: "", contactEmail: "" });
  const [deal, setDeal] = useState({ sponsorId: "", title: "", kind: "paid_integration", fee: "", status: "proposed" as DealStatus, publishFrom: "", publishTo: "", returnBy: "", episodeIds: [] as string[], toolIds: [] as string[] });
  const list = sponsors.data?.sponsors ?? [];
  const dealList = deals.data?.deals ?? [];

  return (
    <div className="space-y-6">
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      <section aria-labelledby="sp-h" className="space-y-2">
        <h2 id="sp-h" className="text-lg font-bold">
          Sponsors
        </h2>
        <ul className="grid gap-2 sm:grid-cols-2 lg:grid-cols-3">
          {list.map((s) => (
            <li key={s.id} className="rounded-plank border border-timber-300 bg-white p-3 text-sm">
              <p className="font-bold">{s.name}</p>
              {s.website ? <p className="text-walnut-700">{s.website}</p> : null}
              {s.contacts.map((c) => (
                <p key={c.id}>
                  {c.name} · {c.email}
                </p>
              ))}
            </li>
          ))}
          {list.length ? null : <li className="text-sm text-walnut-700">No sponsors yet.</li>}
        </ul>
        {p.canManage ? (
          <form
            aria-label="New sponsor"
            className="grid gap-2 rounded-plank border border-timber-300 bg-white p-3 sm:grid-cols-5"
            onSubmit={async (e) => {
              e.preventDefault();
              try {
                await write(`/api/channels/${p.channelId}/sponsors`, "POST", { name: sp.name, website: sp.website, contacts: sp.contactName ? [{ name: sp.contactName, email: sp.contactEmail }] : [] });
                setSp({ name: "", website: "", contactName: "", contactEmail: "" });
                setMsg({ tone: "ok", text: "Sponsor added." });
                await refresh();
              } catch (err) {
                setMsg({ tone: "error", text: named(err) });
              }
            }}
          >
            <TextField label="Sponsor name" value={sp.name} onChange={(e) => setSp({ ...sp, name: e.target.value })} required />
            <TextField label="Website" value={sp.website} onChange={(e) => setSp({ ...sp, website: e.target.value })} />
            <TextField label="Contact name" value={sp.contactName} onChange={(e) => setSp({ ...sp, contactName: e.target.value })} />
            <TextField label="Contact e-mail" type="email" value={sp.contactEmail} onChange={(e) => setSp({ ...sp, contactEmail: e.target.value })} />
            <div className="flex items-end">
              <Button type="submit">Add sponsor</Button>
            </div>
          </form>
        ) : null}
      </section>

      {p.canManage && invoices.data?.totals.bySponsor.length ? (
        <section aria-labelledby="tot-h" className="rounded-plank border border-timber-300 bg-white p-3 text-sm">
          <h2 id="tot-h" className="font-bold">
            Invoiced and paid
          </h2>
          <div className="grid gap-4 sm:grid-cols-2">
            <table className="w-full" aria-label="Totals per sponsor">
              <thead>
                <tr className="text-left">
                  <th>Sponsor</th>
                  <th className="text-right">Invoiced</th>
                  <th className="text-right">Paid</th>
                </tr>
              </thead>
              <tbody>
                {invoices.data.totals.bySponsor.map((t) => (
                  <tr key={t.sponsorName + t.currency}>
                    <td>{t.sponsorName}</td>
                    <td className="num text-right">{formatMoney(t.invoicedMinor, t.currency)}</td>
                    <td className="num text-right">{formatMoney(t.paidMinor, t.currency)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
            <table className="w-full" aria-label="Totals per month">
              <thead>
                <tr className="text-left">
                  <th>Month issued</th>
                  <th className="text-right">Invoiced</th>
                  <th className="text-right">Paid</th>
                </tr>
              </thead>
              <tbody>
                {invoices.data.totals.byMonth.map((t) => (
                  <tr key={t.month + t.currency}>
                    <td className="num">{t.month}</td>
                    <td className="num text-right">{formatMoney(t.invoicedMinor, t.currency)}</td>
                    <td className="num text-right">{formatMoney(t.paidMinor, t.currency)}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        </section>
      ) : null}
      <section aria-labelledby="deals-h" className="space-y-2">
        <h2 id="deals-h" className="text-lg font-bold">
          Deals
        </h2>
        <ul className="space-y-3">
          {dealList.map((d) => (
            <DealItem key={d.id} deal={d} {...p} invoices={(invoices.data?.invoices ?? []).filter((i) => i.dealId === d.id)} onChanged={refresh} />
          ))}
          {dealList.length ? null : <li className="text-sm text-walnut-700">No deals yet.</li>}
        </ul>
        {p.canManage ? (
          <form
            aria-label="New deal"
            className="grid gap-2 rounded-plank border border-timber-300 bg-white p-3 sm:grid-cols-4"
            onSubmit={async (e) => {
              e.preventDefault();
              try {
                await write(`/api/channels/${p.channelId}/deals`, "POST", {
                  sponsorId: deal.sponsorId,
                  title: deal.title,
                  kind: deal.kind,
                  feeMinor: deal.fee ? Math.round(Number(deal.fee) * 100) : 0,
                  currency: p.currency,
                  status: deal.status,
                  publishFrom: deal.publishFrom || null,
                  publishTo: deal.publishTo || null,
                  returnBy: deal.returnBy || null,
                  episodeIds: deal.episodeIds,
                  toolIds: deal.toolIds,
                });
                setMsg({ tone: "ok", text: "Deal added. Add its deliverables to have them checked." });
                await refresh();
              } catch (err) {
                setMsg({ tone: "error", text: named(err) });
              }
            }}
          >
            <SelectField label="Sponsor" value={deal.sponsorId} onChange={(e) => setDeal({ ...deal, sponsorId: e.target.value })} required>
              <option value="">Choose…</option>
              {list.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.name}
                </option>
              ))}
            </SelectField>
            <TextField label="Deal title" value={deal.title} onChange={(e) => setDeal({ ...deal, title: e.target.value })} required />
            <SelectField label="Kind" value={deal.kind} onChange={(e) => setDeal({ ...deal, kind: e.target.value })}>
              {DEAL_KINDS.map((k) => (
                <option key={k} value={k}>
                  {DEAL_KIND_LABELS[k]}
                </option>
              ))}
            </SelectField>
            <TextField label={`Fee (${p.currency})`} inputMode="decimal" value={deal.fee} onChange={(e) => setDeal({ ...deal, fee: e.target.value })} />
            <TextField label="Publish from" type="date" value={deal.publishFrom} onChange={(e) => setDeal({ ...deal, publishFrom: e.target.value })} />
            <TextField label="Publish by" type="date" value={deal.publishTo} onChange={(e) => setDeal({ ...deal, publishTo: e.target.value })} />
            <TextField label="Return the tool by" type="date" value={deal.returnBy} onChange={(e) => setDeal({ ...deal, returnBy: e.target.value })} />
            <SelectField label="Status" value={deal.status} onChange={(e) => setDeal({ ...deal, status: e.target.value as DealStatus })}>
              {DEAL_STATUSES.map((s) => (
                <option key={s} value={s}>
                  {DEAL_STATUS_LABELS[s]}
                </option>
              ))}
            </SelectField>
            <fieldset className="sm:col-span-2">
              <legend className="text-sm font-medium">Episodes</legend>
              {p.episodes.map((e) => (
                <CheckboxLabel key={e.id} label={e.title} checked={deal.episodeIds.includes(e.id)} onChange={(ev) => setDeal({ ...deal, episodeIds: ev.target.checked ? [...deal.episodeIds, e.id] : deal.episodeIds.filter((x) => x !== e.id) })} />
              ))}
            </fieldset>
            <fieldset className="sm:col-span-2">
              <legend className="text-sm font-medium">Tools from the shelf</legend>
              {p.tools.map((t) => (
                <CheckboxLabel key={t.id} label={`${t.name}${t.acquisition !== "bought" ? ` (${t.acquisition})` : ""}`} checked={deal.toolIds.includes(t.id)} onChange={(ev) => setDeal({ ...deal, toolIds: ev.target.checked ? [...deal.toolIds, t.id] : deal.toolIds.filter((x) => x !== t.id) })} />
              ))}
            </fieldset>
            <div className="sm:col-span-4">
              <Button type="submit" variant="primary">
                Add deal
              </Button>
            </div>
          </form>
        ) : null}
      </section>
    </div>
  );
}

function DealItem({ deal, canManage, canReply, episodes, tools, channelId, invoices, onChanged }: Props & { deal: DealDto; invoices: InvoicesDto["invoices"]; onChanged: () => Promise<unknown> }) {
  const write = useWrite({ scope: `sponsors:${channelId}` });
  const [kind, setKind] = useState<DeliverableKind>("spoken_disclosure");
  const [value, setValue] = useState("");
  const [error, setError] = useState<string | null>(null);
  return (
    <li className="rounded-plank border border-timber-300 bg-white p-3 text-sm" data-testid="deal">
      <p className="font-bold">
        {deal.title} · {deal.sponsorName}
      </p>
      {canManage ? (
        <label className="mt-1 inline-flex items-center gap-2">
          <span className="text-walnut-700">Status</span>
          <select
            aria-label={`Status of ${deal.title}`}
            className="rounded-plank border border-timber-300 bg-white px-1 py-0.5"
            value={deal.status}
            onChange={async (e) => {
              try {
                await write(`/api/deals/${deal.id}`, "PATCH", { status: e.target.value });
              } catch (err) {
                setError(named(err));
              }
              await onChanged();
            }}
          >
            {DEAL_STATUSES.map((st) => (
              <option key={st} value={st}>
                {DEAL_STATUS_LABELS[st]}
              </option>
            ))}
          </select>
        </label>
      ) : null}
      <p className="text-walnut-700">
        {DEAL_KIND_LABELS[deal.kind]} · {DEAL_STATUS_LABELS[deal.status]}
        {deal.feeMinor !== null && (deal.kind === "paid_integration" || deal.kind === "affiliate") ? ` · ${formatMoney(deal.feeMinor, deal.currency)}` : ""}
        {deal.publishFrom || deal.publishTo ? ` · publish ${deal.publishFrom ?? "…"} to ${deal.publishTo ?? "…"}` : ""}
        {deal.returnBy ? ` · return by ${deal.returnBy}` : ""}
      </p>
      <p className="text-walnut-700">
        Episodes: {deal.episodeIds.map((id) => episodes.find((e) => e.id === id)?.title ?? "?").join(", ") || "none"} · Tools: {deal.toolIds.map((id) => tools.find((t) => t.id === id)?.name ?? "?").join(", ") || "none"}
      </p>
      <ul className="ml-4 mt-1 list-disc" aria-label="Deliverables">
        {deal.deliverables.map((x) => (
          <li key={x.id}>
            {DELIVERABLE_LABELS[x.kind]}
            {x.seconds != null ? ` ${x.seconds} s` : ""}
            {x.phrases.length ? `: ${x.phrases.map((ph) => `“${ph}”`).join(", ")}` : ""}
            {x.url ? `: ${x.url}` : ""}
            {canManage ? (
              <Button
                variant="quiet"
                className="ml-2"
                onClick={async () => {
                  await write(`/api/deliverables/${x.id}`, "DELETE");
                  await onChanged();
                }}
              >
                Remove
              </Button>
            ) : null}
          </li>
        ))}
      </ul>
      <ReviewPanel deal={deal} canManage={canManage} canReply={canReply} channelId={channelId} />
      {canManage && (deal.kind === "paid_integration" || deal.kind === "affiliate") ? (
        <div className="mt-2 flex flex-wrap items-center gap-2" data-testid="deal-invoices">
          {invoices.map((i) => (
            <span key={i.id} className={`rounded-plank border px-2 py-0.5 ${i.status === "paid" ? "border-pass-600 text-pass-700" : "border-timber-300"}`}>
              Invoice {formatMoney(i.amountMinor, i.currency)}: {i.status === "paid" ? "paid" : i.status === "open" ? "sent, not paid yet" : i.status}
            </span>
          ))}
          {invoices.some((i) => i.status === "open" || i.status === "paid") ? null : (
            <Button
              onClick={async () => {
                try {
                  await write(`/api/deals/${deal.id}/invoice`, "POST");
                  setError(null);
                } catch (err) {
                  setError(named(err));
                }
                await onChanged();
              }}
            >
              Issue invoice
            </Button>
          )}
        </div>
      ) : null}
      {canManage ? (
        <form
          aria-label={`New deliverable for ${deal.title}`}
          className="mt-2 flex flex-wrap items-end gap-2"
          onSubmit={async (e) => {
            e.preventDefault();
            const body = kind === "talking_points" ? { kind, phrases: value.split(";").map((v) => v.trim()).filter(Boolean) } : kind === "description_link" ? { kind, url: value } : kind.startsWith("mention") ? { kind, seconds: Number(value) } : { kind };
            try {
              await write(`/api/deals/${deal.id}/deliverables`, "POST", body);
              setValue("");
              setError(null);
              await onChanged();
            } catch (err) {
              setError(named(err));
            }
          }}
        >
          <SelectField label="Deliverable" value={kind} onChange={(e) => setKind(e.target.value as DeliverableKind)}>
            {DELIVERABLE_KINDS.map((k) => (
              <option key={k} value={k}>
                {DELIVERABLE_LABELS[k]}
              </option>
            ))}
          </SelectField>
          {kind.startsWith("mention") || kind === "talking_points" || kind === "description_link" ? (
            <TextField
              label={kind === "talking_points" ? "Talking points (separate with ;)" : kind === "description_link" ? "Link" : "Seconds"}
              value={value}
              onChange={(e) => setValue(e.target.value)}
            />
          ) : null}
          <Button type="submit">Add</Button>
          {error ? <p className="w-full text-fault-700">{error}</p> : null}
        </form>
      ) : null}
    </li>
  );
}

const REVIEW_STATE: Record<DealReviewDto["state"], string> = {
  not_sent: "Review: not sent yet",
  waiting: "Review: waiting for the sponsor",
  approved: "Review: approved by the sponsor",
  changes_requested: "Review: the sponsor asked for changes",
  reopened: "Review: reopened (the script changed after the sponsor's decision)",
};

function ReviewPanel({ deal, canManage, canReply, channelId }: { deal: DealDto; canManage: boolean; canReply: boolean; channelId: string }) {
  const qc = useQueryClient();
  const key = ["deal-review", deal.id];
  const q = useQuery({ queryKey: key, queryFn: () => fetchJson<DealReviewDto>(`/api/deals/${deal.id}/review`) });
  const write = useWrite({ scope: `sponsors:${channelId}` });
  const [email, setEmail] = useState("");
  const [reply, setReply] = useState("");
  const [msg, setMsg] = useState<string | null>(null);
  const r = q.data;
  if (!r) return null;
  return (
    <div className="mt-2 rounded-plank border border-timber-200 p-2" data-testid="deal-review">
      <p className="font-medium">{REVIEW_STATE[r.state]}</p>
      {r.thread.map((c) => (
        <p key={c.id} className="text-walnut-800">
          {c.from}
          {c.decision ? ` · ${c.decision === "approved" ? "approved" : "asked for changes"}` : ""}
          {c.body ? `: ${c.body}` : ""}
        </p>
      ))}
      {r.links.map((l) => (
        <p key={l.id} className="text-xs text-walnut-700">
          Link to {l.contactEmail}, until {l.expiresAt.slice(0, 10)}
          {l.revokedAt ? " · withdrawn" : ""}
          {canManage && !l.revokedAt ? (
            <Button
              variant="quiet"
              className="ml-1"
              onClick={async () => {
                await write(`/api/review-links/${l.id}`, "DELETE");
                await qc.invalidateQueries({ queryKey: key });
              }}
            >
              Withdraw
            </Button>
          ) : null}
        </p>
      ))}
      {canReply && r.thread.length ? (
        <form
          aria-label={`Reply to ${deal.sponsorName}`}
          className="mt-1 flex flex-wrap items-end gap-2"
          onSubmit={async (e) => {
            e.preventDefault();
            await write(`/api/deals/${deal.id}/review`, "POST", { body: reply });
            setReply("");
            await qc.invalidateQueries({ queryKey: key });
          }}
        >
          <TextField label="Reply in the thread" value={reply} onChange={(e) => setReply(e.target.value)} required />
          <Button type="submit">Reply</Button>
        </form>
      ) : null}
      {canManage ? (
        <form
          aria-label={`Send a review link for ${deal.title}`}
          className="mt-1 flex flex-wrap items-end gap-2"
          onSubmit={async (e) => {
            e.preventDefault();
            try {
              await write(`/api/deals/${deal.id}/review-links`, "POST", { contactEmail: email });
              setMsg(`Review link sent to ${email}.`);
              setEmail("");
              await qc.invalidateQueries({ queryKey: key });
            } catch (err) {
              setMsg(named(err));
            }
          }}
        >
          <TextField label="Sponsor contact's e-mail" type="email" value={email} onChange={(e) => setEmail(e.target.value)} required />
          <Button type="submit">Send review link</Button>
          {msg ? <p className="w-full text-walnut-800">{msg}</p> : null}
        </form>
      ) : null}
    </div>
  );
}
