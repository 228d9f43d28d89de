import Link from "next/link";
import { notFound } from "next/navigation";
import { z } from "zod";
import { episodePage } from "@/lib/server/access/episode-page";
import { getClipById } from "@/db/queries/footage";
import { presignGet } from "@/storage/presign";
import { rateOf } from "@/lib/timecode";
import { can } from "@/lib/permissions";
import { formatBytes } from "@/lib/schemas/footage";
import { ClipPlayer } from "@/components/footage/clip-player";

export const metadata = { title: "Clip" };

export default async function ClipPage({ params }: { params: Promise<{ channelId: string; episodeId: string; clipId: string }> }) {
  const { channelId, episodeId, clipId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/footage/${clipId}`);
  const id = z.uuid().safeParse(clipId);
  if (!id.success) notFound();
  const clip = await getClipById({ id: id.data });
  if (!clip || clip.episodeId !== episode.id) notFound();
  const rate = rateOf(episode.frameRate, episode.dropFrame);
  return (
    <div className="space-y-3">
      <p className="text-sm">
        <Link className="text-chalk-600 underline" href={`/c/${access.channelId}/episodes/${episode.id}/footage`}>
          ← All footage
        </Link>
      </p>
      <h2 className="text-lg font-bold">{clip.originalName}</h2>
      <p className="num text-xs text-walnut-700">
        {formatBytes(clip.sizeBytes)} · {clip.contentType} · {clip.width && clip.height ? `${clip.width}×${clip.height}` : "size unknown"} · {clip.frameRate ? `${clip.frameRate} fps` : "rate unknown"} · {clip.durationMs != null ? `${(clip.durationMs / 1000).toFixed(2)} s` : "length unknown"}
        {clip.startTimecode ? ` · starts ${clip.startTimecode}` : ""}
      </p>
      {clip.state === "stored" ? (
        <ClipPlayer clipId={clip.id} url={await presignGet(clip.storageKey, 5 * 60)} rate={rate} startTimecode={clip.startTimecode} initialIn={clip.inFrame} initialOut={clip.outFrame} canEdit={can(access.roles, "footage.manage")} />
      ) : (
        <p className="text-sm">This clip has not finished uploading.</p>
      )}
    </div>
  );
}
