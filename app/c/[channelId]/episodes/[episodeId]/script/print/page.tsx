import { episodePage } from "@/lib/server/access/episode-page";
import { scriptViewFor } from "@/lib/server/views/script";
import { listStepTitlesByEpisode } from "@/db/queries/build";
import { SEGMENT_KIND_LABELS } from "@/lib/script-timing";
import { PrintButton } from "@/components/print-button";

export const metadata = { title: "Print script" };

/** Fits A4 and Letter: the page box is left to the printer; margins and type are set for both. */
export default async function PrintPage({ params }: { params: Promise<{ channelId: string; episodeId: string }> }) {
  const { channelId, episodeId } = await params;
  const { episode } = await episodePage(channelId, episodeId, `/c/${channelId}/episodes/${episodeId}/script/print`);
  const [view, steps] = await Promise.all([scriptViewFor(episode), listStepTitlesByEpisode({ episodeId: episode.id })]);
  const title = new Map(steps.map((s) => [s.id, s.title]));
  return (
    <article className="print-sheet bg-white p-6 text-[11pt] print:p-0">
      <style>{`@media print { @page { margin: 16mm 14mm; } header, nav, .print\\:hidden { display: none !important; } body { background: white; } tr { break-inside: avoid; } }`}</style>
      <div className="mb-3 flex items-start gap-4">
        <div>
          <h2 className="text-lg font-bold">{episode.title}: script</h2>
          <p className="num text-xs">
            {view.rate.id} fps{view.rate.dropFrame ? " drop-frame" : ""} · runtime {view.totals.timecode} · {view.wordsPerMinute} wpm
          </p>
        </div>
        <div className="ml-auto">
          <PrintButton />
        </div>
      </div>
      <table className="w-full border-collapse">
        <thead>
          <tr className="border-b-2 border-walnut-900 text-left text-xs">
            <th className="w-[7.5rem] py-1">Timecode</th>
            <th className="w-[8rem]">Kind · step</th>
            <th>Text</th>
          </tr>
        </thead>
        <tbody>
          {view.segments.map((s) => (
            <tr key={s.id} className="border-b border-timber-300 align-top">
              <td className="num py-1.5 pr-2 text-xs">
                {s.timing.startTimecode}
                <br />
                {s.timing.endTimecode}
              </td>
              <td className="pr-2 text-xs">
                {SEGMENT_KIND_LABELS[s.kind]}
                {s.stepId ? <div className="text-walnut-700">{title.get(s.stepId)}</div> : null}
                {s.chapterStart ? <div className="font-bold">Chapter: {s.chapterTitle}</div> : null}
              </td>
              <td className="py-1.5">
                <p className="whitespace-pre-wrap">{s.text}</p>
                {s.editorNotes ? <p className="mt-1 text-xs italic">Note to the editor: {s.editorNotes}</p> : null}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </article>
  );
}
