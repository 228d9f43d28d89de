"use client";
/**
 * The producer's calendar of shoot days: a month grid (drag a day to another
 * date, or edit its date in the form), a week of hours, and a list. Everyone
 * marks their own days away here.
 */
import Link from "next/link";
import { useMemo, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { DndContext, KeyboardSensor, PointerSensor, useDraggable, useDroppable, useSensor, useSensors, type DragEndEvent } from "@dnd-kit/core";
import { addDays, addMonths, addWeeks, eachDayOfInterval, endOfMonth, endOfWeek, format, isSameMonth, parseISO, startOfMonth, startOfWeek } from "date-fns";
import { fetchJson } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";
import { Button } from "@/components/ui/button";
import { Notice, TextField } from "@/components/ui/field";
import { SHOOT_DAY_STATUS_LABELS, type DaysAwayDto, type ShootDayDto } from "@/lib/schemas/shoot";
import { ShootDayDetails, ShootDayForm } from "./shoot-day-form";

type View = "month" | "week" | "list";
const iso = (d: Date) => format(d, "yyyy-MM-dd");
const dayLabel = (date: string) => format(parseISO(date), "EEE d MMM");

interface Props {
  channelId: string;
  timeZone: string;
  canPlan: boolean;
  isOwner: boolean;
  me: string;
  members: { userId: string; name: string }[];
  episodes: { id: string; title: string }[];
  today: string;
}

function DayChip({ day, canPlan, episodes, onOpen }: { day: ShootDayDto; canPlan: boolean; episodes: Props["episodes"]; onOpen: () => void }) {
  const { attributes, listeners, setNodeRef, transform, isDragging } = useDraggable({ id: day.id, disabled: !canPlan });
  const cancelled = day.status === "cancelled";
  const ep = episodes.find((e) => e.id === day.episodeId)?.title;
  return (
    <div
      ref={setNodeRef}
      style={transform ? { transform: `translate(${transform.x}px, ${transform.y}px)` } : undefined}
      className={`flex items-stretch rounded-plank border text-xs ${cancelled ? "border-walnut-500 bg-timber-100 text-walnut-600 line-through" : "border-chalk-700 bg-chalk-100 text-walnut-900"} ${isDragging ? "z-10 shadow-lg" : ""}`}
      data-testid="shoot-day-chip"
    >
      {canPlan ? (
        // On a phone the cell is too narrow for two targets: the date is changed in the form there.
        <button type="button" className="hidden cursor-grab px-1 text-walnut-600 sm:block" aria-label={`Drag the shoot day on ${dayLabel(day.date)} to another date`} {...attributes} {...listeners}>
          ⠿
        </button>
      ) : null}
      <button type="button" onClick={onOpen} className="min-h-6 min-w-6 flex-1 px-1 py-0.5 text-left">
        <span className="num block">
          {day.callTime}–{day.wrapTime}
        </span>
        <span className="block truncate">{ep ?? (day.location || "Shoot day")}</span>
      </button>
    </div>
  );
}

function DateCell({ date, inMonth, children, away }: { date: string; inMonth: boolean; children: React.ReactNode; away: DaysAwayDto[] }) {
  const { setNodeRef, isOver } = useDroppable({ id: `date:${date}` });
  return (
    <div ref={setNodeRef} className={`min-h-24 border-b border-r border-timber-200 p-1 ${inMonth ? "bg-white" : "bg-timber-50 text-walnut-500"} ${isOver ? "ring-2 ring-inset ring-chalk-600" : ""}`} data-date={date}>
      <p className="num text-xs">{format(parseISO(date), "d")}</p>
      <div className="space-y-1">{children}</div>
      {away.length ? <p className="mt-1 text-[11px] text-heed-800">Away: {away.map((a) => a.name.split(" ")[0]).join(", ")}</p> : null}
    </div>
  );
}

export function ShootDaysView(p: Props) {
  const qc = useQueryClient();
  const [view, setView] = useState<View>("month");
  const [cursor, setCursor] = useState(parseISO(p.today));
  const [editing, setEditing] = useState<ShootDayDto | "new" | null>(null);
  const [msg, setMsg] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [feedUrl, setFeedUrl] = useState<string | null>(null);
  const [awayDate, setAwayDate] = useState("");
  const write = useWrite({ scope: `shoot-days:${p.channelId}` });

  const range = useMemo(() => {
    if (view === "week") return { from: startOfWeek(cursor, { weekStartsOn: 1 }), to: endOfWeek(cursor, { weekStartsOn: 1 }) };
    if (view === "month") return { from: startOfWeek(startOfMonth(cursor), { weekStartsOn: 1 }), to: endOfWeek(endOfMonth(cursor), { weekStartsOn: 1 }) };
    return { from: addDays(cursor, -60), to: addDays(cursor, 365) };
  }, [view, cursor]);
  const key = ["shoot-days", p.channelId, iso(range.from), iso(range.to)];
  const days = useQuery({ queryKey: key, queryFn: () => fetchJson<{ shootDays: ShootDayDto[] }>(`/api/channels/${p.channelId}/shoot-days?from=${iso(range.from)}&to=${iso(range.to)}`) });
  const away = useQuery({ queryKey: ["days-away", p.channelId], queryFn: () => fetchJson<{ daysAway: DaysAwayDto[] }>(`/api/channels/${p.channelId}/days-away`) });
  const refresh = () => Promise.all([qc.invalidateQueries({ queryKey: ["shoot-days", p.channelId] }), qc.invalidateQueries({ queryKey: ["days-away", p.channelId] })]);
  const list = days.data?.shootDays ?? [];
  const awayList = away.data?.daysAway ?? [];
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }), useSensor(KeyboardSensor));

  async function moveDay(id: string, date: string) {
    const d = list.find((x) => x.id === id);
    if (!d || d.date === date) return;
    try {
      await write(`/api/shoot-days/${id}`, "PATCH", { date });
      setMsg({ tone: "ok", text: `Moved the shoot day from ${dayLabel(d.date)} to ${dayLabel(date)}. Plan the episode again to see what moves with it.` });
    } catch (e) {
      setMsg({ tone: "error", text: (e as Error).message });
    }
    await refresh();
  }
  const onDragEnd = (e: DragEndEvent) => {
    const over = e.over?.id ? String(e.over.id) : "";
    if (over.startsWith("date:")) void moveDay(String(e.active.id), over.slice(5));
  };

  const mine = awayList.filter((a) => a.userId === p.me);
  const step = (n: number) => setCursor((c) => (view === "week" ? addWeeks(c, n) : addMonths(c, n)));
  const title = view === "week" ? `Week of ${format(range.from, "d MMM yyyy")}` : view === "month" ? format(cursor, "MMMM yyyy") : "All shoot days";

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2">
        <div role="radiogroup" aria-label="Show" className="inline-flex rounded-plank border border-timber-300 bg-white p-0.5">
          {(["month", "week", "list"] as View[]).map((v) => (
            <button key={v} type="button" role="radio" aria-checked={view === v} onClick={() => setView(v)} className={`rounded-plank px-3 py-1 text-sm ${view === v ? "bg-walnut-900 text-timber-50" : "text-walnut-800 hover:bg-timber-100"}`}>
              {v === "month" ? "Month" : v === "week" ? "Week" : "List"}
            </button>
          ))}
        </div>
        {view !== "list" ? (
          <>
            <Button variant="quiet" onClick={() => step(-1)} aria-label="Earlier">
              ←
            </Button>
            <h2 className="min-w-44 text-center font-bold" aria-live="polite">
              {title}
            </h2>
            <Button variant="quiet" onClick={() => step(1)} aria-label="Later">
              →
            </Button>
            <Button variant="quiet" onClick={() => setCursor(parseISO(p.today))}>
              Today
            </Button>
          </>
        ) : (
          <h2 className="font-bold">{title}</h2>
        )}
        <span className="text-xs text-walnut-600">Times in {p.timeZone}</span>
        {p.canPlan ? (
          <Button variant="primary" className="ml-auto" onClick={() => setEditing("new")}>
            New shoot day
          </Button>
        ) : null}
      </div>
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      {editing && editing !== "new" && !p.canPlan ? <ShootDayDetails channelId={p.channelId} day={editing} episodes={p.episodes} onClose={() => setEditing(null)} /> : null}
      {editing && p.canPlan ? (
        <ShootDayForm
          channelId={p.channelId}
          day={editing === "new" ? null : editing}
          members={p.members}
          episodes={p.episodes}
          away={awayList}
          defaultDate={iso(cursor)}
          onDone={async (text) => {
            setEditing(null);
            if (text) setMsg({ tone: "ok", text });
            await refresh();
          }}
          onCancel={() => setEditing(null)}
        />
      ) : null}

      {view === "month" ? (
        <DndContext sensors={sensors} onDragEnd={onDragEnd}>
          <div className="grid grid-cols-7 border-l border-t border-timber-200 text-sm" data-testid="month-view">
            {["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"].map((d) => (
              <div key={d} className="border-b border-r border-timber-200 bg-timber-100 px-1 py-0.5 text-xs font-bold">
                {d}
              </div>
            ))}
            {eachDayOfInterval({ start: range.from, end: range.to }).map((d) => {
              const date = iso(d);
              return (
                <DateCell key={date} date={date} inMonth={isSameMonth(d, cursor)} away={awayList.filter((a) => a.date === date)}>
                  {list
                    .filter((s) => s.date === date)
                    .map((s) => (
                      <DayChip key={s.id} day={s} canPlan={p.canPlan} episodes={p.episodes} onOpen={() => setEditing(s)} />
                    ))}
                </DateCell>
              );
            })}
          </div>
        </DndContext>
      ) : view === "week" ? (
        <WeekView from={range.from} days={list} away={awayList} episodes={p.episodes} onOpen={(d) => setEditing(d)} />
      ) : (
        <ListView days={list} episodes={p.episodes} channelId={p.channelId} onOpen={(d) => setEditing(d)} />
      )}

      <section className="grid gap-4 md:grid-cols-2">
        <div className="rounded-plank border border-timber-300 bg-white p-3" aria-labelledby="away-h">
          <h2 id="away-h" className="font-bold">
            My days away
          </h2>
          <p className="text-sm text-walnut-700">Dates you cannot work. Plans count without you on those days and say so.</p>
          <form
            className="mt-2 flex items-end gap-2"
            onSubmit={async (e) => {
              e.preventDefault();
              try {
                await write(`/api/channels/${p.channelId}/days-away`, "PUT", { add: [awayDate] });
                setAwayDate("");
                await refresh();
              } catch (err) {
                setMsg({ tone: "error", text: (err as Error).message });
              }
            }}
          >
            <TextField label="Date" type="date" value={awayDate} onChange={(e) => setAwayDate(e.target.value)} required />
            <Button type="submit">Mark away</Button>
          </form>
          <ul className="mt-2 space-y-1 text-sm" data-testid="my-days-away">
            {mine.map((a) => (
              <li key={a.date} className="flex items-center gap-2">
                <span className="num">{dayLabel(a.date)}</span>
                <Button
                  variant="quiet"
                  onClick={async () => {
                    await write(`/api/channels/${p.channelId}/days-away`, "PUT", { remove: [a.date] });
                    await refresh();
                  }}
                >
                  Take off
                </Button>
              </li>
            ))}
            {mine.length ? null : <li className="text-walnut-600">None marked.</li>}
          </ul>
        </div>
        <div className="rounded-plank border border-timber-300 bg-white p-3">
          <h2 className="font-bold">Calendar subscription</h2>
          <p className="text-sm text-walnut-700">A private link any calendar app can subscribe to; it shows every shoot day and follows changes.</p>
          {p.isOwner ? (
            <>
              <Button
                className="mt-2"
                onClick={async () => {
                  const r = await write<{ url: string }>(`/api/channels/${p.channelId}/calendar-feed`, "POST");
                  setFeedUrl(r.url);
                }}
              >
                Make a new calendar link
              </Button>
              {feedUrl ? (
                <div className="mt-2 text-sm">
                  <p>Copy it now; it is shown once. Making another one stops this one.</p>
                  <input readOnly aria-label="Calendar link" className="num mt-1 w-full rounded-plank border border-timber-300 px-2 py-1" value={feedUrl} onFocus={(e) => e.currentTarget.select()} />
                </div>
              ) : null}
            </>
          ) : (
            <p className="mt-2 text-sm text-walnut-700">Ask the owner for the link.</p>
          )}
        </div>
      </section>
    </div>
  );
}

