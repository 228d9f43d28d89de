"use client";
import Link from "next/link";
import { useEffect, useMemo, useRef, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { DndContext, KeyboardSensor, PointerSensor, closestCenter, useSensor, useSensors, type DragEndEvent } from "@dnd-kit/core";
import { SortableContext, arrayMove, sortableKeyboardCoordinates, verticalListSortingStrategy } from "@dnd-kit/sortable";
import { SEGMENT_KINDS, SEGMENT_KIND_LABELS, timeScript, DEFAULT_WPM, MIN_WPM, MAX_WPM, type SegmentKind } from "@/lib/script-timing";
import { buildChapters } from "@/lib/chapters";
import { formatDuration, formatTimecode, framesToSeconds, type Rate } from "@/lib/timecode";
import { Notice } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { SegmentEditor, type SaveState, type SegmentHandle } from "./segment-editor";
import { ApiError as SaveError, fetchJson } from "@/components/fetch-json";
import type { ScriptDto, SegmentDto } from "@/lib/schemas/script";
import { useWrite } from "@/components/use-write";
import { useLive } from "@/components/live/live-provider";

/** The script as the editor keeps it: the server's timing is not kept, the editor times every keystroke itself. */
type ScriptData = Pick<ScriptDto, "rate" | "wordsPerMinute"> & { segments: SegmentDto[] };

interface Props {
  episodeId: string;
  base: string;
  targetSeconds: number | null;
  steps: { id: string; title: string }[];
  canWrite: boolean;
  canAnnotate: boolean;
  canChoosePresenter: boolean;
  presenterId: string | null;
  members: { id: string; name: string }[];
  myWpm: number;
}

function signedSeconds(frames: number, rate: Rate) {
  const s = framesToSeconds(Math.abs(frames), rate);
  const m = Math.floor(s / 60);
  const r = (s % 60).toFixed(1);
  return m ? `${m} min ${r} s` : `${r} s`;
}

export function ScriptEditor(p: Props) {
  const write = useWrite({ scope: `script:${p.episodeId}` });
  const liveNow = useLive();
  const qc = useQueryClient();
  const key = useMemo(() => ["script", p.episodeId], [p.episodeId]);
  const { data, error } = useQuery({ queryKey: key, queryFn: () => fetchJson<ScriptData>(`/api/episodes/${p.episodeId}/script`), refetchOnWindowFocus: false });
  const [drafts, setDrafts] = useState<Record<string, string>>({});
  const [states, setStates] = useState<Record<string, SaveState>>({});
  const [message, setMessage] = useState<{ tone: "ok" | "error" | "info"; text: string } | null>(null);
  const [announce, setAnnounce] = useState("");
  const [newStep, setNewStep] = useState("");
  const [newKind, setNewKind] = useState<SegmentKind>("voice_over");
  const [wpm, setWpm] = useState(p.myWpm);
  // Each segment editor registers its handle through a callback ref (no ref read during render).
  const handles = useRef(new Map<string, SegmentHandle>());
  const focusNext = useRef<{ id: string; pos: "start" | "end" } | null>(null);
  const refresh = () => qc.invalidateQueries({ queryKey: key });
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }), useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }));

  const segments = useMemo(() => data?.segments ?? [], [data]);
  const rate: Rate | null = useMemo(() => (data ? { num: data.rate.num, den: data.rate.den, dropFrame: data.rate.dropFrame } : null), [data]);

  // Live timing from what is on screen, drafts included (the same pure module the server uses).
  const live = useMemo(() => {
    if (!rate) return null;
    const input = segments.map((s) => ({ ...s, text: drafts[s.id] ?? s.text, kind: s.kind as SegmentKind }));
    const timing = timeScript(input, rate, { wpm: data!.wordsPerMinute, targetSeconds: p.targetSeconds });
    const chapters = buildChapters(
      input.flatMap((s, i) => (s.chapterStart ? [{ segmentId: s.id, title: s.chapterTitle ?? "", startFrame: timing.segments[i]!.start }] : [])),
      timing.totalFrames,
      rate,
    );
    return { timing, chapters };
  }, [segments, drafts, rate, data, p.targetSeconds]);

  useEffect(() => {
    const f = focusNext.current;
    if (f && handles.current.get(f.id)) {
      handles.current.get(f.id)!.focusAt(f.pos);
      focusNext.current = null;
    }
  });

  const handleFor = (id: string) => handles.current.get(id);

  const fail = (e: unknown) => {
    const err = e as SaveError;
    setMessage({ tone: "error", text: err.status === 409 ? `${err.message} Reload the latest script with the button below.` : err.message });
  };

  async function add(afterId: string | null, stepId: string | null = null, kind: SegmentKind = "voice_over") {
    try {
      const { segment } = await write<{ segment: SegmentDto }>(`/api/episodes/${p.episodeId}/script`, "POST", { afterId, stepId, kind });
      focusNext.current = { id: segment.id, pos: "start" };
      await refresh();
      setAnnounce(`Added segment ${segment.position + 1}.`);
    } catch (e) {
      fail(e);
    }
  }

  async function split(id: string, before: string, after: string) {
    const seg = segments.find((s) => s.id === id);
    if (!seg) return;
    const stored = await handleFor(id)?.flush();
    if (stored === null) return setMessage({ tone: "error", text: "Save or merge this segment before splitting it." });
    try {
      const r = await write<{ first: SegmentDto; second: SegmentDto }>(`/api/segments/${id}/split`, "POST", { version: (stored ?? seg).version, before, after });
      setDrafts((d) => ({ ...d, [id]: r.first.text }));
      focusNext.current = { id: r.second.id, pos: "start" };
      await refresh();
      setDrafts((d) => {
        const { [id]: _x, ...rest } = d;
        return rest;
      });
      setAnnounce("Segment split in two.");
    } catch (e) {
      fail(e);
    }
  }

  async function joinPrevious(id: string) {
    const i = segments.findIndex((s) => s.id === id);
    const prev = segments[i - 1];
    if (!prev) return;
    const a = await handleFor(prev.id)?.flush();
    const b = await handleFor(id)?.flush();
    if (a === null || b === null) return setMessage({ tone: "error", text: "Save or merge both segments before joining them." });
    try {
      await write(`/api/segments/${prev.id}/join`, "POST", { version: (a ?? prev).version, nextVersion: (b ?? segments[i]!).version });
      focusNext.current = { id: prev.id, pos: "end" };
      setDrafts((d) => {
        const { [id]: _x, [prev.id]: _y, ...rest } = d;
        return rest;
      });
      await refresh();
      setAnnounce("Segment joined with the one before.");
    } catch (e) {
      fail(e);
    }
  }

  async function reorder(ids: string[], label: string) {
    const previous = qc.getQueryData<ScriptData>(key);
    if (previous) qc.setQueryData<ScriptData>(key, { ...previous, segments: ids.map((id) => previous.segments.find((s) => s.id === id)!) });
    try {
      await write(`/api/episodes/${p.episodeId}/script/order`, "PUT", { ids });
      setAnnounce(label);
    } catch (e) {
      if (previous) qc.setQueryData(key, previous);
      fail(e);
    } finally {
      await refresh();
    }
  }

  const move = (id: string, delta: -1 | 1) => {
    const ids = segments.map((s) => s.id);
    const i = ids.indexOf(id);
    const j = i + delta;
    if (j < 0 || j >= ids.length) return;
    focusNext.current = { id, pos: "start" };
    void reorder(arrayMove(ids, i, j), `Moved segment to position ${j + 1} of ${ids.length}.`);
  };

  const onDragEnd = ({ active, over }: DragEndEvent) => {
    if (!over || active.id === over.id) return;
    const ids = segments.map((s) => s.id);
    const to = ids.indexOf(String(over.id));
    void reorder(arrayMove(ids, ids.indexOf(String(active.id)), to), `Moved segment to position ${to + 1} of ${ids.length}.`);
  };

  const overall: SaveState = Object.values(states).includes("conflict")
    ? "conflict"
    : Object.values(states).includes("offline")
      ? "offline"
      : Object.values(states).some((s) => s === "saving" || s === "pending")
        ? "saving"
        : "saved";

  if (error) return <Notice tone="error">{(error as Error).message}</Notice>;
  if (!data || !rate || !live) return <p className="text-sm text-walnut-700">Loading the script…</p>;

  const t = live.timing;
  const over = t.overFrames;
  const stepTitle = new Map(p.steps.map((s) => [s.id, s.title]));
  const problemsFor = (id: string) => live.chapters.chapters.find((c) => c.segmentId === id)?.problems ?? [];

  return (
    <div className="space-y-4">
      <div className="sticky top-0 z-10 -mx-1 flex flex-wrap items-center gap-x-5 gap-y-1 border-b border-timber-300 bg-timber-50 px-1 py-2 text-sm shadow-[0_4px_6px_-4px_rgb(42_28_18_/0.25)]" data-testid="script-summary">
        <span>
          Runtime <span className="num text-base font-bold">{formatTimecode(t.totalFrames, rate)}</span>
        </span>
        {t.targetFrames != null ? (
          <span data-testid="runtime-vs-target" className={over! > 0 ? "text-fault-700" : "text-pass-700"}>
            {over === 0 ? "exactly on target" : `${signedSeconds(over!, rate)} ${over! > 0 ? "over" : "under"} the target of ${formatTimecode(t.targetFrames, rate)}`}
          </span>
        ) : (
          <span className="text-walnut-600">no target runtime set</span>
        )}
        <span className="text-walnut-700">
          {SEGMENT_KINDS.filter((k) => t.byKind[k]).map((k) => `${SEGMENT_KIND_LABELS[k]} ${formatDuration(t.byKind[k], rate)}`).join(" · ")}
        </span>
        <span className="text-walnut-600">
          {data.rate.id} fps{data.rate.dropFrame ? " DF" : ""} · {data.wordsPerMinute} wpm
        </span>
        <span role="status" className="ml-auto rounded-plank border border-timber-300 px-2 py-0.5" data-testid="script-save-state">
          {overall === "saved" ? "All changes saved" : overall === "saving" ? "Saving…" : overall === "offline" ? "Offline: changes kept here, retrying" : "A segment needs a merge"}
        </span>
      </div>
      <p className="sr-only" role="status" aria-live="polite">
        {announce}
      </p>
      {message ? (
        <div className="flex items-center gap-2">
          <Notice tone={message.tone}>{message.text}</Notice>
          <Button onClick={() => (setMessage(null), void refresh())}>Reload latest</Button>
        </div>
      ) : null}

      <div className="flex flex-wrap gap-2 text-sm">
        <Link className="rounded-plank border border-timber-300 bg-white px-3 py-1 hover:bg-timber-100" href={`${p.base}/script/read`}>
          Read-through
        </Link>
        <Link className="rounded-plank border border-timber-300 bg-white px-3 py-1 hover:bg-timber-100" href={`${p.base}/script/print`}>
          Print view
        </Link>
        <a className="rounded-plank border border-timber-300 bg-white px-3 py-1 hover:bg-timber-100" href={`/api/episodes/${p.episodeId}/script/export?format=text`}>
          Export text
        </a>
        <a className="rounded-plank border border-timber-300 bg-white px-3 py-1 hover:bg-timber-100" href={`/api/episodes/${p.episodeId}/script/export?format=json`}>
          Export JSON
        </a>
        {p.canWrite ? <span className="self-center text-xs text-walnut-600">Ctrl+Enter splits at the cursor · Backspace at the start joins with the segment above · Alt+↑/↓ moves · {"{2s}"} adds a pause</span> : null}
      </div>

      {segments.length === 0 ? (
        <div className="rounded-plank border border-dashed border-timber-400 bg-white p-4 text-sm" data-testid="script-empty">
          <strong>No script yet.</strong> {p.canWrite ? "Add the first segment below: pick the build step it talks about and start typing. Timing appears as you write." : "The presenter writes the script."}
        </div>
      ) : null}

      <DndContext sensors={sensors} collisionDetection={closestCenter} onDragEnd={onDragEnd}>
        <SortableContext items={segments.map((s) => s.id)} strategy={verticalListSortingStrategy}>
          <ol className="space-y-2">
            {segments.map((s, i) => (
              <SegmentEditor
                key={s.id}
                ref={(h) => {
                  if (h) handles.current.set(s.id, h);
                  else handles.current.delete(s.id);
                }}
                segment={s}
                index={i}
                timing={t.segments[i]}
                rate={rate}
                steps={p.steps}
                canWrite={p.canWrite}
                canAnnotate={p.canAnnotate}
                chapterProblems={problemsFor(s.id)}
                onDraft={(id, text) => setDrafts((d) => ({ ...d, [id]: text }))}
                onSaved={(seg) => {
                  qc.setQueryData<ScriptData>(key, (old) => (old ? { ...old, segments: old.segments.map((x) => (x.id === seg.id ? seg : x)) } : old));
                }}
                onState={(id, st) => setStates((m) => ({ ...m, [id]: st }))}
                onSplit={split}
                onJoinPrevious={joinPrevious}
                onMove={move}
                onInsertAfter={(id) => void add(id, segments.find((x) => x.id === id)?.stepId ?? null)}
                editingBy={Object.values(liveNow.presence)
                  .filter((x) => x.episodeId === p.episodeId && x.segmentId === s.id)
                  .map((x) => x.userName)}
                onPresence={(segmentId) => void write(`/api/episodes/${p.episodeId}/presence`, "POST", { segmentId }).catch(() => undefined)}
                onDelete={async (id) => {
                  if (!window.confirm("Delete this segment? It stays in the history and can be restored.")) return;
                  await write(`/api/segments/${id}`, "DELETE").catch(fail);
                  await refresh();
                }}
              />
            ))}
          </ol>
        </SortableContext>
      </DndContext>

      {p.canWrite ? (
        <div className="flex flex-wrap items-end gap-2 rounded-plank border border-timber-300 bg-white p-3 text-sm">
          <label>
            <span className="block text-walnut-700">Under build step</span>
            <select className="rounded-plank border border-timber-300 px-1 py-1" value={newStep} onChange={(e) => setNewStep(e.target.value)}>
              <option value="">No build step</option>
              {p.steps.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.title}
                </option>
              ))}
            </select>
          </label>
          <label>
            <span className="block text-walnut-700">Kind</span>
            <select className="rounded-plank border border-timber-300 px-1 py-1" value={newKind} onChange={(e) => setNewKind(e.target.value as SegmentKind)}>
              {SEGMENT_KINDS.map((k) => (
                <option key={k} value={k}>
                  {SEGMENT_KIND_LABELS[k]}
                </option>
              ))}
            </select>
          </label>
          <Button
            variant="primary"
            onClick={() => {
              // After the last segment of that step, or at the end.
              const lastOfStep = newStep ? [...segments].reverse().find((s) => s.stepId === newStep) : undefined;
              void add(lastOfStep?.id ?? segments[segments.length - 1]?.id ?? null, newStep || null, newKind);
            }}
          >
            Add segment
          </Button>
        </div>
      ) : null}

      <section className="grid gap-4 md:grid-cols-2">
        <div className="rounded-plank border border-timber-300 bg-white p-3" data-testid="chapters">
          <h2 className="font-bold">Chapters for the description</h2>
          {live.chapters.chapters.length ? (
            <pre className="num mt-1 whitespace-pre-wrap text-sm">{live.chapters.text}</pre>
          ) : (
            <p className="text-sm text-walnut-700">Tick “Chapter starts here” on at least three segments, the first at the very start.</p>
          )}
          <p className={`mt-1 text-sm ${live.chapters.valid ? "text-pass-700" : "text-fault-700"}`}>
            {live.chapters.valid ? "Meets the platform's chapter rule." : [...live.chapters.problems, ...live.chapters.chapters.flatMap((c) => c.problems.map((x) => `${c.title || "untitled"}: ${x}`))].join(" · ")}
          </p>
        </div>
        <div className="rounded-plank border border-timber-300 bg-white p-3">
          <h2 className="font-bold">Runtime by build step</h2>
          <ul className="mt-1 text-sm">
            {Object.entries(t.byStep).map(([id, f]) => (
              <li key={id} className="flex justify-between gap-2">
                <span>{stepTitle.get(id) ?? "removed step"}</span>
                <span className="num">{formatDuration(f, rate)}</span>
              </li>
            ))}
            {Object.keys(t.byStep).length === 0 ? <li className="text-walnut-700">Link segments to build steps to see this.</li> : null}
          </ul>
        </div>
      </section>

      <section className="flex flex-wrap items-end gap-4 rounded-plank border border-timber-300 bg-white p-3 text-sm">
        <label>
          <span className="block text-walnut-700">My reading rate (words a minute)</span>
          <input className="num w-20 rounded-plank border border-timber-300 px-1 py-1" type="number" min={MIN_WPM} max={MAX_WPM} value={wpm} onChange={(e) => setWpm(Number(e.target.value))} />
        </label>
        <Button
          onClick={async () => {
            try {
              await write("/api/me", "PATCH", { readingRateWpm: wpm });
              setMessage({ tone: "ok", text: `Your reading rate is ${wpm} words a minute.` });
              await refresh();
            } catch (e) {
              fail(e);
            }
          }}
        >
          Save my rate
        </Button>
        {p.canChoosePresenter ? (
          <label>
            <span className="block text-walnut-700">Timed with the rate of</span>
            <select
              className="rounded-plank border border-timber-300 px-1 py-1"
              defaultValue={p.presenterId ?? ""}
              onChange={async (e) => {
                await write(`/api/episodes/${p.episodeId}`, "PATCH", { presenterId: e.target.value || null }).catch(fail);
                await refresh();
              }}
            >
              <option value="">Default ({DEFAULT_WPM} wpm)</option>
              {p.members.map((m) => (
                <option key={m.id} value={m.id}>
                  {m.name}
                </option>
              ))}
            </select>
          </label>
        ) : null}
        <span className="text-xs text-walnut-600">Narration runs about 150 words a minute; scripted reads up to about 180.</span>
      </section>
      <RevisionHistory episodeId={p.episodeId} canRestore={p.canWrite} onRestored={refresh} />
    </div>
  );
}

