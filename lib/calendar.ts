/**
 * Shoot days as iCalendar (RFC 5545), with ical-generator. Each day is one
 * VEVENT whose UID is fixed by the day's id, so a calendar app that fetches
 * the feed again updates the event instead of adding a copy, and whose
 * SEQUENCE grows with every edit (RFC 5545 §3.8.7.4). Times are written in
 * UTC (a DATE-TIME with "Z", §3.3.5 form #2), which every calendar reads the
 * same way whatever its zone.
 */
import ical, { ICalCalendarMethod, ICalEventStatus } from "ical-generator";

export const CALENDAR_PRODID = { company: "Jigboard", product: "Shoot days", language: "EN" };

export interface CalendarDay {
  id: string;
  title: string;
  start: Date;
  end: Date;
  location: string;
  description: string;
  cancelled: boolean;
  updatedAt: Date;
  url?: string;
}

/** The UID of a shoot day's event: stable for the day's whole life. */
export function shootDayUid(id: string): string {
  return `shoot-day-${id}@jigboard`;
}

/** SEQUENCE: whole seconds since 2026-01-01 at the last edit, so it only ever grows. */
export function sequenceOf(updatedAt: Date): number {
  return Math.max(0, Math.floor((updatedAt.getTime() - Date.UTC(2026, 0, 1)) / 1000));
}

export function calendarOf(name: string, days: CalendarDay[], opts: { method?: "publish" } = {}): string {
  const cal = ical({ name, prodId: CALENDAR_PRODID, method: opts.method === "publish" ? ICalCalendarMethod.PUBLISH : undefined });
  for (const d of days) {
    cal.createEvent({
      id: shootDayUid(d.id),
      start: d.start,
      end: d.end,
      stamp: d.updatedAt,
      lastModified: d.updatedAt,
      sequence: sequenceOf(d.updatedAt),
      summary: d.cancelled ? `Cancelled: ${d.title}` : d.title,
      description: d.description,
      location: d.location || null,
      status: d.cancelled ? ICalEventStatus.CANCELLED : ICalEventStatus.CONFIRMED,
      url: d.url ?? null,
    });
  }
  return cal.toString();
}
