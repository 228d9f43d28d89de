"use client";
import { useMemo, useState } from "react";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { DndContext, KeyboardSensor, PointerSensor, closestCenter, useSensor, useSensors, type DragEndEvent } from "@dnd-kit/core";
import { SortableContext, arrayMove, sortableKeyboardCoordinates, useSortable, verticalListSortingStrategy } from "@dnd-kit/sortable";
import { CSS } from "@dnd-kit/utilities";
import { formatMinutes } from "@/lib/build-plan";
import { STEP_STATUSES, STEP_STATUS_LABELS, ACQUISITION_LABELS, type Acquisition } from "@/lib/schemas/build";
import { COVERAGE_LABELS, type CoverageKind } from "@/lib/shot-kinds";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import { Caution } from "@/components/caution";
import { PlanTimeline } from "./plan-timeline";
import { StepForm, type StepBody } from "./step-form";
import { FailureForm } from "./failure-form";
import { fetchJson } from "@/components/fetch-json";
import type { PlanDto, PlanStepDto, ToolDto } from "@/lib/schemas/build";
import { useWrite } from "@/components/use-write";

type Result = { ok: true } | { ok: false; message: string; fields?: Record<string, string[]> };

async function attempt(f: () => Promise<unknown>): Promise<Result> {
  try {
    await f();
    return { ok: true };
  } catch (e) {
    const err = e as Error & { fields?: Record<string, string[]> };
    return { ok: false, message: err.message, fields: err.fields };
  }
}

const STATUS_STYLE: Record<string, string> = {
  planned: "border-timber-400 text-walnut-800",
  in_progress: "border-chalk-600 text-chalk-700",
  done: "border-pass-600 text-pass-700",
  failed: "border-fault-700 text-fault-700",
  skipped: "border-walnut-500 text-walnut-600 line-through",
};

