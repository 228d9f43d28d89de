import "server-only";
import { notFound } from "next/navigation";
import { z } from "zod";
import { pageAccess } from "./page-access";
import { getEpisodeById } from "../../db/queries/episodes";

/** For episode pages: session, membership and the episode, or 404. */
export async function episodePage(channelIdRaw: string, episodeIdRaw: string, back: string) {
  const access = await pageAccess(channelIdRaw, "channel.read", back);
  const id = z.uuid().safeParse(episodeIdRaw);
  if (!id.success) notFound();
  const episode = await getEpisodeById({ id: id.data });
  if (!episode || episode.channelId !== access.channelId) notFound();
  return { access, episode };
}
