"use client";
import { useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { fetchJson } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import type { GuestReviewDto } from "@/lib/schemas/sponsors";

const STATE: Record<GuestReviewDto["state"], string> = {
  not_sent: "Waiting for your review.",
  waiting: "Waiting for your review.",
  approved: "You approved this version.",
  changes_requested: "You asked for changes; the team is on it.",
  reopened: "The script changed since your last decision: please review again.",
};

export function GuestReview({ token }: { token: string }) {
  const qc = useQueryClient();
  const key = ["guest-review", token];
  const q = useQuery({ queryKey: key, queryFn: () => fetchJson<GuestReviewDto>(`/api/review/${token}`), retry: false });
  const write = useWrite({ scope: `review:${token}` });
  const [comment, setComment] = useState("");
  const [msg, setMsg] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  if (q.error) return <Notice tone="error">{(q.error as Error).message}</Notice>;
  const d = q.data;
  if (!d) return <p>Loading…</p>;
  const decide = async (decision: "approved" | "changes_requested") => {
    try {
      await write(`/api/review/${token}/decision`, "POST", { decision, comment });
      setComment("");
      setMsg({ tone: "ok", text: decision === "approved" ? "Thank you: approved." : "Thank you: your changes were sent to the team." });
      await qc.invalidateQueries({ queryKey: key });
    } catch (e) {
      setMsg({ tone: "error", text: (e as Error).message });
    }
  };
  return (
    <article className="space-y-4" aria-label="Sponsor review">
      <header>
        <p className="text-xs uppercase tracking-wide text-walnut-600">Review for {d.sponsorName}</p>
        <h1 className="text-xl font-bold">{d.dealTitle}</h1>
        <p className="text-sm text-walnut-700">This link shows only your part of the episode and works until {d.expiresAt.slice(0, 10)}.</p>
      </header>
      <p role="status" className="rounded-plank border-l-4 border-chalk-600 bg-chalk-100 px-3 py-2 text-sm" data-testid="review-state">
        {STATE[d.state]}
      </p>
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      {d.episodes.map((e) => (
        <section key={e.title} className="space-y-2 rounded-plank border border-timber-300 bg-white p-3" aria-label={e.title}>
          <h2 className="font-bold">{e.title}</h2>
          <ol className="space-y-2">
            {e.segments.map((s) => (
              <li key={s.id} className="border-l-4 border-walnut-700 pl-2 text-sm" data-testid="review-segment">
                <p className="num text-xs text-walnut-700">
                  {s.start}–{s.end} · {s.seconds} s
                </p>
                <p>{s.text}</p>
              </li>
            ))}
            {e.segments.length ? null : <li className="text-sm text-walnut-700">No mention in this episode&apos;s script yet.</li>}
          </ol>
          {e.checks.length ? (
            <ul className="text-sm" aria-label="What was agreed">
              {e.checks.map((c) => (
                <li key={c.label}>
                  <span className={c.pass ? "text-pass-700" : "text-fault-700"}>{c.pass ? "✓" : "✕"}</span> {c.label}: {c.message}
                </li>
              ))}
            </ul>
          ) : null}
          {e.clips.map((c) => (
            <figure key={c.id}>
              <video controls preload="metadata" src={c.url} className="w-full rounded-plank border border-timber-300" aria-label={`Clip ${c.name}`} />
              <figcaption className="text-xs text-walnut-700">{c.name}</figcaption>
            </figure>
          ))}
        </section>
      ))}
      <section className="space-y-2 rounded-plank border border-timber-300 bg-white p-3">
        <h2 className="font-bold">Your decision</h2>
        <label className="block text-sm" htmlFor="review-comment">
          Comments (needed when asking for changes)
        </label>
        <textarea id="review-comment" className="w-full rounded-plank border border-timber-300 p-2 text-sm" rows={3} value={comment} onChange={(e) => setComment(e.target.value)} />
        <div className="flex gap-2">
          <Button variant="primary" onClick={() => void decide("approved")}>
            Approve
          </Button>
          <Button onClick={() => void decide("changes_requested")}>Request changes</Button>
        </div>
      </section>
      {d.thread.length ? (
        <section aria-label="Conversation" className="space-y-1 text-sm">
          <h2 className="font-bold">Conversation</h2>
          {d.thread.map((c) => (
            <p key={c.id}>
              <span className="font-medium">{c.from}</span>
              {c.decision ? ` · ${c.decision === "approved" ? "approved" : "asked for changes"}` : ""}
              {c.current ? "" : " · about an earlier version"}: {c.body}
            </p>
          ))}
        </section>
      ) : null}
    </article>
  );
}