function WeekView({ from, days, away, episodes, onOpen }: { from: Date; days: ShootDayDto[]; away: DaysAwayDto[]; episodes: Props["episodes"]; onOpen: (d: ShootDayDto) => void }) {
  const startHour = 6;
  const endHour = 22;
  const hourPx = 28;
  const mins = (t: string) => Number(t.slice(0, 2)) * 60 + Number(t.slice(3));
  return (
    <div className="overflow-x-auto" data-testid="week-view">
      <div className="grid min-w-[720px] grid-cols-[3rem_repeat(7,1fr)] border-l border-t border-timber-200 text-xs">
        <div className="border-b border-r border-timber-200 bg-timber-100" />
        {Array.from({ length: 7 }, (_, i) => addDays(from, i)).map((d) => (
          <div key={iso(d)} className="border-b border-r border-timber-200 bg-timber-100 px-1 py-0.5 font-bold">
            {format(d, "EEE d MMM")}
            {away.filter((a) => a.date === iso(d)).length ? <span className="block font-normal text-heed-800">Away: {away.filter((a) => a.date === iso(d)).map((a) => a.name.split(" ")[0]).join(", ")}</span> : null}
          </div>
        ))}
        <div className="relative border-r border-timber-200" style={{ height: (endHour - startHour) * hourPx }}>
          {Array.from({ length: endHour - startHour }, (_, h) => (
            <span key={h} className="num absolute right-1 text-walnut-600" style={{ top: h * hourPx }}>
              {String(startHour + h).padStart(2, "0")}:00
            </span>
          ))}
        </div>
        {Array.from({ length: 7 }, (_, i) => iso(addDays(from, i))).map((date) => (
          <div key={date} className="relative border-r border-timber-200" style={{ height: (endHour - startHour) * hourPx }}>
            {Array.from({ length: endHour - startHour }, (_, h) => (
              <div key={h} className="absolute inset-x-0 border-t border-timber-100" style={{ top: h * hourPx }} />
            ))}
            {days
              .filter((d) => d.date === date)
              .map((d) => {
                const top = ((Math.max(mins(d.callTime), startHour * 60) - startHour * 60) / 60) * hourPx;
                const height = Math.max(hourPx, ((Math.min(mins(d.wrapTime), endHour * 60) - Math.max(mins(d.callTime), startHour * 60)) / 60) * hourPx);
                return (
                  <button
                    key={d.id}
                    type="button"
                    onClick={() => onOpen(d)}
                    className={`absolute inset-x-1 overflow-hidden rounded-plank border p-1 text-left ${d.status === "cancelled" ? "border-walnut-500 bg-timber-100 line-through" : "border-chalk-700 bg-chalk-100"}`}
                    style={{ top, height }}
                  >
                    <span className="num block font-bold">
                      {d.callTime}–{d.wrapTime}
                    </span>
                    <span className="block">{episodes.find((e) => e.id === d.episodeId)?.title ?? "Shoot day"}</span>
                    {d.location ? <span className="block text-walnut-700">{d.location}</span> : null}
                    <span className="block text-walnut-700">{d.crew.map((c) => c.name.split(" ")[0] + (c.away ? " (away)" : "")).join(", ")}</span>
                  </button>
                );
              })}
          </div>
        ))}
      </div>
    </div>
  );
}

