"use client";
import { useForm, type Resolver } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { useState } from "react";
import { episodeCreateSchema, episodeUpdateSchema, minutesTextToSeconds, secondsToMinutesText, type EpisodeDto } from "@/lib/schemas/episode";
import { FRAME_RATE_IDS, allowsDropFrame, type FrameRateId } from "@/lib/frame-rate";
import { STAGES, STAGE_INFO } from "@/lib/stages";
import { TextField, SelectField, Notice } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { Checkbox } from "@/components/ui/checkbox";

/** What the inputs hold. */
interface Fields {
  title: string;
  summary: string;
  targetText: string;
  publishDate: string;
  frameRate: FrameRateId;
  dropFrame: boolean;
  stage?: (typeof STAGES)[number];
}

/** What the server receives: the zod schema's output. */
interface Values {
  title: string;
  summary: string;
  targetRuntimeSeconds: number | null;
  publishDate: string | null;
  frameRate: FrameRateId;
  dropFrame: boolean;
  stage?: (typeof STAGES)[number];
}

type ServerResult = { ok: true; episode: EpisodeDto } | { ok: false; message: string; fields?: Record<string, string[]> };

export function EpisodeForm({
  mode,
  initial,
  onSubmit,
  onCancel,
}: {
  mode: "create" | "edit";
  initial?: EpisodeDto;
  onSubmit: (values: Values) => Promise<ServerResult>;
  onCancel?: () => void;
}) {
  const [serverError, setServerError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const schema = mode === "create" ? episodeCreateSchema : episodeUpdateSchema;
  // The same zod schema the route handler parses with, after mapping input text to its types.
  const zod = zodResolver(schema as never) as unknown as Resolver<Values, unknown, Values>;
  const resolver: Resolver<Fields, unknown, Values> = async (fields, ctx, opts) => {
    const { targetText, ...rest } = fields;
    const mapped: Values = { ...rest, targetRuntimeSeconds: minutesTextToSeconds(targetText), publishDate: fields.publishDate || null };
    const r = await zod(mapped, ctx, opts as never);
    const errors = { ...r.errors } as Record<string, unknown>;
    if (errors.targetRuntimeSeconds) {
      errors.targetText = { type: "validate", message: "Enter minutes, e.g. 14 or 14:30 (at least 10 seconds, at most 6 hours)" };
      delete errors.targetRuntimeSeconds;
    }
    return Object.keys(errors).length ? { values: {}, errors: errors as never } : { values: r.values as Values, errors: {} };
  };
  const { register, handleSubmit, formState, watch, setError, reset } = useForm<Fields, unknown, Values>({
    resolver,
    defaultValues: {
      title: initial?.title ?? "",
      summary: initial?.summary ?? "",
      targetText: secondsToMinutesText(initial?.targetRuntimeSeconds ?? null),
      publishDate: initial?.publishDate ?? "",
      frameRate: initial?.frameRate ?? "29.97",
      dropFrame: initial?.dropFrame ?? (mode === "create"),
      ...(mode === "create" ? { stage: "idea" as const } : {}),
    },
  });
  const rate = watch("frameRate");
  const e = formState.errors;

  const submit = handleSubmit(async (values) => {
    setServerError(null);
    setSaved(false);
    const r = await onSubmit(values);
    if (!r.ok) {
      for (const [field, msgs] of Object.entries(r.fields ?? {})) {
        const name = (field === "targetRuntimeSeconds" ? "targetText" : field) as keyof Fields;
        if (["title", "summary", "targetText", "publishDate", "frameRate", "dropFrame", "stage"].includes(name)) setError(name, { message: msgs[0] });
      }
      setServerError(r.message);
      return;
    }
    setSaved(true);
    if (mode === "create") reset();
  });

  return (
    <form onSubmit={submit} noValidate className="grid gap-3 sm:grid-cols-2" aria-label={mode === "create" ? "New episode" : "Edit episode"}>
      {serverError ? (
        <div className="sm:col-span-2">
          <Notice tone="error">{serverError}</Notice>
        </div>
      ) : null}
      {saved && mode === "edit" ? (
        <div className="sm:col-span-2">
          <Notice tone="ok">Saved.</Notice>
        </div>
      ) : null}
      <TextField className="sm:col-span-2" label="Title" {...register("title")} error={e.title?.message} />
      <div className="sm:col-span-2">
        <label className="block text-sm font-medium text-walnut-800" htmlFor="episode-summary">
          Working summary
        </label>
        <textarea id="episode-summary" rows={3} className="mt-1 w-full rounded-plank border border-timber-300 bg-white px-2 py-1.5" {...register("summary")} />
        {e.summary?.message ? <p className="text-sm text-fault-700">{e.summary.message}</p> : null}
      </div>
      <TextField
        label="Target runtime (minutes or m:ss)"
        inputMode="numeric"
        placeholder="14:30"
        {...register("targetText")}
        error={e.targetText?.message}
      />
      <TextField
        label="Planned publish date"
        type="date"
        {...register("publishDate")}
        error={e.publishDate?.message}
      />
      <SelectField label="Frame rate (fps)" {...register("frameRate")} error={e.frameRate?.message}>
        {FRAME_RATE_IDS.map((r) => (
          <option key={r} value={r}>
            {r}
          </option>
        ))}
      </SelectField>
      <div className="flex items-end gap-2 pb-2">
        <Checkbox id="episode-drop-frame" {...register("dropFrame")} />
        <label htmlFor="episode-drop-frame" className="text-sm">
          Drop-frame timecode {allowsDropFrame(rate) ? "" : "(only at 29.97 and 59.94)"}
        </label>
        {e.dropFrame?.message ? <p className="text-sm text-fault-700">{e.dropFrame.message}</p> : null}
      </div>
      {mode === "create" ? (
        <SelectField label="Start in stage" {...register("stage")}>
          {STAGES.map((s) => (
            <option key={s} value={s}>
              {STAGE_INFO[s].step}. {STAGE_INFO[s].label}
            </option>
          ))}
        </SelectField>
      ) : null}
      <div className="flex items-end gap-2 sm:col-span-2">
        <Button type="submit" variant="primary" disabled={formState.isSubmitting}>
          {mode === "create" ? "Add episode" : "Save changes"}
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
