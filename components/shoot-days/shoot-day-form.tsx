"use client";
import Link from "next/link";
import { useState } from "react";
import { ApiError } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";
import { Button } from "@/components/ui/button";
import { CheckboxLabel } from "@/components/ui/checkbox";
import { Notice, SelectField, TextField } from "@/components/ui/field";
import { SHOOT_DAY_STATUSES, SHOOT_DAY_STATUS_LABELS, type DaysAwayDto, type ShootDayDto, type ShootDayStatus } from "@/lib/schemas/shoot";

const LABELS: Record<string, string> = {
  date: "Date",
  callTime: "Call",
  wrapTime: "Wrap",
  crew: "Crew",
  helpers: "Helpers",
  location: "Location",
  episodeId: "Episode",
};

interface Helper {
  name: string;
  duty: string;
  email: string;
}

/** Create or edit one shoot day; the channel's producer and owner see it, everyone else reads the calendar. */
export function ShootDayForm({
  channelId,
  day,
  members,
  episodes,
  away,
  defaultDate,
  onDone,
  onCancel,
}: {
  channelId: string;
  day: ShootDayDto | null;
  members: { userId: string; name: string }[];
  episodes: { id: string; title: string }[];
  away: DaysAwayDto[];
  defaultDate: string;
  onDone: (message: string | null) => void | Promise<void>;
  onCancel: () => void;
}) {
  const write = useWrite({ scope: `shoot-days:${channelId}` });
  const [f, setF] = useState({
    date: day?.date ?? defaultDate,
    callTime: day?.callTime ?? "09:00",
    wrapTime: day?.wrapTime ?? "17:00",
    episodeId: day?.episodeId ?? "",
    location: day?.location ?? "",
    status: (day?.status ?? "planned") as ShootDayStatus,
    equipmentNotes: day?.equipmentNotes ?? "",
    safetyNotes: day?.safetyNotes ?? "",
    weatherNote: day?.weatherNote ?? "",
    contacts: day?.contacts ?? "",
    notes: day?.notes ?? "",
  });
  const [crew, setCrew] = useState<Record<string, string>>(Object.fromEntries((day?.crew ?? []).map((c) => [c.userId, c.duty])));
  const [helpers, setHelpers] = useState<Helper[]>((day?.helpers ?? []).map((h) => ({ name: h.name, duty: h.duty, email: h.email ?? "" })));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const awayOn = new Set(away.filter((a) => a.date === f.date).map((a) => a.userId));

  async function submit() {
    const body = {
      ...f,
      episodeId: f.episodeId || null,
      crew: Object.entries(crew).map(([userId, duty]) => ({ userId, duty })),
      helpers: helpers.filter((h) => h.name.trim()).map((h) => ({ name: h.name, duty: h.duty, email: h.email.trim() || null })),
    };
    try {
      if (day) await write(`/api/shoot-days/${day.id}`, "PATCH", body);
      else await write(`/api/channels/${channelId}/shoot-days`, "POST", body);
      await onDone(day ? "Shoot day saved." : `Shoot day added on ${f.date}.`);
    } catch (e) {
      const fields = e instanceof ApiError ? (e.fields ?? {}) : {};
      setErrors(fields);
      const named = Object.entries(fields).map(([k, v]) => `${LABELS[k.split(".")[0]!] ?? k}: ${v.join("; ")}`);
      setMessage(named.length ? `Not saved. ${named.join(". ")}.` : (e as Error).message);
    }
  }

  return (
    <form
      aria-label={day ? "Edit shoot day" : "New shoot day"}
      className="grid gap-3 rounded-plank border-2 border-walnut-700 bg-white p-4 sm:grid-cols-4"
      onSubmit={(e) => {
        e.preventDefault();
        void submit();
      }}
    >
      <h2 className="font-bold sm:col-span-4">{day ? `Shoot day, ${day.date}` : "New shoot day"}</h2>
      {message ? (
        <div className="sm:col-span-4">
          <Notice tone="error">{message}</Notice>
        </div>
      ) : null}
      <TextField label="Date" type="date" value={f.date} onChange={(e) => setF({ ...f, date: e.target.value })} error={errors.date?.[0]} required />
      <TextField label="Call" type="time" value={f.callTime} onChange={(e) => setF({ ...f, callTime: e.target.value })} error={errors.callTime?.[0]} required />
      <TextField label="Wrap" type="time" value={f.wrapTime} onChange={(e) => setF({ ...f, wrapTime: e.target.value })} error={errors.wrapTime?.[0]} required />
      <SelectField label="Status" value={f.status} onChange={(e) => setF({ ...f, status: e.target.value as ShootDayStatus })}>
        {SHOOT_DAY_STATUSES.map((s) => (
          <option key={s} value={s}>
            {SHOOT_DAY_STATUS_LABELS[s]}
          </option>
        ))}
      </SelectField>
      <SelectField label="Episode" className="sm:col-span-2" value={f.episodeId} onChange={(e) => setF({ ...f, episodeId: e.target.value })} error={errors.episodeId?.[0]}>
        <option value="">Not tied to one episode</option>
        {episodes.map((e) => (
          <option key={e.id} value={e.id}>
            {e.title}
          </option>
        ))}
      </SelectField>
      <TextField label="Location" className="sm:col-span-2" value={f.location} onChange={(e) => setF({ ...f, location: e.target.value })} />
      <fieldset className="sm:col-span-4">
        <legend className="text-sm font-medium text-walnut-800">Crew</legend>
        <div className="mt-1 flex flex-wrap gap-x-4 gap-y-1">
          {members.map((m) => (
            <span key={m.userId} className="inline-flex items-center gap-1">
              <CheckboxLabel
                label={`${m.name}${awayOn.has(m.userId) ? " (away that day)" : ""}`}
                checked={m.userId in crew}
                onChange={(e) => {
                  const next = { ...crew };
                  if (e.target.checked) next[m.userId] = "";
                  else delete next[m.userId];
                  setCrew(next);
                }}
              />
              {m.userId in crew ? (
                <input aria-label={`${m.name}'s duty`} placeholder="duty" className="w-28 rounded-plank border border-timber-300 px-1 py-0.5 text-sm" value={crew[m.userId]} onChange={(e) => setCrew({ ...crew, [m.userId]: e.target.value })} />
              ) : null}
            </span>
          ))}
        </div>
        {errors.crew ? <p className="text-sm text-fault-700">{errors.crew.join("; ")}</p> : null}
      </fieldset>
      <fieldset className="space-y-1 sm:col-span-4">
        <legend className="text-sm font-medium text-walnut-800">Helpers from outside the channel</legend>
        {helpers.map((h, i) => (
          <div key={i} className="flex flex-wrap gap-2">
            <input aria-label={`Helper ${i + 1} name`} placeholder="Name" className="rounded-plank border border-timber-300 px-2 py-1 text-sm" value={h.name} onChange={(e) => setHelpers(helpers.map((x, j) => (j === i ? { ...x, name: e.target.value } : x)))} />
            <input aria-label={`Helper ${i + 1} duty`} placeholder="Duty" className="rounded-plank border border-timber-300 px-2 py-1 text-sm" value={h.duty} onChange={(e) => setHelpers(helpers.map((x, j) => (j === i ? { ...x, duty: e.target.value } : x)))} />
            <input aria-label={`Helper ${i + 1} e-mail`} placeholder="E-mail for the call sheet" type="email" className="rounded-plank border border-timber-300 px-2 py-1 text-sm" value={h.email} onChange={(e) => setHelpers(helpers.map((x, j) => (j === i ? { ...x, email: e.target.value } : x)))} />
            <Button type="button" variant="quiet" onClick={() => setHelpers(helpers.filter((_, j) => j !== i))}>
              Remove
            </Button>
          </div>
        ))}
        <Button type="button" variant="quiet" onClick={() => setHelpers([...helpers, { name: "", duty: "", email: "" }])}>
          Add a helper
        </Button>
      </fieldset>
      <TextField label="Equipment" className="sm:col-span-2" value={f.equipmentNotes} onChange={(e) => setF({ ...f, equipmentNotes: e.target.value })} />
      <TextField label="Safety notes" className="sm:col-span-2" value={f.safetyNotes} onChange={(e) => setF({ ...f, safetyNotes: e.target.value })} />
      <TextField label="Weather note" className="sm:col-span-2" value={f.weatherNote} onChange={(e) => setF({ ...f, weatherNote: e.target.value })} />
      <TextField label="Contacts" className="sm:col-span-2" value={f.contacts} onChange={(e) => setF({ ...f, contacts: e.target.value })} />
      <div className="flex flex-wrap gap-2 sm:col-span-4">
        <Button type="submit" variant="primary">
          {day ? "Save shoot day" : "Add shoot day"}
        </Button>
        <Button type="button" onClick={onCancel}>Close</Button>
        {day ? (
          <>
            <Link className="inline-flex items-center rounded-plank border border-timber-300 px-3 py-1.5 text-sm hover:bg-timber-100" href={`/c/${channelId}/shoot-days/${day.id}/call-sheet`}>
              Call sheet
            </Link>
            <a className="inline-flex items-center rounded-plank border border-timber-300 px-3 py-1.5 text-sm hover:bg-timber-100" href={`/api/shoot-days/${day.id}/ics`}>
              Download .ics
            </a>
            <Button
              type="button"
              variant="danger"
              onClick={async () => {
                await write(`/api/shoot-days/${day.id}`, "DELETE");
                await onDone("Shoot day deleted.");
              }}
            >
              Delete
            </Button>
          </>
        ) : null}
      </div>
    </form>
  );
}

