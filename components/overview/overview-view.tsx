"use client";
/**
 * The channel at a glance. Charts draw with the chart package; each chart
 * has a table of the same figures beside it (for screen readers and for
 * reading exact numbers), and every row links to where it comes from.
 */
import Link from "next/link";
import { useQuery } from "@tanstack/react-query";
import { Bar, BarChart, CartesianGrid, ResponsiveContainer, Tooltip, XAxis, YAxis } from "recharts";
import { fetchJson } from "@/components/fetch-json";
import type { OverviewDto } from "@/lib/schemas/publish";
import { STAGE_INFO } from "@/lib/stages";

const WHAT: Record<OverviewDto["deliverables"][number]["what"], string> = { script: "Script to sponsor", review: "Sponsor review due", publish_window: "Publish window closes", return: "Loaned tools go back" };
const STATE: Record<string, string> = { met: "checks met", open: "checks open", blocked: "undisclosed connection", none: "nothing to check" };
const minutes = (s: number | null) => (s == null ? "—" : `${Math.floor(s / 60)}:${String(Math.round(s % 60)).padStart(2, "0")}`);

function Card({ title, id, children, action }: { title: string; id: string; children: React.ReactNode; action?: React.ReactNode }) {
  return (
    <section aria-labelledby={id} className="rounded-plank border border-timber-300 bg-white p-3">
      <div className="mb-2 flex items-baseline justify-between gap-2">
        <h2 id={id} className="font-bold">
          {title}
        </h2>
        {action}
      </div>
      {children}
    </section>
  );
}

function Empty({ children }: { children: React.ReactNode }) {
  return <p className="text-sm text-walnut-700">{children}</p>;
}