function StepItem({
  step,
  index,
  count,
  plan,
  tools,
  canEdit,
  canTime,
  episodeId,
  critical,
  refresh,
  onMove,
}: {
  step: PlanStepDto;
  index: number;
  count: number;
  plan: PlanDto;
  tools: ToolDto[];
  canEdit: boolean;
  canTime: boolean;
  episodeId: string;
  critical: boolean;
  refresh: () => Promise<unknown>;
  onMove: (from: number, to: number) => void;
}) {
  const write = useWrite({ scope: `plan:${episodeId}` });
  const [mode, setMode] = useState<"view" | "edit" | "fail" | "remedy">("view");
  const { attributes, listeners, setNodeRef, transform, transition } = useSortable({ id: step.id, disabled: !canEdit });
  const title = (id: string) => plan.steps.find((s) => s.id === id)?.title ?? "a removed step";
  const toolById = new Map(tools.map((t) => [t.id, t]));
  const remedyOf = step.remedyOfStepId ? plan.steps.find((s) => s.id === step.remedyOfStepId) : null;

  return (
    <li
      ref={setNodeRef}
      style={{ transform: CSS.Transform.toString(transform), transition }}
      data-testid="build-step"
      data-step-title={step.title}
      className={`rounded-plank border bg-white ${remedyOf ? "ml-6 border-l-4 border-pass-600" : "border-timber-300"} ${step.status === "failed" ? "border-fault-700" : ""}`}
    >
      <div className="flex items-start gap-2 p-3">
        {canEdit ? (
          <button type="button" className="mt-1 cursor-grab rounded-plank px-1 text-walnut-500 hover:bg-timber-100" aria-label={`Drag step ${step.title} to reorder`} {...attributes} {...listeners}>
            ⠿
          </button>
        ) : null}
        <span className="num mt-0.5 w-6 text-right text-lg text-walnut-600">{index + 1}</span>
        <div className="min-w-0 flex-1 space-y-1.5">
          <div className="flex flex-wrap items-baseline gap-2">
            <h3 className="font-bold">{step.title}</h3>
            <span className={`rounded-plank border px-1.5 text-xs ${STATUS_STYLE[step.status]}`}>{STEP_STATUS_LABELS[step.status]}</span>
            {critical ? <span className="rounded-plank border border-walnut-900 px-1.5 text-xs">critical path</span> : null}
            {remedyOf ? <span className="text-xs text-pass-700">Remedy for “{remedyOf.title}”</span> : null}
          </div>
          <p className="flex flex-wrap gap-x-4 text-sm text-walnut-700">
            <span>
              Hands-on <span className="num text-walnut-900">{formatMinutes(step.activeMinutes)}</span>
            </span>
            {step.waitMinutes ? (
              <span>
                then wait <span className="num text-walnut-900">{formatMinutes(step.waitMinutes)}</span>
                {step.waitReason ? ` (${step.waitReason})` : ""}
              </span>
            ) : null}
            <span>
              Crew <span className="num text-walnut-900">{step.crewNeeded}</span>
            </span>
            <span title="Elapsed time from the start of the first step, counting the team's people; not a clock time">
              Starts at <span className="num text-walnut-900">+{formatMinutes(step.crewTiming.start)}</span> elapsed
              {step.crewTiming.crewDelayMinutes > 0 ? <span className="text-walnut-700"> (waits {formatMinutes(step.crewTiming.crewDelayMinutes)} for free hands)</span> : null}
            </span>
          </p>
          {step.notes ? <p className="whitespace-pre-wrap text-sm">{step.notes}</p> : null}
          <p className="flex flex-wrap gap-x-4 gap-y-1 text-xs text-walnut-700">
            {step.dependsOn.length ? <span>Waits for: {step.dependsOn.map(title).join(", ")}</span> : null}
            {step.coverageKinds.length ? <span>Cover as: {step.coverageKinds.map((k) => COVERAGE_LABELS[k as CoverageKind] ?? k).join(", ")}</span> : null}
            {step.toolIds.length ? (
              <span>
                Tools:{" "}
                {step.toolIds
                  .map((t) => toolById.get(t))
                  .filter(Boolean)
                  .map((t) => `${t!.name}${t!.sponsored ? " (sponsor)" : ""}`)
                  .join(", ")}
              </span>
            ) : null}
          </p>
          {step.cautions.map((h) => (
            <Caution key={h} hazard={h} />
          ))}
          {step.toolIds
            .map((t) => toolById.get(t))
            .filter((t) => t?.caution)
            .map((t) => (
              <p key={t!.id} className="text-xs text-walnut-800">
                <strong>{t!.name}:</strong> {t!.caution}
              </p>
            ))}
          {step.status === "failed" ? (
            <div className="rounded-plank bg-fault-50 p-2 text-sm" data-testid="failure-note">
              <strong className="text-fault-700">What went wrong:</strong> {step.failureNote}
              {step.failurePhotoUrl ? (
                <a className="ml-2 text-chalk-600 underline" href={step.failurePhotoUrl} target="_blank" rel="noreferrer">
                  photo
                </a>
              ) : null}
            </div>
          ) : null}

          {mode === "view" && (canEdit || canTime) ? (
            <div className="flex flex-wrap gap-2 pt-1">
              <Button onClick={() => setMode("edit")}>{canEdit ? "Edit" : "Edit timing"}</Button>
              {canEdit ? (
                <>
                  <label className="flex items-center gap-1 text-sm">
                    <span className="sr-only">Status of {step.title}</span>
                    <select
                      className="rounded-plank border border-timber-300 bg-white px-1 py-1 text-sm"
                      value={step.status}
                      onChange={async (e) => {
                        if (e.target.value === "failed") return setMode("fail");
                        await write(`/api/steps/${step.id}`, "PATCH", { status: e.target.value });
                        await refresh();
                      }}
                    >
                      {STEP_STATUSES.map((s) => (
                        <option key={s} value={s}>
                          {STEP_STATUS_LABELS[s]}
                        </option>
                      ))}
                    </select>
                  </label>
                  {step.status !== "failed" ? (
                    <Button variant="danger" onClick={() => setMode("fail")}>
                      Mark failed
                    </Button>
                  ) : (
                    <Button onClick={() => setMode("remedy")}>Add remedy step</Button>
                  )}
                  <Button variant="quiet" disabled={index === 0} onClick={() => onMove(index, index - 1)} aria-label={`Move ${step.title} up`}>
                    ↑
                  </Button>
                  <Button variant="quiet" disabled={index === count - 1} onClick={() => onMove(index, index + 1)} aria-label={`Move ${step.title} down`}>
                    ↓
                  </Button>
                  <Button
                    variant="quiet"
                    onClick={async () => {
                      if (!window.confirm(`Delete the step “${step.title}”?`)) return;
                      await write(`/api/steps/${step.id}`, "DELETE");
                      await refresh();
                    }}
                  >
                    Delete
                  </Button>
                </>
              ) : null}
            </div>
          ) : null}
          {mode === "edit" ? (
            <StepForm
              mode="edit"
              initial={step}
              steps={plan.steps}
              tools={tools}
              timingOnly={!canEdit}
              submitLabel="Save step"
              onCancel={() => setMode("view")}
              onSubmit={async (body: StepBody) => {
                const r = await attempt(() => write(`/api/steps/${step.id}`, "PATCH", body));
                if (r.ok) {
                  await refresh();
                  setMode("view");
                }
                return r;
              }}
            />
          ) : null}
          {mode === "fail" ? (
            <FailureForm
              episodeId={episodeId}
              stepId={step.id}
              onCancel={() => setMode("view")}
              onDone={async () => {
                await refresh();
                setMode("remedy");
              }}
            />
          ) : null}
          {mode === "remedy" ? (
            <div className="rounded-plank border border-pass-600 bg-pass-50 p-3">
              <h4 className="mb-2 text-sm font-bold">Remedy for “{step.title}”</h4>
              <StepForm
                mode="create"
                steps={plan.steps}
                tools={tools}
                timingOnly={false}
                submitLabel="Add remedy step"
                onCancel={() => setMode("view")}
                onSubmit={async (body) => {
                  const r = await attempt(() => write(`/api/steps/${step.id}/remedies`, "POST", body));
                  if (r.ok) {
                    await refresh();
                    setMode("view");
                  }
                  return r;
                }}
              />
            </div>
          ) : null}
        </div>
      </div>
    </li>
  );
}