/** What roles that do not plan see: the day as text. */
export function ShootDayDetails({ channelId, day, episodes, onClose }: { channelId: string; day: ShootDayDto; episodes: { id: string; title: string }[]; onClose: () => void }) {
  return (
    <section aria-label="Shoot day" className="rounded-plank border-2 border-walnut-700 bg-white p-4 text-sm">
      <h2 className="font-bold">
        Shoot day, {day.date} · <span className="num">{day.callTime}–{day.wrapTime}</span> · {SHOOT_DAY_STATUS_LABELS[day.status]}
      </h2>
      <dl className="mt-2 grid gap-x-6 gap-y-1 sm:grid-cols-[max-content_1fr]">
        <dt className="text-walnut-700">Episode</dt>
        <dd>{episodes.find((e) => e.id === day.episodeId)?.title ?? "—"}</dd>
        <dt className="text-walnut-700">Location</dt>
        <dd>{day.location || "—"}</dd>
        <dt className="text-walnut-700">Crew</dt>
        <dd>{[...day.crew.map((c) => `${c.name}${c.duty ? ` (${c.duty})` : ""}${c.away ? ", away that day" : ""}`), ...day.helpers.map((h) => `${h.name} (helper${h.duty ? `, ${h.duty}` : ""})`)].join("; ") || "—"}</dd>
        {day.equipmentNotes ? (
          <>
            <dt className="text-walnut-700">Equipment</dt>
            <dd>{day.equipmentNotes}</dd>
          </>
        ) : null}
        {day.safetyNotes ? (
          <>
            <dt className="text-walnut-700">Safety</dt>
            <dd>{day.safetyNotes}</dd>
          </>
        ) : null}
      </dl>
      <div className="mt-3 flex gap-2">
        <Link className="inline-flex items-center rounded-plank border border-timber-300 px-3 py-1.5 hover:bg-timber-100" href={`/c/${channelId}/shoot-days/${day.id}/call-sheet`}>
          Call sheet
        </Link>
        <a className="inline-flex items-center rounded-plank border border-timber-300 px-3 py-1.5 hover:bg-timber-100" href={`/api/shoot-days/${day.id}/ics`}>
          Download .ics
        </a>
        <Button type="button" onClick={onClose}>
          Close
        </Button>
      </div>
    </section>
  );
}
