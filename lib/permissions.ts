/**
 * The one place that decides who may do what in a channel. Pure: it takes the
 * roles a membership holds and answers yes or no. The server layer
 * (lib/server/access.ts) loads the roles fresh from the database on every
 * request and calls these functions; components may call them only to hide
 * controls, never as the security boundary. Deny by default.
 */
import type { Role } from "./roles";
import { EDITING_STAGES, type Stage } from "./stages";

export const ACTIONS = {
  "channel.read": ["owner", "presenter", "editor", "producer", "sponsor_liaison"],
  "members.manage": ["owner"],
  "mailbox.read": ["owner"],
  "episode.create": ["owner", "presenter", "producer"],
  "episode.edit": ["owner", "presenter", "producer"],
  "episode.archive": ["owner", "presenter", "producer"],
  // Moving is further narrowed by canMoveEpisode (editors: editing stages only).
  "episode.move": ["owner", "presenter", "producer", "editor"],
  "build.edit": ["owner", "presenter"],
  "build.timing": ["owner", "presenter", "producer"],
  "tools.edit": ["owner", "presenter"],
  "script.write": ["owner", "presenter"],
  "script.annotate": ["owner", "presenter", "editor"],
  "shots.edit": ["owner", "presenter", "producer", "editor"],
  "footage.manage": ["owner", "editor"],
  "coverage.manage": ["owner", "editor"],
  // Shoot days, crew, the saved schedule, call sheets and the calendar feed.
  "schedule.edit": ["owner", "producer"],
  // Everyone marks their own days away (and only their own).
  "availability.own": ["owner", "presenter", "editor", "producer", "sponsor_liaison"],
  "calendar.rotate": ["owner"],
  "sponsors.manage": ["owner", "sponsor_liaison"],
  // Everyone reads deals; only these see what a sponsor pays.
  "deals.fees": ["owner", "sponsor_liaison"],
  "invoices.manage": ["owner", "sponsor_liaison"],
  "publish.edit": ["owner", "presenter", "editor"],
  // Notes at the bench while filming (everyone on the crew; the liaison reads them).
  "shootlog.write": ["owner", "presenter", "editor", "producer"],
  // Every record of the channel leaves in the export; importing it makes a new channel.
  "channel.export": ["owner"],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof ACTIONS;

export function can(roles: readonly Role[] | null | undefined, action: Action): boolean {
  if (!roles || roles.length === 0) return false;
  const allowed: readonly Role[] = ACTIONS[action];
  return roles.some((r) => allowed.includes(r));
}

/** Owner, presenter and producer move anywhere; an editor only between editing stages. */
export function canMoveEpisode(roles: readonly Role[] | null | undefined, from: Stage, to: Stage): boolean {
  if (!roles) return false;
  if (roles.some((r) => r === "owner" || r === "presenter" || r === "producer")) return true;
  if (roles.includes("editor")) return EDITING_STAGES.includes(from) && EDITING_STAGES.includes(to);
  return false;
}
