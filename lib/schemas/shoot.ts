import { z } from "zod";

export const SHOOT_DAY_STATUSES = ["planned", "confirmed", "shot", "cancelled"] as const;
export type ShootDayStatus = (typeof SHOOT_DAY_STATUSES)[number];
export const SHOOT_DAY_STATUS_LABELS: Record<ShootDayStatus, string> = { planned: "Planned", confirmed: "Confirmed", shot: "Shot", cancelled: "Cancelled" };

export const dateSchema = z.iso.date({ message: "use a date like 2026-12-12" });
/** Wall-clock time in the channel's zone, 24-hour. */
export const clockSchema = z.string().regex(/^([01]\d|2[0-3]):[0-5]\d$/, "use a 24-hour time like 09:30");

export function clockToMinutes(t: string): number {
  return Number(t.slice(0, 2)) * 60 + Number(t.slice(3, 5));
}
export function minutesToClock(m: number): string {
  return `${String(Math.floor(m / 60)).padStart(2, "0")}:${String(m % 60).padStart(2, "0")}`;
}

/** A real IANA zone name, as the runtime knows it. */
export const timeZoneSchema = z.string().refine(
  (tz) => {
    try {
      new Intl.DateTimeFormat("en", { timeZone: tz });
      return true;
    } catch {
      return false;
    }
  },
  { message: "use a time zone name like Europe/Dublin or America/Chicago" },
);

const crewSchema = z
  .object({ userId: z.uuid({ message: "must be a member's id" }), duty: z.string().trim().max(80).default(""), callTime: clockSchema.nullable().default(null) })
  .strict();
const helperSchema = z
  .object({
    name: z.string().trim().min(1, "give the helper's name").max(120),
    duty: z.string().trim().max(80).default(""),
    email: z.email({ message: "must be an e-mail address" }).nullable().default(null),
    callTime: clockSchema.nullable().default(null),
  })
  .strict();

const dayFields = {
  date: dateSchema,
  callTime: clockSchema,
  wrapTime: clockSchema,
  episodeId: z.uuid({ message: "must be an episode id" }).nullable(),
  location: z.string().trim().max(200),
  equipmentNotes: z.string().max(4000),
  safetyNotes: z.string().max(4000),
  weatherNote: z.string().max(1000),
  contacts: z.string().max(2000),
  notes: z.string().max(4000),
  status: z.enum(SHOOT_DAY_STATUSES),
  crew: z.array(crewSchema).max(20).refine((c) => new Set(c.map((x) => x.userId)).size === c.length, "list each member once"),
  helpers: z.array(helperSchema).max(20),
};

const wrapAfterCall = (v: { callTime?: string; wrapTime?: string }) => !v.callTime || !v.wrapTime || clockToMinutes(v.wrapTime) > clockToMinutes(v.callTime);
const wrapIssue = { message: "wrap must be after call (a day ends by midnight)", path: ["wrapTime"] };

export const shootDayCreateSchema = z
  .object({
    ...dayFields,
    callTime: dayFields.callTime.default("09:00"),
    wrapTime: dayFields.wrapTime.default("17:00"),
    episodeId: dayFields.episodeId.default(null),
    location: dayFields.location.default(""),
    equipmentNotes: dayFields.equipmentNotes.default(""),
    safetyNotes: dayFields.safetyNotes.default(""),
    weatherNote: dayFields.weatherNote.default(""),
    contacts: dayFields.contacts.default(""),
    notes: dayFields.notes.default(""),
    status: dayFields.status.default("planned"),
    crew: dayFields.crew.default([]),
    helpers: dayFields.helpers.default([]),
  })
  .strict()
  .refine(wrapAfterCall, wrapIssue)
  .meta({ id: "ShootDayCreate" });
export type ShootDayCreate = z.output<typeof shootDayCreateSchema>;

export const shootDayUpdateSchema = z
  .object(dayFields)
  .partial()
  .strict()
  .refine((v) => Object.keys(v).length > 0, { message: "send at least one field to change" })
  .refine(wrapAfterCall, wrapIssue)
  .meta({ id: "ShootDayUpdate" });
export type ShootDayUpdate = z.output<typeof shootDayUpdateSchema>;

export const shootDayListQuerySchema = z.object({ from: dateSchema.optional(), to: dateSchema.optional() }).strict();