function RevisionHistory({ episodeId, canRestore, onRestored }: { episodeId: string; canRestore: boolean; onRestored: () => Promise<unknown> }) {
  const write = useWrite({ scope: `script:${episodeId}` });
  const [open, setOpen] = useState(false);
  const { data, refetch } = useQuery({
    queryKey: ["revisions", episodeId],
    queryFn: () => fetchJson<{ revisions: { id: string; segmentId: string | null; before: { text?: string } | null; after: { text?: string } | null; createdAt: string; userName: string | null }[] }>(`/api/episodes/${episodeId}/script/revisions`),
    enabled: open,
  });
  return (
    <section className="rounded-plank border border-timber-300 bg-white p-3 text-sm">
      <button type="button" className="font-bold" aria-expanded={open} onClick={() => setOpen((o) => !o)}>
        {open ? "▾" : "▸"} Revision history
      </button>
      {open ? (
        <ol className="mt-2 space-y-1" data-testid="revisions">
          {data?.revisions.map((r) => (
            <li key={r.id} className="flex flex-wrap items-baseline gap-2 border-b border-timber-200 pb-1">
              <span className="num text-xs text-walnut-600">{new Date(r.createdAt).toLocaleString()}</span>
              <span className="text-xs">{r.userName ?? "someone"}</span>
              <span className="text-xs text-walnut-700">{!r.before ? "added" : !r.after ? "deleted" : "edited"}</span>
              <span className="min-w-0 flex-1 truncate">{(r.after ?? r.before)?.text || "(empty)"}</span>
              {canRestore ? (
                <button
                  type="button"
                  className="rounded-plank border border-timber-300 px-2 text-xs hover:bg-timber-100"
                  onClick={async () => {
                    await write(`/api/script-revisions/${r.id}/restore`, "POST");
                    await onRestored();
                    await refetch();
                  }}
                >
                  Restore
                </button>
              ) : null}
            </li>
          ))}
        </ol>
      ) : null}
    </section>
  );
}
