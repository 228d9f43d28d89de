import { episodePage } from "@/lib/server/access/episode-page";
import { listStepsByEpisode } from "@/db/queries/build";
import { listShotsByEpisode } from "@/db/queries/shots";
import { SHOT_KIND_LABELS, SHOT_STATUS_LABELS } from "@/lib/schemas/footage";
import { PrintButton } from "@/components/print-button";

export const metadata = { title: "Print shot list" };

export default async function ShotPrintPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/shots/print`);
  const [steps, shots] = await Promise.all([listStepsByEpisode({ episodeId: episode.id }), listShotsByEpisode({ episodeId: episode.id })]);
  const groups = [...steps.map((s) => ({ title: `${s.position + 1}. ${s.title}`, shots: shots.filter((x) => x.stepId === s.id) })), { title: "Not tied to a build step", shots: shots.filter((x) => !x.stepId) }].filter((g) => g.shots.length);
  return (
    <article className="bg-white p-6 text-[11pt] print:p-0">
      <style>{`@media print { @page { margin: 14mm; } header, nav, .print\\:hidden { display: none !important; } section { break-inside: avoid; } }`}</style>
      <div className="mb-3 flex items-start">
        <h2 className="text-lg font-bold">{episode.title}: shot list</h2>
        <div className="ml-auto">
          <PrintButton />
        </div>
      </div>
      {groups.map((g) => (
        <section key={g.title} className="mb-4">
          <h3 className="border-b-2 border-walnut-900 font-bold">{g.title}</h3>
          <table className="w-full text-sm">
            <tbody>
              {g.shots.map((s) => (
                <tr key={s.id} className="border-b border-timber-300 align-top">
                  <td className="w-6 py-1">☐</td>
                  <td className="w-8">P{s.priority}</td>
                  <td className="w-28">{SHOT_KIND_LABELS[s.kind]}</td>
                  <td>
                    {s.description}
                    {s.framing || s.cameraNotes ? <div className="text-xs text-walnut-700">{[s.framing, s.cameraNotes].filter(Boolean).join(" · ")}</div> : null}
                  </td>
                  <td className="w-20 text-xs">{SHOT_STATUS_LABELS[s.status]}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ))}
    </article>
  );
}
