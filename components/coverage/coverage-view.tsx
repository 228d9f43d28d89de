"use client";
import Link from "next/link";
import { useMemo, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { parseTimecode, rulerTicks, type Rate } from "@/lib/timecode";
import { SEGMENT_KIND_LABELS, type SegmentKind } from "@/lib/script-timing";
import { packLanes } from "@/lib/coverage";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import { fetchJson } from "@/components/fetch-json";
import type { CoverageDto } from "@/lib/schemas/footage";
import { useWrite } from "@/components/use-write";

/** Fill per segment kind, as colour tokens. */
const KIND_FILL: Record<SegmentKind, string> = { to_camera: "fill-walnut-700", voice_over: "fill-timber-400", sponsor_read: "fill-stage-review", on_screen_text: "fill-timber-200" };
const KIND_SWATCH: Record<SegmentKind, string> = { to_camera: "bg-walnut-700", voice_over: "bg-timber-400", sponsor_read: "bg-stage-review", on_screen_text: "bg-timber-200" };


/** Script, B-roll and gaps on one timecode ruler, the same scale for all three rows. */
function Timeline({ data, rate, onFocus }: { data: CoverageDto; rate: Rate; onFocus: (text: string) => void }) {
  const W = 1000;
  const left = 90;
  const total = Math.max(data.totalFrames, 1);
  const x = (f: number) => left + (f / total) * (W - left - 10);
  const ticks = rulerTicks(total, rate);
  // Open gaps that overlap (a marked gap over a computed one) go in lanes of their own.
  const openGaps = data.gaps.filter((g) => g.status === "open");
  const lanes = packLanes(openGaps.map((g) => ({ start: g.startFrame, end: g.endFrame })));
  const laneCount = Math.max(1, ...lanes.map((l) => l + 1));
  const rows = { script: 28, broll: 70, gaps: 112 };
  const H = rows.gaps + laneCount * 22 + 16;
  const focusable = { tabIndex: 0 };
  const FOCUS = "outline-none focus:stroke-chalk-600 focus:[stroke-width:3]";
  return (
    <svg viewBox={`0 0 ${W} ${H}`} width="100%" role="group" aria-label="Coverage timeline: script, B-roll and gaps" className="min-w-[700px] rounded-plank border border-timber-300 bg-white" data-testid="coverage-timeline">
      {ticks.map((t) => (
        <g key={t.frame}>
          <line className="stroke-timber-200" x1={x(t.frame)} x2={x(t.frame)} y1={14} y2={H - 5} />
          <text className="fill-walnut-600" x={Math.min(x(t.frame), W - 24)} y={11} fontSize="9" textAnchor="middle" fontFamily="JetBrains Mono, monospace" data-testid="ruler-label">
            {t.label}
          </text>
        </g>
      ))}
      {Object.entries({ script: "Script", broll: "B-roll", gaps: "Gaps" }).map(([k, label]) => (
        <text className="fill-walnut-900" key={k} x={4} y={rows[k as keyof typeof rows] + 13} fontSize="11">
          {label}
        </text>
      ))}
      {data.segments.map((s) => {
        const t = `${SEGMENT_KIND_LABELS[s.kind]} ${s.startTimecode}–${s.endTimecode}`;
        return (
          <rect className={`stroke-white ${KIND_FILL[s.kind]} ${FOCUS}`} key={s.id} {...focusable} x={x(s.start)} y={rows.script} width={Math.max(1, x(s.end) - x(s.start))} height={18} onFocus={() => onFocus(t)} onMouseEnter={() => onFocus(t)}>
            <title>{t}</title>
          </rect>
        );
      })}
      {data.ranges.map((r) => {
        const t = `B-roll ${r.startTimecode}–${r.endTimecode}${r.note ? ` (${r.note})` : ""}`;
        return (
          <rect className={`fill-broll ${FOCUS}`} key={r.id} {...focusable} x={x(r.startFrame)} y={rows.broll} width={Math.max(1, x(r.endFrame) - x(r.startFrame))} height={18} opacity={0.85} onFocus={() => onFocus(t)} onMouseEnter={() => onFocus(t)} data-testid="broll-range">
            <title>{t}</title>
          </rect>
        );
      })}
      {openGaps.map((g, i) => {
        const t = `Gap ${g.startTimecode}–${g.endTimecode}: ${g.source === "marked" ? "marked by hand" : g.reason === "to_camera" ? "to camera too long without a cutaway" : "voice-over with no B-roll"}${g.pickupShotId ? " (pickup shot planned)" : ""}`;
        const y = rows.gaps + lanes[i]! * 22;
        return (
          <g key={g.key}>
            <rect className={`fill-fault-100 stroke-fault-700 ${FOCUS}`} {...focusable} x={x(g.startFrame)} y={y} width={Math.max(2, x(g.endFrame) - x(g.startFrame))} height={18} strokeWidth={1.5} strokeDasharray={g.pickupShotId ? "1 2" : "4 2"} onFocus={() => onFocus(t)} onMouseEnter={() => onFocus(t)} data-testid="gap-block">
              <title>{t}</title>
            </rect>
            <text className="fill-fault-700" x={x(g.startFrame) + 2} y={y + 13} fontSize="10" pointerEvents="none">
              {g.pickupShotId ? "P" : "!"}
            </text>
          </g>
        );
      })}
    </svg>
  );
}

export function CoverageView({ episodeId, base, canManage, canShots, clips }: { episodeId: string; base: string; canManage: boolean; canShots: boolean; clips: { id: string; name: string; durationMs: number | null }[] }) {
  const write = useWrite({ scope: `coverage:${episodeId}` });
  const qc = useQueryClient();
  const key = useMemo(() => ["coverage", episodeId], [episodeId]);
  const { data } = useQuery({ queryKey: key, queryFn: () => fetchJson(`/api/episodes/${episodeId}/coverage`) as Promise<CoverageDto> });
  const [focusText, setFocusText] = useState("Move over or tab to a block to read its timecodes.");
  const [msg, setMsg] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [place, setPlace] = useState({ clipId: "", at: "" });
  const [mark, setMark] = useState({ from: "", to: "", note: "", as: "broll" });
  const refresh = () => qc.invalidateQueries({ queryKey: key });
  if (!data) return <p className="text-sm text-walnut-700">Loading coverage…</p>;
  const rate: Rate = { num: data.rate.num, den: data.rate.den, dropFrame: data.rate.dropFrame };
  const tc = (s: string) => parseTimecode(s, rate);
  const act = async (f: () => Promise<unknown>, ok: string) => {
    try {
      await f();
      setMsg({ tone: "ok", text: ok });
      await refresh();
    } catch (e) {
      setMsg({ tone: "error", text: (e as Error).message });
    }
  };
  const open = data.gaps.filter((g) => g.status === "open");

  return (
    <div className="space-y-4">
      <dl className="flex flex-wrap gap-3 text-sm">
        <div className="rounded-plank border border-timber-300 bg-white px-3 py-2">
          <dt className="text-xs text-walnut-600">Voice-over with B-roll</dt>
          <dd className="num text-lg" data-testid="coverage-percent">
            {Math.round(data.coverage * 100)} %
          </dd>
        </div>
        <div className="rounded-plank border border-timber-300 bg-white px-3 py-2">
          <dt className="text-xs text-walnut-600">Open gaps</dt>
          <dd className="num text-lg" data-testid="open-gaps">
            {open.length}
          </dd>
        </div>
      </dl>
      {data.segments.length === 0 ? <Notice>The script is empty: write it first, then lay B-roll over the voice-over here.</Notice> : null}
      <div className="overflow-x-auto">
        <Timeline data={data} rate={rate} onFocus={setFocusText} />
      </div>
      <p className="num text-sm text-walnut-800" aria-live="polite" data-testid="timeline-focus">
        {focusText}
      </p>
      <div className="flex flex-wrap gap-3 text-xs text-walnut-700">
        {(Object.keys(KIND_FILL) as SegmentKind[]).map((k) => (
          <span key={k} className="flex items-center gap-1">
            <span className={`inline-block h-3 w-5 border border-walnut-700 ${KIND_SWATCH[k]}`} aria-hidden /> {SEGMENT_KIND_LABELS[k]}
          </span>
        ))}
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-5 bg-broll" aria-hidden /> B-roll
        </span>
        <span className="flex items-center gap-1">
          <span className="inline-block h-3 w-5 border border-dashed border-fault-700 bg-fault-100" aria-hidden /> gap (marked “!”, or “P” once a pickup shot is planned)
        </span>
      </div>
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}

      {canManage ? (
        <div className="grid gap-3 md:grid-cols-2">
          <form
            aria-label="Place a clip"
            className="space-y-2 rounded-plank border border-timber-300 bg-white p-3 text-sm"
            onSubmit={(e) => {
              e.preventDefault();
              const at = tc(place.at);
              if (!at.ok) return setMsg({ tone: "error", text: `Start: ${at.message}` });
              void act(() => write(`/api/episodes/${episodeId}/coverage-ranges`, "POST", { clipId: place.clipId, startFrame: at.frames }), "Clip placed on the timeline.");
            }}
          >
            <h2 className="font-bold">Place a clip as B-roll</h2>
            <select aria-label="Clip" className="w-full rounded-plank border border-timber-300 px-1 py-1" value={place.clipId} onChange={(e) => setPlace({ ...place, clipId: e.target.value })}>
              <option value="">Choose a clip</option>
              {clips.map((c) => (
                <option key={c.id} value={c.id}>
                  {c.name} {c.durationMs != null ? `(${(c.durationMs / 1000).toFixed(1)} s)` : ""}
                </option>
              ))}
            </select>
            <input aria-label="Starts at timecode" placeholder={rate.dropFrame ? "00:00:12;00" : "00:00:12:00"} className="num w-full rounded-plank border border-timber-300 px-1 py-1" value={place.at} onChange={(e) => setPlace({ ...place, at: e.target.value })} />
            <Button type="submit" variant="primary" disabled={!place.clipId}>
              Place clip
            </Button>
          </form>
          <form
            aria-label="Mark a range"
            className="space-y-2 rounded-plank border border-timber-300 bg-white p-3 text-sm"
            onSubmit={(e) => {
              e.preventDefault();
              const a = tc(mark.from);
              const b = tc(mark.to);
              if (!a.ok || !b.ok) return setMsg({ tone: "error", text: `Range: ${!a.ok ? a.message : !b.ok ? b.message : ""}` });
              void act(
                () =>
                  mark.as === "broll"
                    ? write(`/api/episodes/${episodeId}/coverage-ranges`, "POST", { startFrame: a.frames, endFrame: b.frames, note: mark.note })
                    : write(`/api/episodes/${episodeId}/gaps`, "POST", { startFrame: a.frames, endFrame: b.frames, note: mark.note }),
                mark.as === "broll" ? "B-roll range marked." : "Gap marked.",
              );
            }}
          >
            <h2 className="font-bold">Mark a range by hand</h2>
            <div className="flex gap-2">
              <input aria-label="From timecode" placeholder="from" className="num w-1/2 rounded-plank border border-timber-300 px-1 py-1" value={mark.from} onChange={(e) => setMark({ ...mark, from: e.target.value })} />
              <input aria-label="To timecode" placeholder="to" className="num w-1/2 rounded-plank border border-timber-300 px-1 py-1" value={mark.to} onChange={(e) => setMark({ ...mark, to: e.target.value })} />
            </div>
            <input aria-label="Note" placeholder="note" className="w-full rounded-plank border border-timber-300 px-1 py-1" value={mark.note} onChange={(e) => setMark({ ...mark, note: e.target.value })} />
            <div className="flex items-center gap-3">
              <label className="flex items-center gap-1">
                <input type="radio" name="mark-as" checked={mark.as === "broll"} onChange={() => setMark({ ...mark, as: "broll" })} /> B-roll covered
              </label>
              <label className="flex items-center gap-1">
                <input type="radio" name="mark-as" checked={mark.as === "gap"} onChange={() => setMark({ ...mark, as: "gap" })} /> Gap to fill
              </label>
              <Button type="submit">Mark</Button>
            </div>
          </form>
        </div>
      ) : null}

      <section>
        <h2 className="font-bold">Gaps</h2>
        {data.gaps.length === 0 ? <p className="text-sm text-walnut-700">No gaps: every stretch of voice-over has B-roll over it.</p> : null}
        <ul className="mt-1 space-y-1 text-sm" data-testid="gap-list">
          {data.gaps.map((g) => {
            const body = { source: "computed", startFrame: g.startFrame, endFrame: g.endFrame, segmentId: g.segmentId, reason: g.reason };
            const setStatus = (status: string) =>
              act(() => (g.id ? write(`/api/gaps/${g.id}`, "PATCH", { status }) : write(`/api/episodes/${episodeId}/gaps`, "POST", { ...body, status })), `Gap ${status === "open" ? "reopened" : status}.`);
            return (
              <li key={g.key} className="flex flex-wrap items-center gap-2 rounded-plank border border-timber-200 bg-white px-2 py-1" data-testid="gap-item" data-status={g.status}>
                <span className="num">
                  {g.startTimecode}–{g.endTimecode}
                </span>
                <span className="text-xs text-walnut-700">{g.source === "marked" ? `marked${g.note ? `: ${g.note}` : ""}` : g.reason === "to_camera" ? "to camera without a cutaway" : "voice-over without B-roll"}</span>
                <span className="rounded-plank border border-timber-300 px-1 text-xs" data-testid="gap-status">
                  {g.status === "open" && g.pickupShotId ? "open · pickup planned" : g.status}
                </span>
                {canManage && g.status === "open" ? (
                  <span className="ml-auto flex gap-1">
                    {g.pickupShotId ? (
                      <Link className="jb-tap rounded-plank border border-timber-300 px-3 py-1.5 hover:bg-timber-100" href={`${base}/shots`}>
                        See the pickup shot
                      </Link>
                    ) : canShots ? (
                      <Button onClick={() => void act(() => write(`/api/episodes/${episodeId}/pickups`, "POST", g.id ? { gapId: g.id } : { startFrame: g.startFrame, endFrame: g.endFrame, segmentId: g.segmentId, reason: g.reason }), "Pickup shot added to the shot list.")}>Pickup shot</Button>
                    ) : null}
                    <Button variant="quiet" onClick={() => void setStatus("resolved")}>
                      Resolve
                    </Button>
                    <Button variant="quiet" onClick={() => void setStatus("dismissed")}>
                      Dismiss
                    </Button>
                  </span>
                ) : canManage && g.status !== "open" ? (
                  <Button variant="quiet" className="ml-auto" onClick={() => void setStatus("open")}>
                    Reopen
                  </Button>
                ) : null}
              </li>
            );
          })}
        </ul>
      </section>
      <section>
        <h2 className="font-bold">B-roll on the timeline</h2>
        <ul className="mt-1 space-y-1 text-sm">
          {data.ranges.map((r) => (
            <li key={r.id} className="flex items-center gap-2">
              <span className="num">
                {r.startTimecode}–{r.endTimecode}
              </span>
              <span className="text-walnut-700">{r.clipId ? (clips.find((c) => c.id === r.clipId)?.name ?? "clip") : `marked${r.note ? `: ${r.note}` : ""}`}</span>
              {canManage ? (
                <Button variant="quiet" onClick={() => void act(() => write(`/api/coverage-ranges/${r.id}`, "DELETE"), "Range removed.")}>
                  Remove
                </Button>
              ) : null}
            </li>
          ))}
          {data.ranges.length === 0 ? <li className="text-walnut-700">Nothing laid yet.</li> : null}
        </ul>
      </section>
    </div>
  );
}
