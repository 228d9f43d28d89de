"use client";
/**
 * The episode's shoot schedule: steps on clock times across shoot days and
 * off-camera days, what does not fit and why, the earliest extra day that
 * would help, and what moved when the plan was made again.
 */
import { useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { fetchJson } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import { CheckboxLabel } from "@/components/ui/checkbox";
import type { ScheduleDto, ShootDayDto } from "@/lib/schemas/shoot";

export function ScheduleView({ episodeId, channelId, canPlan }: { episodeId: string; channelId: string; canPlan: boolean }) {
  const qc = useQueryClient();
  const key = ["schedule", episodeId];
  const schedule = useQuery({ queryKey: key, queryFn: () => fetchJson<ScheduleDto>(`/api/episodes/${episodeId}/schedule`) });
  const days = useQuery({ queryKey: ["shoot-days", channelId, "all"], queryFn: () => fetchJson<{ shootDays: ShootDayDto[] }>(`/api/channels/${channelId}/shoot-days`) });
  const write = useWrite({ scope: `schedule:${episodeId}` });
  const [msg, setMsg] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [moved, setMoved] = useState<ScheduleDto["moved"] | null>(null);
  const s = schedule.data;
  if (!s) return <p className="text-walnut-700">{schedule.error ? (schedule.error as Error).message : "Planning…"}</p>;
  const tz = s.timeZone;
  const when = (iso: string, f = "EEE d MMM HH:mm") => format(new TZDate(new Date(iso).getTime(), tz), f);
  const allDays = days.data?.shootDays ?? [];
  const dayName = (id: string | null) => {
    const d = allDays.find((x) => x.id === id);
    return d ? `${format(new Date(`${d.date}T12:00:00Z`), "EEE d MMM")}${d.location ? `, ${d.location}` : ""}` : "off camera";
  };
  const refresh = () => Promise.all([qc.invalidateQueries({ queryKey: key }), qc.invalidateQueries({ queryKey: ["shoot-days", channelId] })]);
  const groups = new Map<string, ScheduleDto["placements"]>();
  for (const p of s.placements) {
    const k = p.dayId ?? `off:${p.date ?? "none"}`;
    groups.set(k, [...(groups.get(k) ?? []), p]);
  }
  // Days this episode can use: its own and those not tied to any episode.
  const upcoming = allDays.filter((d) => d.status !== "cancelled" && (d.episodeId === episodeId || d.episodeId === null));

  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-3">
        <h2 className="text-lg font-bold">Shoot schedule</h2>
        <span className="text-sm text-walnut-700">
          {s.finish ? (
            <>
              Last filmed step ends <span className="num">{when(s.finish)}</span> · {s.shootDaysUsed} shoot day{s.shootDaysUsed === 1 ? "" : "s"} · times in {tz}
            </>
          ) : (
            "Nothing placed yet."
          )}
        </span>
        {canPlan ? (
          <Button
            variant="primary"
            className="ml-auto"
            onClick={async () => {
              try {
                const r = await write<ScheduleDto>(`/api/episodes/${episodeId}/schedule`, "POST");
                setMoved(r.moved);
                setMsg({ tone: "ok", text: r.moved.length ? `Schedule saved. ${r.moved.length} step${r.moved.length === 1 ? "" : "s"} moved.` : "Schedule saved. Nothing moved." });
                await refresh();
              } catch (e) {
                setMsg({ tone: "error", text: (e as Error).message });
              }
            }}
          >
            Plan and save
          </Button>
        ) : null}
      </div>
      <p className="text-sm text-walnut-700">
        A step starts only when the steps before it are done and their waits (glue, finish) have run on the clock, overnight too. Filmed steps sit inside a shoot day&apos;s hours with enough crew; unfilmed steps may run off camera between shoot days.
        {s.savedAt ? ` Saved ${when(s.savedAt)}; call sheets use the saved plan.` : " Not saved yet; call sheets use the saved plan."}
      </p>
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
      {s.unscheduled.length ? (
        <div role="alert" className="rounded-plank border-l-4 border-fault-700 bg-fault-50 p-3 text-sm" data-testid="schedule-problems">
          <p className="font-bold">Not everything fits</p>
          <ul className="ml-4 list-disc">
            {s.unscheduled.map((u) => (
              <li key={u.stepId}>{u.reason}</li>
            ))}
          </ul>
          {s.suggestion ? (
            <p className="mt-2" data-testid="schedule-suggestion">
              {s.suggestion.text}{" "}
              {canPlan ? (
                <Button
                  onClick={async () => {
                    const template = upcoming.at(-1);
                    await write(`/api/channels/${channelId}/shoot-days`, "POST", {
                      date: s.suggestion!.date,
                      callTime: when(s.suggestion!.start, "HH:mm"),
                      wrapTime: when(s.suggestion!.end, "HH:mm"),
                      episodeId,
                      location: template?.location ?? "",
                      crew: (template?.crew ?? []).map((c) => ({ userId: c.userId, duty: c.duty })),
                    });
                    setMsg({ tone: "ok", text: `Added a shoot day on ${s.suggestion!.date}.` });
                    await refresh();
                  }}
                >
                  Add that day
                </Button>
              ) : null}
            </p>
          ) : null}
        </div>
      ) : null}
      {s.warnings.map((w) => (
        <Notice key={w}>{w}</Notice>
      ))}
      {moved && moved.length ? (
        <section className="rounded-plank border border-heed-600 bg-heed-50 p-3 text-sm" aria-label="What moved" data-testid="schedule-moved">
          <p className="font-bold">What moved</p>
          <ul className="ml-4 list-disc">
            {moved.map((m) => (
              <li key={m.stepId}>
                {m.title}: {m.from ? `${dayName(m.from.dayId)} ${when(m.from.start, "HH:mm")}` : "not planned"} → {m.to ? `${dayName(m.to.dayId)} ${when(m.to.start, "HH:mm")}` : "does not fit"}
              </li>
            ))}
          </ul>
        </section>
      ) : null}

      <ol className="space-y-3" data-testid="schedule-days">
        {[...groups.entries()].map(([k, items]) => {
          const day = allDays.find((d) => d.id === k);
          return (
            <li key={k} className="rounded-plank border border-timber-300 bg-white">
              <h3 className={`border-b border-timber-200 px-3 py-1.5 font-bold ${day ? "bg-chalk-100" : "bg-timber-100"}`}>
                {day ? (
                  <>
                    {format(new Date(`${day.date}T12:00:00Z`), "EEEE d MMMM")} · <span className="num">{day.callTime}–{day.wrapTime}</span>
                    {day.location ? ` · ${day.location}` : ""}
                  </>
                ) : items[0]!.date ? (
                  <>{format(new Date(`${items[0]!.date}T12:00:00Z`), "EEEE d MMMM")} · off camera</>
                ) : (
                  "No hands-on time"
                )}
              </h3>
              <ul className="divide-y divide-timber-200">
                {items.map((p) => (
                  <li key={p.stepId} className="flex flex-wrap items-center gap-x-3 gap-y-1 px-3 py-2 text-sm" data-testid="scheduled-step">
                    <span className="num w-28">
                      {when(p.start, "HH:mm")}–{when(p.end, "HH:mm")}
                    </span>
                    <span className="min-w-40 flex-1 font-medium">{p.title}</span>
                    {p.waitMinutes ? (
                      <span className="text-walnut-700">
                        then {p.waitReason || "wait"} until <span className="num">{when(p.readyAfter)}</span>
                      </span>
                    ) : null}
                    {canPlan ? (
                      <>
                        <CheckboxLabel
                          label="Filmed"
                          checked={p.mustFilm}
                          onChange={async (e) => {
                            await write(`/api/steps/${p.stepId}`, "PATCH", { mustFilm: e.target.checked });
                            await refresh();
                          }}
                        />
                        <select
                          aria-label={`Pin ${p.title} to a shoot day`}
                          className="rounded-plank border border-timber-300 bg-white px-1 py-1"
                          value={p.pinnedShootDayId ?? ""}
                          onChange={async (e) => {
                            try {
                              await write(`/api/steps/${p.stepId}`, "PATCH", { pinnedShootDayId: e.target.value || null });
                            } catch (err) {
                              setMsg({ tone: "error", text: (err as Error).message });
                            }
                            await refresh();
                          }}
                        >
                          <option value="">Not pinned</option>
                          {upcoming.map((d) => (
                            <option key={d.id} value={d.id}>
                              Pin to {format(new Date(`${d.date}T12:00:00Z`), "EEE d MMM")}
                            </option>
                          ))}
                        </select>
                      </>
                    ) : (
                      <span className="text-walnut-700">{p.mustFilm ? "filmed" : "off camera"}{p.pinnedShootDayId ? " · pinned" : ""}</span>
                    )}
                  </li>
                ))}
              </ul>
            </li>
          );
        })}
      </ol>
      {s.placements.length === 0 && s.unscheduled.length === 0 ? <p className="rounded-plank border border-dashed border-timber-400 p-4 text-sm text-walnut-700">No build steps yet, or no shoot days: add both and the schedule appears here.</p> : null}
    </div>
  );
}