export function OverviewView({ channelId }: { channelId: string }) {
  const q = useQuery({ queryKey: ["overview", channelId], queryFn: () => fetchJson<OverviewDto>(`/api/channels/${channelId}/overview`) });
  const d = q.data;
  if (!d) return <p className="text-walnut-700">{q.error ? (q.error as Error).message : "Gathering the channel…"}</p>;
  const ep = (id: string, tab = "") => `/c/${channelId}/episodes/${id}${tab ? `/${tab}` : ""}`;
  const runtime = d.runtime.map((r) => ({ name: r.title, script: r.scriptSeconds != null ? Math.round(r.scriptSeconds / 6) / 10 : null, target: r.targetSeconds != null ? Math.round(r.targetSeconds / 6) / 10 : null }));
  const upcoming = d.publishing.filter((p) => p.publishDate >= d.today);
  const recent = d.publishing.filter((p) => p.publishDate < d.today).slice(-5);

  return (
    <div className="grid gap-4 lg:grid-cols-2" data-testid="overview">
      <Card title="Episodes by stage" id="ov-pipeline" action={<Link className="text-sm underline" href={`/c/${channelId}`}>Open the board</Link>}>
        <div className="h-56" aria-hidden>
          <ResponsiveContainer width="100%" height="100%">
            <BarChart data={d.pipeline} layout="vertical" margin={{ left: 8, right: 16 }} accessibilityLayer={false}>
              <CartesianGrid horizontal={false} className="stroke-timber-200" />
              <XAxis type="number" allowDecimals={false} tick={{ fontSize: 12 }} />
              <YAxis type="category" dataKey="label" width={92} tick={{ fontSize: 12 }} />
              <Tooltip />
              <Bar dataKey="count" name="Episodes" className="fill-chalk-600" isAnimationActive={false} />
            </BarChart>
          </ResponsiveContainer>
        </div>
        <table className="mt-2 w-full text-sm">
          <caption className="sr-only">Episodes by stage</caption>
          <tbody>
            {d.pipeline.map((p) => (
              <tr key={p.stage} className="border-t border-timber-200">
                <th scope="row" className="py-0.5 text-left font-normal">
                  <Link className="underline" href={`/c/${channelId}?stage=${p.stage}`}>
                    {p.label}
                  </Link>
                </th>
                <td className="num text-right">{p.count}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </Card>

      <Card title="Script runtime against target (minutes)" id="ov-runtime">
        {runtime.length ? (
          <>
            <div style={{ height: 40 + runtime.length * 34 }} aria-hidden>
              <ResponsiveContainer width="100%" height="100%">
                <BarChart data={runtime} layout="vertical" margin={{ left: 8, right: 16 }} barGap={1} accessibilityLayer={false}>
                  <CartesianGrid horizontal={false} className="stroke-timber-200" />
                  <XAxis type="number" tick={{ fontSize: 12 }} />
                  <YAxis type="category" dataKey="name" width={150} tick={{ fontSize: 11 }} tickFormatter={(t: string) => (t.length > 24 ? `${t.slice(0, 23)}…` : t)} />
                  <Tooltip />
                  <Bar dataKey="target" name="Target (min)" className="fill-timber-400" isAnimationActive={false} />
                  <Bar dataKey="script" name="Script (min)" className="fill-walnut-700" isAnimationActive={false} />
                </BarChart>
              </ResponsiveContainer>
            </div>
            <p className="text-xs text-walnut-700">Pale bars: target. Dark bars: the script as timed.</p>
            <table className="mt-2 w-full text-sm">
              <caption className="sr-only">Script runtime against target</caption>
              <thead>
                <tr className="text-left text-xs text-walnut-700">
                  <th scope="col">Episode</th>
                  <th scope="col" className="text-right">
                    Script
                  </th>
                  <th scope="col" className="text-right">
                    Target
                  </th>
                </tr>
              </thead>
              <tbody>
                {d.runtime.map((r) => {
                  const over = r.scriptSeconds != null && r.targetSeconds != null && r.scriptSeconds > r.targetSeconds;
                  return (
                    <tr key={r.episodeId} className="border-t border-timber-200">
                      <th scope="row" className="py-0.5 text-left font-normal">
                        <Link className="underline" href={ep(r.episodeId, "script")}>
                          {r.title}
                        </Link>
                      </th>
                      <td className={`num text-right ${over ? "font-bold text-fault-700" : ""}`}>
                        {minutes(r.scriptSeconds)}
                        {over ? " (over)" : ""}
                      </td>
                      <td className="num text-right">{minutes(r.targetSeconds)}</td>
                    </tr>
                  );
                })}
              </tbody>
            </table>
          </>
        ) : (
          <Empty>No episodes past the sketchbook yet.</Empty>
        )}
      </Card>

      <Card title="Shoot days ahead" id="ov-days" action={<Link className="text-sm underline" href={`/c/${channelId}/shoot-days`}>All shoot days</Link>}>
        {d.shootDays.length ? (
          <ul className="divide-y divide-timber-200 text-sm">
            {d.shootDays.map((s) => (
              <li key={s.id} className="flex justify-between gap-2 py-1">
                <Link className="underline" href={`/c/${channelId}/shoot-days/${s.id}/call-sheet`}>
                  <span className="num">{s.date}</span> {s.episodeTitle ?? "No episode"}
                </Link>
                <span className="text-walnut-700">{s.status}</span>
              </li>
            ))}
          </ul>
        ) : (
          <Empty>No shoot days in the next 60 days.</Empty>
        )}
      </Card>

      <Card title="Publishing" id="ov-publish">
        {upcoming.length || recent.length ? (
          <ul className="divide-y divide-timber-200 text-sm">
            {[...recent, ...upcoming].map((p) => (
              <li key={p.episodeId} className="flex justify-between gap-2 py-1">
                <Link className="underline" href={ep(p.episodeId, "publish")}>
                  <span className="num">{p.publishDate}</span> {p.title}
                </Link>
                <span className={p.stage === "published" ? "text-pass-700" : p.publishDate < d.today ? "font-bold text-fault-700" : "text-walnut-700"}>
                  {p.stage === "published" ? "published" : p.publishDate < d.today ? `late: ${STAGE_INFO[p.stage].label}` : STAGE_INFO[p.stage].label}
                </span>
              </li>
            ))}
          </ul>
        ) : (
          <Empty>No publish dates set.</Empty>
        )}
      </Card>

      <Card title="Open B-roll gaps" id="ov-gaps">
        {d.openGaps.length ? (
          <ul className="divide-y divide-timber-200 text-sm">
            {d.openGaps.map((g) => (
              <li key={g.episodeId} className="flex justify-between gap-2 py-1">
                <Link className="underline" href={ep(g.episodeId, "coverage")}>
                  {g.title}
                </Link>
                <span className="num">{g.openGaps}</span>
              </li>
            ))}
          </ul>
        ) : (
          <Empty>No open gaps.</Empty>
        )}
      </Card>

      <Card title="Sponsor dates ahead" id="ov-deals" action={<Link className="text-sm underline" href={`/c/${channelId}/sponsors`}>All deals</Link>}>
        {d.deliverables.length ? (
          <ul className="divide-y divide-timber-200 text-sm">
            {d.deliverables.map((x) => (
              <li key={`${x.dealId}-${x.what}`} className="py-1">
                <p className="flex justify-between gap-2">
                  <span>
                    <span className="num">{x.due}</span> {WHAT[x.what]}: {x.sponsorName}, {x.dealTitle}
                  </span>
                </p>
                <p className="text-xs">
                  {x.episodes.map((e, i) => (
                    <span key={e.id}>
                      {i ? ", " : ""}
                      <Link className="underline" href={ep(e.id, "sponsors")}>
                        {e.title}
                      </Link>
                      {e.state ? <span className={e.state === "met" ? "text-pass-700" : e.state === "blocked" ? "font-bold text-fault-700" : "text-walnut-700"}> ({STATE[e.state]})</span> : null}
                    </span>
                  ))}
                </p>
              </li>
            ))}
          </ul>
        ) : (
          <Empty>No sponsor dates in the next 60 days.</Empty>
        )}
      </Card>
    </div>
  );
}
