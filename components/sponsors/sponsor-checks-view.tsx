"use client";
/** The episode's sponsor checks: every promise and every material connection, with timecodes, and the credits to paste. */
import { useQuery } from "@tanstack/react-query";
import { fetchJson } from "@/components/fetch-json";
import type { SponsorChecksDto } from "@/lib/schemas/sponsors";

const STATE_TEXT: Record<SponsorChecksDto["state"], string> = {
  none: "No deals and no gifted, loaned or paid tools in this build: nothing to check.",
  met: "Every promise is kept and every connection is disclosed.",
  open: "Some promises are not kept yet.",
  blocked: "A gifted, loaned or paid tool is used without a disclosure in the video. Fix this before publishing.",
};

export function SponsorChecksView({ episodeId }: { episodeId: string }) {
  const q = useQuery({ queryKey: ["sponsor-checks", episodeId], queryFn: () => fetchJson<SponsorChecksDto>(`/api/episodes/${episodeId}/sponsor-checks`) });
  const d = q.data;
  if (!d) return <p className="text-walnut-700">{q.error ? (q.error as Error).message : "Checking…"}</p>;
  const bySponsor = new Map<string, SponsorChecksDto["results"]>();
  for (const r of d.results) bySponsor.set(r.sponsorName ?? "No sponsor named", [...(bySponsor.get(r.sponsorName ?? "No sponsor named") ?? []), r]);
  return (
    <div className="space-y-4">
      <div role={d.state === "blocked" ? "alert" : "status"} className={`rounded-plank border-l-4 px-3 py-2 text-sm ${d.state === "met" ? "border-pass-600 bg-pass-50" : d.state === "blocked" ? "border-fault-700 bg-fault-50 font-bold" : d.state === "open" ? "border-heed-600 bg-heed-50" : "border-timber-400 bg-white"}`} data-testid="checks-state">
        {STATE_TEXT[d.state]}
      </div>
      <p className="text-xs text-walnut-700">
        Checked against the timed script, the build plan and the B-roll. These checks follow published guidance (16 CFR 255; the FTC&apos;s influencer disclosure guide; the ASA/CAP influencers&apos; guide) but are not legal advice: follow the rules where you publish.
      </p>
      {[...bySponsor.entries()].map(([sponsor, results]) => (
        <section key={sponsor} className="rounded-plank border border-timber-300 bg-white" aria-label={`Checks for ${sponsor}`}>
          <h2 className="border-b border-timber-200 px-3 py-1.5 font-bold">{sponsor}</h2>
          <ul className="divide-y divide-timber-200" data-testid="check-results">
            {results.map((r, i) => (
              <li key={`${r.deliverableId ?? r.toolId}-${i}`} className="grid gap-1 px-3 py-2 text-sm sm:grid-cols-[7rem_1fr]" data-testid="check-result" data-pass={r.pass}>
                <span className={`font-bold ${r.pass ? "text-pass-700" : "text-fault-700"}`}>{r.pass ? "✓ Met" : "✕ Not met"}</span>
                <div>
                  <p className="font-medium">{r.label}</p>
                  <p>{r.message}</p>
                  {r.evidence.length ? (
                    <ul className="mt-1 flex flex-wrap gap-x-3 text-xs text-walnut-700">
                      {r.evidence.map((e, j) => (
                        <li key={j} className="num">
                          {e.phrase ? `“${e.phrase}” ${e.found ? "found" : "missing"}` : ""}
                          {e.start ? ` ${e.start}${e.end ? `–${e.end}` : ""}` : ""}
                          {e.note ? ` (${e.note})` : ""}
                        </li>
                      ))}
                    </ul>
                  ) : null}
                  <p className="mt-0.5 text-xs text-walnut-600">Rule: {r.source}</p>
                </div>
              </li>
            ))}
          </ul>
        </section>
      ))}
      {d.credits.length ? (
        <section className="grid gap-3 md:grid-cols-2">
          <div className="rounded-plank border border-timber-300 bg-white p-3">
            <h2 className="font-bold">Tool credits for the description</h2>
            <textarea readOnly aria-label="Tool credits for the description" className="mt-1 w-full rounded-plank border border-timber-300 p-2 text-sm" rows={Math.max(3, d.credits.length + 1)} value={d.credits.map((c) => c.descriptionLine).join("\n")} />
          </div>
          <div className="rounded-plank border border-timber-300 bg-white p-3">
            <h2 className="font-bold">On-screen credits for the editor</h2>
            <ul className="mt-1 space-y-1 text-sm">
              {d.credits.map((c) => (
                <li key={c.toolId}>
                  <span className="font-medium">{c.onScreen}</span>
                  <span className="num block text-xs text-walnut-700">{c.appearances.length ? c.appearances.map((a) => `${a.start}–${a.end}`).join(", ") : "not on the timeline yet"}</span>
                </li>
              ))}
            </ul>
          </div>
        </section>
      ) : null}
    </div>
  );
}
