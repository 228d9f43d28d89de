import "server-only";
/**
 * Server side of the permission module: loads the membership's roles fresh on
 * every request and asks lib/permissions. A channel the user is not a member
 * of is "not found", never "forbidden", so its existence does not leak.
 */
import { can, canMoveEpisode, type Action } from "../../permissions";
import type { Role } from "../../roles";
import type { Stage } from "../../stages";
import { AppError } from "../http/errors";
import { getMembership } from "../../../db/queries/channels";

export interface ChannelAccess {
  channelId: string;
  userId: string;
  roles: Role[];
}

export async function requireChannel(userId: string, channelId: string, action: Action, what = "channel"): Promise<ChannelAccess> {
  const membership = await getMembership({ userId, channelId });
  if (!membership) throw new AppError(`not_found:${what}`, `No such ${what}.`);
  const access = { channelId, userId, roles: membership.roles };
  assertCan(access, action);
  return access;
}

export function assertCan(access: ChannelAccess, action: Action): void {
  if (!can(access.roles, action)) {
    throw new AppError(`forbidden:${action}`, `Your role in this channel does not allow this (${action}). Ask the channel owner.`);
  }
}

export function assertCanMove(access: ChannelAccess, from: Stage, to: Stage): void {
  if (!canMoveEpisode(access.roles, from, to)) {
    const editorOnly = access.roles.includes("editor");
    throw new AppError(
      "forbidden:episode.move",
      editorOnly
        ? "Editors can move episodes only between Editing and Final check."
        : "Your role in this channel does not allow moving episodes.",
    );
  }
}
