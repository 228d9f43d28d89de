"use client";
import { useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { stepCreateSchema, stepUpdateSchema } from "@/lib/schemas/build";
import { COVERAGE_KINDS, COVERAGE_LABELS } from "@/lib/shot-kinds";
import { CAUTIONS, HAZARDS } from "@/lib/safety";
import { TextField, Notice, SelectField } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { Checkbox } from "@/components/ui/checkbox";
import type { PlanStepDto, ToolDto } from "@/lib/schemas/build";

const WAIT_UNITS = { minutes: 1, hours: 60, days: 1440 } as const;
type WaitUnit = keyof typeof WAIT_UNITS;

interface Fields {
  title: string;
  notes: string;
  active: string;
  wait: string;
  waitUnit: WaitUnit;
  waitReason: string;
  crew: string;
  coverageKinds: string[];
  hazards: string[];
  dependsOn: string[];
  toolIds: string[];
}

export type StepBody = Record<string, unknown>;

function bestUnit(minutes: number): WaitUnit {
  if (minutes && minutes % 1440 === 0) return "days";
  if (minutes && minutes % 60 === 0) return "hours";
  return "minutes";
}

const num = (s: string) => (s.trim() === "" ? 0 : Number(s));

/**
 * Add or edit a build step. Producers see only the timing fields. The body
 * goes through the same zod schema as the route before it is sent.
 */
export function StepForm({
  mode,
  initial,
  steps,
  tools,
  timingOnly,
  submitLabel,
  onSubmit,
  onCancel,
}: {
  mode: "create" | "edit";
  initial?: PlanStepDto;
  steps: PlanStepDto[];
  tools: ToolDto[];
  timingOnly: boolean;
  submitLabel: string;
  onSubmit: (body: StepBody) => Promise<{ ok: true } | { ok: false; message: string; fields?: Record<string, string[]> }>;
  onCancel?: () => void;
}) {
  const [error, setError] = useState<string | null>(null);
  const schema = mode === "create" ? stepCreateSchema : stepUpdateSchema;
  const zod = zodResolver(schema as never) as unknown as Resolver<StepBody, unknown, StepBody>;
  const toBody = (f: Fields): StepBody => {
    const timing = {
      activeMinutes: num(f.active),
      waitMinutes: Math.round(num(f.wait) * WAIT_UNITS[f.waitUnit]),
      waitReason: f.waitReason,
      crewNeeded: num(f.crew) || 1,
    };
    if (timingOnly) return timing;
    return { title: f.title, notes: f.notes, ...timing, coverageKinds: f.coverageKinds, hazards: f.hazards, dependsOn: f.dependsOn, toolIds: f.toolIds };
  };
  const fieldOf: Record<string, keyof Fields> = { activeMinutes: "active", waitMinutes: "wait", crewNeeded: "crew" };
  const resolver: Resolver<Fields, unknown, StepBody> = async (fields, ctx, opts) => {
    const r = await zod(toBody(fields), ctx, opts as never);
    const errors: Record<string, unknown> = {};
    for (const [k, v] of Object.entries(r.errors ?? {})) errors[fieldOf[k] ?? k] = v;
    return Object.keys(errors).length ? { values: {}, errors: errors as never } : { values: r.values as StepBody, errors: {} };
  };
  const unit = bestUnit(initial?.waitMinutes ?? 0);
  const { register, handleSubmit, formState, setError: setFieldError, reset } = useForm<Fields, unknown, StepBody>({
    resolver,
    defaultValues: {
      title: initial?.title ?? "",
      notes: initial?.notes ?? "",
      active: String(initial?.activeMinutes ?? 30),
      wait: String((initial?.waitMinutes ?? 0) / WAIT_UNITS[unit]),
      waitUnit: unit,
      waitReason: initial?.waitReason ?? "",
      crew: String(initial?.crewNeeded ?? 1),
      coverageKinds: initial?.coverageKinds ?? [],
      hazards: initial?.hazards ?? [],
      dependsOn: initial?.dependsOn ?? [],
      toolIds: initial?.toolIds ?? [],
    },
  });
  const e = formState.errors;
  const submit = handleSubmit(async (body) => {
    setError(null);
    const r = await onSubmit(body);
    if (!r.ok) {
      for (const [k, msgs] of Object.entries(r.fields ?? {})) setFieldError((fieldOf[k] ?? k) as keyof Fields, { message: msgs[0] });
      setError(r.message);
      return;
    }
    if (mode === "create") reset();
  });
  const others = steps.filter((s) => s.id !== initial?.id);

  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-4" aria-label={submitLabel}>
      {error ? (
        <div className="sm:col-span-4">
          <Notice tone="error">{error}</Notice>
        </div>
      ) : null}
      {!timingOnly ? <TextField className="sm:col-span-4" label="Step title" {...register("title")} error={e.title?.message} /> : null}
      <TextField label="Hands-on minutes" inputMode="numeric" {...register("active")} error={e.active?.message} />
      <TextField label="Wait after" inputMode="decimal" {...register("wait")} error={e.wait?.message} />
      <SelectField label="Wait unit" {...register("waitUnit")}>
        <option value="minutes">minutes</option>
        <option value="hours">hours</option>
        <option value="days">days</option>
      </SelectField>
      <TextField label="Crew needed" inputMode="numeric" {...register("crew")} error={e.crew?.message} />
      <TextField className="sm:col-span-4" label="Why the wait (glue cure, finish dry, acclimatise…)" {...register("waitReason")} error={e.waitReason?.message} />
      {!timingOnly ? (
        <>
          <div className="sm:col-span-4">
            <label className="block text-sm font-medium text-walnut-800" htmlFor={`notes-${initial?.id ?? "new"}`}>
              Method notes
            </label>
            <textarea id={`notes-${initial?.id ?? "new"}`} rows={2} className="mt-1 w-full rounded-plank border border-timber-300 bg-white px-2 py-1.5" {...register("notes")} />
          </div>
          <fieldset className="sm:col-span-2">
            <legend className="text-sm font-medium text-walnut-800">Cover on camera as</legend>
            <div className="mt-1 flex flex-wrap gap-x-3 gap-y-1">
              {COVERAGE_KINDS.map((k) => (
                <label key={k} className="flex items-center gap-1 text-sm">
                  <Checkbox value={k} {...register("coverageKinds")} />
                  {COVERAGE_LABELS[k]}
                </label>
              ))}
            </div>
          </fieldset>
          <fieldset className="sm:col-span-2">
            <legend className="text-sm font-medium text-walnut-800">Hazards in this step</legend>
            <div className="mt-1 flex flex-wrap gap-x-3 gap-y-1">
              {HAZARDS.map((h) => (
                <label key={h} className="flex items-center gap-1 text-sm">
                  <Checkbox value={h} {...register("hazards")} />
                  {CAUTIONS[h].title}
                </label>
              ))}
            </div>
          </fieldset>
          <fieldset className="sm:col-span-2">
            <legend className="text-sm font-medium text-walnut-800">Must wait for</legend>
            {others.length === 0 ? <p className="text-xs text-walnut-600">No other steps yet.</p> : null}
            <div className="mt-1 max-h-40 space-y-0.5 overflow-y-auto">
              {others.map((s) => (
                <label key={s.id} className="flex items-center gap-1 text-sm">
                  <Checkbox value={s.id} {...register("dependsOn")} />
                  <span className="num text-walnut-600">{s.position + 1}.</span> {s.title}
                </label>
              ))}
            </div>
            {e.dependsOn?.message ? <p className="text-sm text-fault-700">{e.dependsOn.message}</p> : null}
          </fieldset>
          <fieldset className="sm:col-span-2">
            <legend className="text-sm font-medium text-walnut-800">Tools used</legend>
            {tools.length === 0 ? <p className="text-xs text-walnut-600">The tool shelf is empty; add tools there first.</p> : null}
            <div className="mt-1 max-h-40 space-y-0.5 overflow-y-auto">
              {tools.map((t) => (
                <label key={t.id} className="flex items-center gap-1 text-sm">
                  <Checkbox value={t.id} {...register("toolIds")} />
                  {t.name}
                  {t.sponsored ? <span className="text-xs text-walnut-600">(from a sponsor)</span> : null}
                </label>
              ))}
            </div>
            {e.toolIds?.message ? <p className="text-sm text-fault-700">{e.toolIds.message}</p> : null}
          </fieldset>
        </>
      ) : null}
      <div className="flex gap-2 sm:col-span-4">
        <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
          {submitLabel}
        </Button>
        {onCancel ? (
          <Button type="button" variant="quiet" onClick={onCancel}>
            Cancel
          </Button>
        ) : null}
      </div>
    </form>
  );
}
