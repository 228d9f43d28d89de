"use client";
/** The owner takes the whole channel out as one file, and can bring such a file back in as a new channel. */
import { useState } from "react";
import { useRouter } from "next/navigation";
import { useWrite } from "@/components/use-write";
import { Button } from "@/components/ui/button";

export function ChannelArchive({ channelId, channelName }: { channelId: string; channelName: string }) {
  const write = useWrite({ scope: "channel-import" });
  const router = useRouter();
  const [file, setFile] = useState<File | null>(null);
  const [name, setName] = useState(`${channelName} (copy)`);
  const [state, setState] = useState<{ tone: "info" | "error" | "done"; text: string } | null>(null);

  async function importFile() {
    if (!file) return;
    setState({ tone: "info", text: "Importing… large channels take a while; nothing is kept unless the whole file checks out." });
    try {
      const r = await write<{ channelId: string; rows: number; objects: number }>(`/api/channels/import?name=${encodeURIComponent(name.trim())}`, "POST", undefined, { body: file, contentType: "application/zip" });
      setState({ tone: "done", text: `Imported ${r.rows.toLocaleString("en")} records and ${r.objects} stored files.` });
      router.push(`/c/${r.channelId}`);
    } catch (e) {
      setState({ tone: "error", text: (e as Error).message });
    }
  }

  return (
    <section aria-labelledby="archive-h" className="space-y-3 rounded-plank border border-timber-300 bg-white p-4">
      <h2 id="archive-h" className="font-bold">
        Take the channel with you
      </h2>
      <p className="text-sm">
        The export is one zip with every record of this channel (episodes, plans, scripts, shots, shoot days, sponsors, invoices, the publish packages and the activity log) and a list of the stored footage and photos. The footage itself stays in storage: an import on this installation copies it across. Sign-in secrets and review-link tokens are never exported.
      </p>
      <a className="inline-flex rounded-plank border border-chalk-700 bg-chalk-600 px-3 py-1.5 text-sm font-medium text-white hover:bg-chalk-700" href={`/api/channels/${channelId}/export`} download>
        Download the export
      </a>
      <div className="space-y-2 border-t border-timber-200 pt-3">
        <h3 className="text-sm font-bold">Import an export as a new channel</h3>
        <p className="text-xs text-walnut-700">You must be an owner of the channel it came from. A file that was changed or cut short is refused and nothing is written.</p>
        <label className="block text-sm">
          <span className="font-medium">Export file</span>
          <input type="file" accept=".zip,application/zip" className="mt-1 block text-sm" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
        </label>
        <label className="block text-sm">
          <span className="font-medium">Name of the new channel</span>
          <input className="mt-1 w-full rounded-plank border border-timber-300 px-2 py-1.5" value={name} onChange={(e) => setName(e.target.value)} maxLength={120} />
        </label>
        <Button type="button" disabled={!file || !name.trim() || state?.tone === "info"} onClick={() => void importFile()}>
          Import
        </Button>
        {state ? (
          <p role={state.tone === "error" ? "alert" : "status"} className={`text-sm ${state.tone === "error" ? "text-fault-700" : state.tone === "done" ? "text-pass-700" : "text-walnut-700"}`}>
            {state.text}
          </p>
        ) : null}
      </div>
    </section>
  );
}