/** A member's own days away: dates to add and to take off. */
export const daysAwaySchema = z
  .object({ add: z.array(dateSchema).max(366).default([]), remove: z.array(dateSchema).max(366).default([]), note: z.string().trim().max(200).default("") })
  .strict()
  .refine((v) => v.add.length + v.remove.length > 0, { message: "send dates to add or remove" })
  .meta({ id: "DaysAway" });

export const callSheetSendSchema = z.object({ message: z.string().trim().max(2000).default("") }).strict().meta({ id: "CallSheetSend" });

// ---- Responses

export const shootDaySchema = z
  .object({
    id: z.string(),
    channelId: z.string(),
    episodeId: z.string().nullable(),
    date: z.string(),
    timeZone: z.string(),
    callTime: z.string(),
    wrapTime: z.string(),
    callAt: z.string(),
    wrapAt: z.string(),
    location: z.string(),
    equipmentNotes: z.string(),
    safetyNotes: z.string(),
    weatherNote: z.string(),
    contacts: z.string(),
    notes: z.string(),
    status: z.enum(SHOOT_DAY_STATUSES),
    crew: z.array(z.object({ userId: z.string(), name: z.string(), duty: z.string(), callTime: z.string().nullable(), away: z.boolean() })),
    helpers: z.array(z.object({ id: z.string(), name: z.string(), duty: z.string(), email: z.string().nullable(), callTime: z.string().nullable() })),
    callSheetSentAt: z.string().nullable(),
    updatedAt: z.string(),
  })
  .meta({ id: "ShootDay" });
export type ShootDayDto = z.infer<typeof shootDaySchema>;

export const daysAwayListSchema = z.object({ daysAway: z.array(z.object({ userId: z.string(), name: z.string(), date: z.string(), note: z.string() })) }).meta({ id: "DaysAwayList" });
export type DaysAwayDto = z.infer<typeof daysAwayListSchema>["daysAway"][number];

const slotSchema = z.object({ dayId: z.string().nullable(), start: z.string() });
export const scheduleSchema = z
  .object({
    timeZone: z.string(),
    placements: z.array(
      z.object({
        stepId: z.string(),
        title: z.string(),
        mustFilm: z.boolean(),
        pinnedShootDayId: z.string().nullable(),
        dayId: z.string().nullable(),
        date: z.string().nullable(),
        start: z.string(),
        end: z.string(),
        readyAfter: z.string(),
        waitMinutes: z.number(),
        waitReason: z.string(),
      }),
    ),
    unscheduled: z.array(z.object({ stepId: z.string(), title: z.string(), reason: z.string() })),
    warnings: z.array(z.string()),
    finish: z.string().nullable(),
    shootDaysUsed: z.number(),
    suggestion: z.object({ date: z.string(), start: z.string(), end: z.string(), text: z.string() }).nullable(),
    method: z.enum(["exact", "greedy"]),
    /** Against the saved plan: what would move (GET) or moved (POST). */
    moved: z.array(z.object({ stepId: z.string(), title: z.string(), from: slotSchema.nullable(), to: slotSchema.nullable() })),
    savedAt: z.string().nullable(),
  })
  .meta({ id: "Schedule" });
export type ScheduleDto = z.infer<typeof scheduleSchema>;

export const callSheetSchema = z
  .object({
    day: shootDaySchema,
    channelName: z.string(),
    episodeTitle: z.string().nullable(),
    steps: z.array(
      z.object({
        stepId: z.string(),
        title: z.string(),
        start: z.string(),
        end: z.string(),
        startClock: z.string(),
        endClock: z.string(),
        mustFilm: z.boolean(),
        waitAfter: z.string(),
        shots: z.array(z.object({ id: z.string(), kind: z.string(), description: z.string(), framing: z.string(), status: z.string() })),
        cautions: z.array(z.object({ signalWord: z.string(), text: z.string() })),
        tools: z.array(z.string()),
      }),
    ),
    sends: z.array(z.object({ id: z.string(), recipients: z.array(z.string()), status: z.enum(["queued", "sent", "failed"]), queuedAt: z.string(), sentAt: z.string().nullable(), error: z.string().nullable() })),
    generalCautions: z.array(z.string()),
  })
  .meta({ id: "CallSheet" });
export type CallSheetDto = z.infer<typeof callSheetSchema>;
