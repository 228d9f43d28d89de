import { episodePage } from "@/lib/server/access/episode-page";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { listMembersByChannel } from "@/db/queries/channels";
import { getUserById } from "@/db/queries/users";
import { can } from "@/lib/permissions";
import { ScriptEditor } from "@/components/script/script-editor";

export const metadata = { title: "Script" };

export default async function ScriptPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { access, episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/script`);
  const [steps, members, me] = await Promise.all([
    listStepTitlesByEpisode({ episodeId: episode.id }),
    listMembersByChannel({ channelId: access.channelId }),
    getUserById({ id: access.user.id }),
  ]);
  return (
    <ScriptEditor
      episodeId={episode.id}
      base={`/c/${access.channelId}/episodes/${episode.id}`}
      targetSeconds={episode.targetRuntimeSeconds}
      steps={steps}
      canWrite={can(access.roles, "script.write")}
      canAnnotate={can(access.roles, "script.annotate")}
      canChoosePresenter={can(access.roles, "episode.edit")}
      presenterId={episode.presenterId}
      members={members.map((m) => ({ id: m.userId, name: m.name }))}
      myWpm={me?.readingRateWpm ?? 150}
    />
  );
}
