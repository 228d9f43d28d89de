"use client";
import Link from "next/link";
import { useMemo, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import {
  DndContext,
  KeyboardSensor,
  PointerSensor,
  closestCorners,
  useDroppable,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
  type DragOverEvent,
} from "@dnd-kit/core";
import { SortableContext, sortableKeyboardCoordinates, verticalListSortingStrategy } from "@dnd-kit/sortable";
import type { EpisodeDto } from "@/lib/schemas/episode";
import { STAGES, STAGE_COLOURS, STAGE_INFO, isStage, type Stage } from "@/lib/stages";
import { can, canMoveEpisode } from "@/lib/permissions";
import type { Role } from "@/lib/roles";
import { columnsOf, moveItem } from "@/lib/board";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import { EpisodeForm } from "@/components/episode-form";
import { EpisodeCard, type MoveRequest } from "./episode-card";
import { ApiError, episodesApi } from "./api";

const COL = "col:";

function Column({
  stage,
  children,
  count,
  emptyHint,
}: {
  stage: Stage;
  children: React.ReactNode;
  count: number;
  emptyHint: string;
}) {
  const { setNodeRef, isOver } = useDroppable({ id: `${COL}${stage}` });
  const info = STAGE_INFO[stage];
  return (
    <section aria-labelledby={`stage-${stage}`} className={`flex min-w-0 flex-col rounded-plank border border-timber-200 bg-timber-100/70 ${isOver ? "ring-2 ring-chalk-500" : ""}`}>
      <header className="border-b border-timber-300 px-2.5 pb-1.5 pt-2" style={{ borderTop: `3px solid ${STAGE_COLOURS[stage]}` }}>
        <h2 id={`stage-${stage}`} className="flex items-baseline gap-2">
          <span className="num text-lg text-walnut-600">{info.step}</span>
          <span className="font-bold">{info.label}</span>
          <span className="num ml-auto text-xs text-walnut-600" aria-label={`${count} episodes`}>
            {count}
          </span>
        </h2>
        <p className="text-xs text-walnut-600">{info.hint}</p>
      </header>
      <ul ref={setNodeRef} className="flex min-h-24 flex-1 flex-col gap-2 p-2">
        {children}
        {count === 0 ? <li className="rounded-plank border border-dashed border-timber-300 p-3 text-xs text-walnut-600">{emptyHint}</li> : null}
      </ul>
    </section>
  );
}

export function Board({ channelId, roles, initial, initialStage = "all" }: { channelId: string; roles: Role[]; initial: EpisodeDto[]; initialStage?: Stage | "all" }) {
  const qc = useQueryClient();
  const key = useMemo(() => ["episodes", channelId], [channelId]);
  const { data: episodes = initial } = useQuery({ queryKey: key, queryFn: () => episodesApi.list(channelId), initialData: initial });
  const [dragItems, setDragItems] = useState<EpisodeDto[] | null>(null);
  const [status, setStatus] = useState("");
  // The new episode is also shown to sighted users, not only announced.
  const [added, setAdded] = useState<{ id: string; title: string; stage: Stage } | null>(null);
  const [error, setError] = useState<string | null>(null);
  /** When a move to published was refused by the checklist: where to see and fix it. */
  const [checklistFor, setChecklistFor] = useState<string | null>(null);
  const [stageFilter, setStageFilter] = useState<Stage | "all">(initialStage);
  const [month, setMonth] = useState("");
  const [creating, setCreating] = useState(false);
  const [showArchived, setShowArchived] = useState(false);
  const archived = useQuery({ queryKey: ["episodes-archived", channelId], queryFn: () => episodesApi.listArchived(channelId), enabled: showArchived });

  const items = dragItems ?? episodes;
  const title = (id: string) => episodes.find((e) => e.id === id)?.title ?? "episode";
  const visible = (e: EpisodeDto) => !month || (e.publishDate ?? "").startsWith(month);
  const columns = columnsOf(items);
  const shownStages = stageFilter === "all" ? STAGES : [stageFilter];

  const move = useMutation({
    mutationFn: (v: { id: string; stage: Stage; position: number }) => episodesApi.update(v.id, { stage: v.stage, position: v.position }),
    onMutate: async (v) => {
      setError(null);
      await qc.cancelQueries({ queryKey: key });
      const previous = qc.getQueryData<EpisodeDto[]>(key);
      qc.setQueryData<EpisodeDto[]>(key, (old) => moveItem(old ?? [], v.id, v.stage, v.position));
      return { previous };
    },
    onError: (err, v, ctx) => {
      if (ctx?.previous) qc.setQueryData(key, ctx.previous);
      const why = err instanceof ApiError ? err.message : "The server could not be reached.";
      setError(`“${title(v.id)}” was not moved: ${why} It is back where it was.`);
      setChecklistFor(err instanceof ApiError && err.status === 409 && v.stage === "published" ? v.id : null);
      setStatus(`Move refused. “${title(v.id)}” is back in its place.`);
    },
    onSuccess: (ep) => {
      const col = columnsOf(qc.getQueryData<EpisodeDto[]>(key) ?? []);
      setStatus(`Moved “${ep.title}” to ${STAGE_INFO[ep.stage].label}, position ${ep.position + 1} of ${col[ep.stage].length}.`);
    },
    onSettled: () => qc.invalidateQueries({ queryKey: key }),
  });

  /** Turns an index among the visible (filtered) cards into a position in the whole column. */
  function positionFor(stage: Stage, id: string, visibleIndex: number): number {
    const col = columnsOf(episodes)[stage].filter((e) => e.id !== id);
    const shown = col.filter(visible);
    if (visibleIndex >= shown.length) {
      const last = shown[shown.length - 1];
      return last ? col.indexOf(last) + 1 : col.length;
    }
    return col.indexOf(shown[Math.max(0, visibleIndex)]!);
  }

  function requestMove(m: MoveRequest) {
    const current = episodes.find((e) => e.id === m.id);
    if (!current) return;
    if (!canMoveEpisode(roles, current.stage, m.stage)) {
      setError(`Your role cannot move “${current.title}” to ${STAGE_INFO[m.stage].label}.`);
      setStatus(`Move refused for “${current.title}”.`);
      return;
    }
    const position = positionFor(m.stage, m.id, m.index);
    if (current.stage === m.stage && current.position === position) return;
    move.mutate({ id: m.id, stage: m.stage, position });
  }

  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 6 } }),
    useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }),
  );

  const stageOf = (id: string | number | undefined, list: EpisodeDto[]): Stage | null => {
    if (id === undefined) return null;
    const s = String(id);
    if (s.startsWith(COL)) {
      const st = s.slice(COL.length);
      return isStage(st) ? st : null;
    }
    return list.find((e) => e.id === s)?.stage ?? null;
  };

  function onDragOver({ active, over }: DragOverEvent) {
    const list = dragItems ?? episodes;
    const from = stageOf(active.id, list);
    const to = stageOf(over?.id, list);
    if (!from || !to || from === to) return;
    const target = columnsOf(list)[to];
    const overIndex = target.findIndex((e) => e.id === over?.id);
    setDragItems(moveItem(list, String(active.id), to, overIndex < 0 ? target.length : overIndex));
  }

  function onDragEnd({ active, over }: DragEndEvent) {
    const list = dragItems ?? episodes;
    setDragItems(null);
    if (!over) return;
    const id = String(active.id);
    const stage = stageOf(id, list);
    if (!stage) return;
    const shown = columnsOf(list)[stage].filter(visible);
    const overIndex = shown.findIndex((e) => e.id === String(over.id));
    const index = overIndex >= 0 ? overIndex : shown.findIndex((e) => e.id === id);
    requestMove({ id, stage, index: index < 0 ? shown.length : index });
  }

  const announcements: Announcements = {
    onDragStart: ({ active }) => `Picked up “${title(String(active.id))}”. Use the arrow keys to move it between stages and positions.`,
    onDragOver: ({ active, over }) => {
      const st = stageOf(over?.id, dragItems ?? episodes);
      return st ? `“${title(String(active.id))}” is over ${STAGE_INFO[st].label}.` : `“${title(String(active.id))}” is not over a stage.`;
    },
    onDragEnd: ({ active, over }) => {
      const st = stageOf(over?.id, dragItems ?? episodes);
      return st ? `Dropped “${title(String(active.id))}” in ${STAGE_INFO[st].label}.` : `Dropped “${title(String(active.id))}” where it started.`;
    },
    onDragCancel: ({ active }) => `Move cancelled. “${title(String(active.id))}” is back where it was.`,
  };

  const canCreate = can(roles, "episode.create");
  const monthOptions = Array.from(new Set(episodes.map((e) => e.publishDate?.slice(0, 7)).filter(Boolean) as string[])).sort();

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <h1 className="mr-auto text-xl font-bold">Episodes</h1>
        <label className="text-sm">
          <span className="block text-walnut-700">Stage</span>
          <select className="rounded-plank border border-timber-300 bg-white px-2 py-1" value={stageFilter} onChange={(e) => setStageFilter(e.target.value as Stage | "all")}>
            <option value="all">All stages</option>
            {STAGES.map((s) => (
              <option key={s} value={s}>
                {STAGE_INFO[s].step}. {STAGE_INFO[s].label}
              </option>
            ))}
          </select>
        </label>
        <label className="text-sm">
          <span className="block text-walnut-700">Publish month</span>
          <select className="rounded-plank border border-timber-300 bg-white px-2 py-1" value={month} onChange={(e) => setMonth(e.target.value)}>
            <option value="">Any month</option>
            {monthOptions.map((m) => (
              <option key={m} value={m}>
                {m}
              </option>
            ))}
          </select>
        </label>
        {canCreate ? (
          <Button variant="primary" onClick={() => setCreating((c) => !c)} aria-expanded={creating}>
            New episode
          </Button>
        ) : null}
      </div>

      <p role="status" aria-live="polite" className="sr-only" data-testid="board-status">
        {status}
      </p>
      {added ? (
        <div className="flex flex-wrap items-center gap-2 rounded-plank border-l-4 border-pass-600 bg-pass-100 px-3 py-2 text-sm text-pass-900" data-testid="board-added">
          <span>
            Added “{added.title}” to {STAGE_INFO[added.stage].step} · {STAGE_INFO[added.stage].label}.
          </span>
          <Link className="font-medium underline" href={`/c/${channelId}/episodes/${added.id}`}>
            Open it to plan the build
          </Link>
          <button type="button" className="ml-auto rounded-plank px-2 hover:bg-white" onClick={() => setAdded(null)}>
            Dismiss
          </button>
        </div>
      ) : null}
      {error ? (
        <div data-testid="board-error">
          <Notice tone="error">{error}</Notice>
          {checklistFor ? (
            <Link className="mt-1 inline-block text-sm font-medium underline" href={`/c/${channelId}/episodes/${checklistFor}/publish`}>
              Open the publish checklist
            </Link>
          ) : null}
        </div>
      ) : null}

      {creating ? (
        <div className="rounded-plank border border-timber-300 bg-white p-4">
          <EpisodeForm
            mode="create"
            onCancel={() => setCreating(false)}
            onSubmit={async (values) => {
              try {
                const ep = await episodesApi.create(channelId, values);
                await qc.invalidateQueries({ queryKey: key });
                setStatus(`Added “${ep.title}” to ${STAGE_INFO[ep.stage].label}.`);
                setAdded({ id: ep.id, title: ep.title, stage: ep.stage });
                setCreating(false);
                return { ok: true, episode: ep };
              } catch (e) {
                return e instanceof ApiError ? { ok: false, message: e.message, fields: e.fields } : { ok: false, message: "The server could not be reached." };
              }
            }}
          />
        </div>
      ) : null}

      {episodes.length === 0 ? (
        <div className="rounded-plank border border-dashed border-timber-400 bg-white p-6" data-testid="board-empty">
          <h2 className="font-bold">No episodes yet</h2>
          <p className="mt-1 text-sm text-walnut-700">
            {canCreate
              ? "Start with the build you want to film next: press “New episode”, give it a working title, and it lands in the Sketchbook. Plan its steps, script and shots from there."
              : "Nothing on the board yet. A presenter, producer or the owner adds the first episode."}
          </p>
        </div>
      ) : null}

      <div className="text-sm">
        <button type="button" className="text-chalk-600 underline" aria-expanded={showArchived} onClick={() => setShowArchived((v) => !v)}>
          {showArchived ? "Hide archived episodes" : "Show archived episodes"}
        </button>
        {showArchived ? (
          <ul className="mt-2 space-y-1" data-testid="archived-list">
            {archived.data?.length === 0 ? <li className="text-walnut-700">Nothing archived.</li> : null}
            {archived.data?.map((e) => (
              <li key={e.id} className="flex items-center gap-2">
                <span>{e.title}</span>
                <span className="text-xs text-walnut-600">{STAGE_INFO[e.stage].label}</span>
                {canCreate ? (
                  <Button
                    onClick={async () => {
                      try {
                        await episodesApi.restore(e.id);
                        setStatus(`Restored “${e.title}” to ${STAGE_INFO[e.stage].label}.`);
                        await Promise.all([qc.invalidateQueries({ queryKey: key }), archived.refetch()]);
                      } catch (err) {
                        setError((err as Error).message);
                      }
                    }}
                  >
                    Restore
                  </Button>
                ) : null}
              </li>
            ))}
          </ul>
        ) : null}
      </div>

      <DndContext
        sensors={sensors}
        collisionDetection={closestCorners}
        onDragStart={() => setDragItems(episodes)}
        onDragOver={onDragOver}
        onDragEnd={onDragEnd}
        onDragCancel={() => setDragItems(null)}
        accessibility={{
          announcements,
          screenReaderInstructions: {
            draggable: "To pick up an episode, press space or enter. Arrow keys move it; space or enter drops it; escape cancels. Each card also has a Move to… menu.",
          },
        }}
      >
        <div className="bench grid grid-cols-1 gap-3 md:grid-cols-none md:auto-cols-[minmax(11.25rem,1fr)] md:grid-flow-col md:overflow-x-auto md:pb-2">
          {shownStages.map((stage) => {
            const shown = columns[stage].filter(visible);
            return (
              <SortableContext key={stage} id={stage} items={shown.map((e) => e.id)} strategy={verticalListSortingStrategy}>
                <Column stage={stage} count={shown.length} emptyHint={month ? "No episodes publishing that month here." : "Nothing at this stage. Drag a card here or use its Move to… menu."}>
                  {shown.map((ep, i) => (
                    <EpisodeCard key={ep.id} episode={ep} channelId={channelId} roles={roles} indexInColumn={i} columnLength={shown.length} onMove={requestMove} />
                  ))}
                </Column>
              </SortableContext>
            );
          })}
        </div>
      </DndContext>
    </div>
  );
}
