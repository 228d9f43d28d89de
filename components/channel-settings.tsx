"use client";
import type { ChannelSettingsDto } from "@/lib/schemas/account";
import { useState } from "react";
import { useRouter } from "next/navigation";
import { TextField, SelectField, Notice } from "@/components/ui/field";
import { Button } from "@/components/ui/button";
import { ApiError } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";

const LABELS: Record<string, string> = {
  name: "Channel name",
  units: "Cut-list units",
  currency: "Currency",
  brollGapMs: "B-roll gap",
  toCameraMaxMs: "To camera without a cutaway",
  timeZone: "Workshop time zone",
};

type Settings = Omit<ChannelSettingsDto, "id">;

export function ChannelSettings({ channelId, initial, canEdit }: { channelId: string; initial: Settings; canEdit: boolean }) {
  const write = useWrite({ scope: `channel:${channelId}` });
  const router = useRouter();
  const [f, setF] = useState({ ...initial, broll: String(initial.brollGapMs / 1000), toCamera: String(initial.toCameraMaxMs / 1000) });
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [msg, setMsg] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  if (!canEdit)
    return (
      <div className="rounded-plank border border-timber-300 bg-white p-4 text-sm" data-testid="settings-read-only">
        <dl className="grid gap-x-6 gap-y-2 sm:grid-cols-[max-content_1fr]">
          <dt className="text-walnut-700">Channel name</dt>
          <dd>{initial.name}</dd>
          <dt className="text-walnut-700">Cut-list units</dt>
          <dd>{initial.units === "metric" ? "Millimetres (metric)" : "Inches (imperial)"}</dd>
          <dt className="text-walnut-700">Currency</dt>
          <dd className="num">{initial.currency}</dd>
          <dt className="text-walnut-700">B-roll gap</dt>
          <dd>voice-over bare for more than <span className="num">{initial.brollGapMs / 1000} s</span></dd>
          <dt className="text-walnut-700">To camera without a cutaway</dt>
          <dd>for more than <span className="num">{initial.toCameraMaxMs / 1000} s</span></dd>
          <dt className="text-walnut-700">Workshop time zone</dt>
          <dd>{initial.timeZone}</dd>
        </dl>
        <p className="mt-3 text-walnut-700">Only the owner changes channel settings.</p>
      </div>
    );
  return (
    <form
      aria-label="Channel settings"
      className="grid gap-3 rounded-plank border border-timber-300 bg-white p-4 sm:grid-cols-2"
      onSubmit={async (e) => {
        e.preventDefault();
        const body = { name: f.name, units: f.units, currency: f.currency.toUpperCase(), brollGapMs: Math.round(Number(f.broll) * 1000), toCameraMaxMs: Math.round(Number(f.toCamera) * 1000), timeZone: f.timeZone.trim() };
        try {
          await write(`/api/channels/${channelId}`, "PATCH", body);
        } catch (err) {
          const fields = err instanceof ApiError ? (err.fields ?? {}) : {};
          setErrors(fields);
          // Name the fields by their labels, as the form shows them, never by the API's field names.
          const named = Object.entries(fields).map(([k, v]) => `${LABELS[k] ?? "A field"}: ${v.join("; ")}`);
          return setMsg({ tone: "error", text: named.length ? `Not saved. ${named.join(". ")}.` : (err as Error).message });
        }
        setErrors({});
        setMsg({ tone: "ok", text: "Channel settings saved." });
        router.refresh();
      }}
    >
      {msg ? (
        <div className="sm:col-span-2">
          <Notice tone={msg.tone}>{msg.text}</Notice>
        </div>
      ) : null}
      <TextField label="Channel name" disabled={!canEdit} value={f.name} onChange={(e) => setF({ ...f, name: e.target.value })} error={errors.name?.[0]} />
      <SelectField label="Cut-list units" disabled={!canEdit} value={f.units} onChange={(e) => setF({ ...f, units: e.target.value as Settings["units"] })}>
        <option value="imperial">Inches (imperial)</option>
        <option value="metric">Millimetres (metric)</option>
      </SelectField>
      <TextField label="Currency (ISO code)" disabled={!canEdit} value={f.currency} onChange={(e) => setF({ ...f, currency: e.target.value })} error={errors.currency?.[0]} />
      <TextField label="Workshop time zone" hint="Shoot-day hours and calendars use it, e.g. Europe/Dublin." disabled={!canEdit} value={f.timeZone} onChange={(e) => setF({ ...f, timeZone: e.target.value })} error={errors.timeZone?.[0]} />
      <TextField
        label="B-roll gap: voice-over bare for more than (seconds)"
        hint="Common practice is about 2 s."
        inputMode="decimal"
        disabled={!canEdit}
        value={f.broll}
        onChange={(e) => setF({ ...f, broll: e.target.value })}
        error={errors.brollGapMs?.[0]}
      />
      <TextField
        label="To camera without a cutaway for more than (seconds)"
        hint="20 s by default."
        inputMode="decimal"
        disabled={!canEdit}
        value={f.toCamera}
        onChange={(e) => setF({ ...f, toCamera: e.target.value })}
        error={errors.toCameraMaxMs?.[0]}
      />
      {canEdit ? (
        <div>
          <Button type="submit" variant="primary">
            Save settings
          </Button>
        </div>
      ) : (
        <p className="text-sm text-walnut-700 sm:col-span-2">Only the owner changes channel settings.</p>
      )}
    </form>
  );
}
