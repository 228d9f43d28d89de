import "server-only";
import { cache } from "react";
import { notFound } from "next/navigation";
import { z } from "zod";
import { pageAccess } from "./page-access";
import { getEpisodeById } from "../../../db/queries/episodes";

// The episode layout and its page read the same episode: once per render (React cache).
const episodeOf = cache((id: string) => getEpisodeById({ id }));

/** For episode pages: session, membership and the episode, or 404. */
export async function episodePage(channelIdRaw: string, episodeIdRaw: string, back: string) {
  const access = await pageAccess(channelIdRaw, "channel.read", back);
  const id = z.uuid().safeParse(episodeIdRaw);
  if (!id.success) notFound();
  const episode = await episodeOf(id.data);
  if (!episode || episode.channelId !== access.channelId) notFound();
  return { access, episode };
}
