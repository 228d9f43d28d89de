"use client";
import { useState } from "react";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import { useWrite } from "@/components/use-write";

/** Asks what went wrong, uploads an optional photo straight to storage, then marks the step failed. */
export function FailureForm({ episodeId, stepId, onDone, onCancel }: { episodeId: string; stepId: string; onDone: () => void; onCancel: () => void }) {
  const write = useWrite({ scope: `plan:${episodeId}` });
  const [note, setNote] = useState("");
  const [file, setFile] = useState<File | null>(null);
  const [busy, setBusy] = useState<string | null>(null);
  const [error, setError] = useState<string | null>(null);

  async function submit(e: React.FormEvent) {
    e.preventDefault();
    setError(null);
    if (!note.trim()) return setError("Say what went wrong, so the team and the story can follow.");
    try {
      let photoKey: string | null = null;
      if (file) {
        setBusy("Uploading photo…");
        const signed = await write<{ key: string; uploadUrl: string; headers: Record<string, string> }>(`/api/episodes/${episodeId}/photos`, "POST", { contentType: file.type, size: file.size });
        // The bytes go straight to storage on the presigned URL, not to the API.
        // eslint-disable-next-line no-restricted-globals
        const put = await fetch(signed.uploadUrl, { method: "PUT", headers: signed.headers, body: file });
        if (!put.ok) throw new Error("The photo upload failed; try again or save without it.");
        photoKey = signed.key;
      }
      setBusy("Saving…");
      await write(`/api/steps/${stepId}/failure`, "POST", { note, photoKey });
      onDone();
    } catch (err) {
      setError((err as Error).message);
    } finally {
      setBusy(null);
    }
  }

  return (
    <form onSubmit={submit} className="space-y-2 rounded-plank border border-fault-700 bg-fault-50 p-3" aria-label="Mark step failed">
      {error ? <Notice tone="error">{error}</Notice> : null}
      <label className="block text-sm font-medium" htmlFor={`fail-${stepId}`}>
        What went wrong?
      </label>
      <textarea id={`fail-${stepId}`} rows={2} value={note} onChange={(e) => setNote(e.target.value)} className="w-full rounded-plank border border-timber-300 bg-white px-2 py-1.5" />
      <label className="block text-sm">
        Photo (optional, JPEG, PNG or WebP, up to 20 MB)
        <input type="file" accept="image/jpeg,image/png,image/webp" className="mt-1 block text-sm" onChange={(e) => setFile(e.target.files?.[0] ?? null)} />
      </label>
      <div className="flex items-center gap-2">
        <Button type="submit" variant="danger" disabled={Boolean(busy)}>
          Mark failed
        </Button>
        <Button type="button" variant="quiet" onClick={onCancel}>
          Cancel
        </Button>
        {busy ? (
          <span role="status" className="text-sm text-walnut-700">
            {busy}
          </span>
        ) : null}
      </div>
    </form>
  );
}
