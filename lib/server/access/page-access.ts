import "server-only";
import { cache } from "react";
import { notFound, redirect } from "next/navigation";
import { z } from "zod";
import { currentUser, type SessionUser } from "./session";
import { getMembership } from "../../../db/queries/channels";
import { can, type Action } from "../../permissions";
import type { Role } from "../../roles";

// One lookup per render, however many layouts and pages ask (React cache).
const membershipOf = cache((userId: string, channelId: string) => getMembership({ userId, channelId }));

export interface PageAccess {
  user: SessionUser;
  channelId: string;
  roles: Role[];
  allowed: boolean;
}

/** Pages call this first: no session → sign-in; not a member → 404; `allowed` says whether the action is permitted. */
export async function pageAccess(channelIdRaw: string, action: Action = "channel.read", back = "/"): Promise<PageAccess> {
  const user = await currentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(back)}`);
  const channelId = z.uuid().safeParse(channelIdRaw);
  if (!channelId.success) notFound();
  const membership = await membershipOf(user.id, channelId.data);
  if (!membership) notFound();
  return { user, channelId: channelId.data, roles: membership.roles, allowed: can(membership.roles, action) };
}