export function BuildPlan({ episodeId, tools, canEdit, canTime }: { episodeId: string; tools: ToolDto[]; canEdit: boolean; canTime: boolean }) {
  const write = useWrite({ scope: `plan:${episodeId}` });
  const qc = useQueryClient();
  const key = useMemo(() => ["plan", episodeId], [episodeId]);
  const { data: plan, error } = useQuery({ queryKey: key, queryFn: () => fetchJson<PlanDto>(`/api/episodes/${episodeId}/steps`) });
  const [status, setStatus] = useState("");
  const [moveError, setMoveError] = useState<string | null>(null);
  const refresh = () => qc.invalidateQueries({ queryKey: key });
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }), useSensor(KeyboardSensor, { coordinateGetter: sortableKeyboardCoordinates }));

  const reorder = useMutation({
    mutationFn: (ids: string[]) => fetchJson(`/api/episodes/${episodeId}/steps/order`, { method: "PUT", json: { ids } }),
    onMutate: async (ids) => {
      await qc.cancelQueries({ queryKey: key });
      const previous = qc.getQueryData<PlanDto>(key);
      if (previous) qc.setQueryData<PlanDto>(key, { ...previous, steps: ids.map((id, i) => ({ ...previous.steps.find((s) => s.id === id)!, position: i })) });
      return { previous };
    },
    onError: (e, _ids, ctx) => {
      if (ctx?.previous) qc.setQueryData(key, ctx.previous);
      setMoveError(`The new order was not saved: ${(e as Error).message}`);
    },
    onSettled: refresh,
  });

  if (error) return <Notice tone="error">{(error as Error).message}</Notice>;
  if (!plan) return <p className="text-sm text-walnut-700">Loading the build plan…</p>;

  const move = (from: number, to: number) => {
    const ids = arrayMove(plan.steps.map((s) => s.id), from, to);
    setMoveError(null);
    reorder.mutate(ids);
    setStatus(`Moved “${plan.steps[from]!.title}” to position ${to + 1} of ${ids.length}.`);
  };
  const onDragEnd = ({ active, over }: DragEndEvent) => {
    if (!over || active.id === over.id) return;
    const ids = plan.steps.map((s) => s.id);
    move(ids.indexOf(String(active.id)), ids.indexOf(String(over.id)));
  };
  const critical = new Set(plan.timing.criticalPath);
  const bars = plan.steps.map((s) => ({ id: s.id, label: `${s.position + 1}. ${s.title}`, start: s.crewTiming.start, activeEnd: s.crewTiming.activeEnd, end: s.crewTiming.end, critical: critical.has(s.id), failed: s.status === "failed" }));
  const team = plan.crew.team;
  const overCrew = plan.steps.filter((s) => plan.crew.overCrew.includes(s.id));

  return (
    <div className="space-y-4">
      <dl className="grid grid-cols-2 gap-2 sm:max-w-3xl sm:grid-cols-4" data-testid="plan-totals">
        {[
          ["Hands-on in total", plan.timing.totalActiveMinutes],
          ["Waits in total", plan.timing.totalWaitMinutes],
          ["Longest chain", plan.timing.criticalPathMinutes],
          [`With ${team} ${team === 1 ? "person" : "people"}`, plan.crew.finishMinutes],
        ].map(([label, v]) => (
          <div key={label as string} className="rounded-plank border border-timber-300 bg-white p-2">
            <dt className="text-xs text-walnut-600">{label}</dt>
            <dd className="num text-lg">{formatMinutes(v as number)}</dd>
          </div>
        ))}
      </dl>
      {plan.timing.criticalPathMinutes > 8 * 60 ? (
        <p className="text-sm text-walnut-700">
          The longest chain of steps and waits runs {formatMinutes(plan.timing.criticalPathMinutes)}; plan the shoot over several days.
        </p>
      ) : null}
      <p className="text-sm text-walnut-700" data-testid="plan-time-note">
        Times here are elapsed time from the start of the first step, one duration after another, with hands-on time shared among the channel&apos;s {team} {team === 1 ? "person" : "people"}. They are not clock times and not a shoot schedule: nights, days off and crew availability come with shoot days.
      </p>
      {overCrew.length ? (
        <Notice tone="info">
          {overCrew.map((s) => `“${s.title}” needs ${s.crewNeeded} people`).join("; ")}, but the channel has {team}. It is timed as if everyone were enough; bring in a helper or split the step.
        </Notice>
      ) : null}
      <PlanTimeline bars={bars} total={plan.crew.finishMinutes} />

      <p role="status" aria-live="polite" className="sr-only">
        {status}
      </p>
      {moveError ? <Notice tone="error">{moveError}</Notice> : null}

      {plan.steps.length === 0 ? (
        <div className="rounded-plank border border-dashed border-timber-400 bg-white p-4 text-sm" data-testid="plan-empty">
          <strong>No build steps yet.</strong> {canEdit ? "Add the first one below: what you do, how long it takes hands-on, and how long to wait after (glue, finish)." : "The presenter adds the steps."}
        </div>
      ) : null}

      <DndContext sensors={sensors} collisionDetection={closestCenter} onDragEnd={onDragEnd}>
        <SortableContext items={plan.steps.map((s) => s.id)} strategy={verticalListSortingStrategy}>
          <ol className="space-y-2">
            {plan.steps.map((s, i) => (
              <StepItem key={s.id} step={s} index={i} count={plan.steps.length} plan={plan} tools={tools} canEdit={canEdit} canTime={canTime} episodeId={episodeId} critical={critical.has(s.id)} refresh={refresh} onMove={move} />
            ))}
          </ol>
        </SortableContext>
      </DndContext>

      {canEdit ? (
        <section className="rounded-plank border border-timber-300 bg-white p-4">
          <h2 className="mb-2 font-bold">Add a build step</h2>
          <StepForm
            mode="create"
            steps={plan.steps}
            tools={tools}
            timingOnly={false}
            submitLabel="Add step"
            onSubmit={async (body) => {
              const r = await attempt(() => write(`/api/episodes/${episodeId}/steps`, "POST", body));
              if (r.ok) await refresh();
              return r;
            }}
          />
        </section>
      ) : null}

      <section>
        <h2 className="font-bold">Tools in this build</h2>
        {plan.toolsUsed.length === 0 ? <p className="text-sm text-walnut-700">No tools linked to steps yet.</p> : null}
        <ul className="mt-1 space-y-1 text-sm" data-testid="tools-used">
          {plan.toolsUsed.map((t) => (
            <li key={t.id} className="flex flex-wrap gap-x-2">
              <strong>{t.name}</strong>
              {t.sponsored ? (
                <span className="rounded-plank border border-walnut-700 px-1 text-xs" data-testid="sponsored-tool">
                  {ACQUISITION_LABELS[t.acquisition as Acquisition]}: needs credit and disclosure
                </span>
              ) : null}
              <span className="text-walnut-600">in {t.steps.join(", ")}</span>
            </li>
          ))}
        </ul>
      </section>
    </div>
  );
}