function ListView({ days, episodes, channelId, onOpen }: { days: ShootDayDto[]; episodes: Props["episodes"]; channelId: string; onOpen: (d: ShootDayDto) => void }) {
  if (!days.length) return <p className="rounded-plank border border-dashed border-timber-400 p-4 text-sm text-walnut-700">No shoot days yet.</p>;
  return (
    <table className="w-full border-collapse text-sm" data-testid="list-view">
      <thead>
        <tr className="border-b border-timber-300 text-left">
          <th className="px-2 py-1">Date</th>
          <th className="px-2 py-1">Hours</th>
          <th className="px-2 py-1">Episode</th>
          <th className="px-2 py-1">Location</th>
          <th className="px-2 py-1">Crew</th>
          <th className="px-2 py-1">Status</th>
          <th className="px-2 py-1">Call sheet</th>
        </tr>
      </thead>
      <tbody>
        {days.map((d) => (
          <tr key={d.id} className="border-b border-timber-200 align-top">
            <td className="px-2 py-1">
              <button type="button" className="underline" onClick={() => onOpen(d)}>
                {dayLabel(d.date)}
              </button>
            </td>
            <td className="num px-2 py-1">
              {d.callTime}–{d.wrapTime}
            </td>
            <td className="px-2 py-1">{episodes.find((e) => e.id === d.episodeId)?.title ?? "—"}</td>
            <td className="px-2 py-1">{d.location || "—"}</td>
            <td className="px-2 py-1">{[...d.crew.map((c) => c.name + (c.away ? " (away)" : "")), ...d.helpers.map((h) => `${h.name} (helper)`)].join(", ") || "—"}</td>
            <td className="px-2 py-1">{SHOOT_DAY_STATUS_LABELS[d.status]}</td>
            <td className="px-2 py-1">
              <Link className="underline" href={`/c/${channelId}/shoot-days/${d.id}/call-sheet`}>
                {d.callSheetSentAt ? "Sent · open" : "Open"}
              </Link>
            </td>
          </tr>
        ))}
      </tbody>
    </table>
  );
}
