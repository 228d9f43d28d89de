"use client";
import { useRef, useState } from "react";
import { formatTimecode, parseTimecode, type Rate } from "@/lib/timecode";
import { Button } from "@/components/ui/button";
import { Notice } from "@/components/ui/field";
import { useWrite } from "@/components/use-write";

/** Plays a clip with the current timecode at the episode's rate; the editor sets in and out points. */
export function ClipPlayer({ clipId, url, rate, startTimecode, initialIn, initialOut, canEdit }: { clipId: string; url: string; rate: Rate; startTimecode: string | null; initialIn: number | null; initialOut: number | null; canEdit: boolean }) {
  const write = useWrite({ scope: `clip:${clipId}` });
  const video = useRef<HTMLVideoElement>(null);
  const [frame, setFrame] = useState(0);
  const [inF, setIn] = useState(initialIn);
  const [outF, setOut] = useState(initialOut);
  const [msg, setMsg] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const offset = startTimecode ? (() => {
    const p = parseTimecode(startTimecode.replace(/[;.]/, ":"), { ...rate, dropFrame: false });
    return p.ok ? p.frames : 0;
  })() : null;
  const toFrame = (seconds: number) => Math.floor((seconds * rate.num) / rate.den + 1e-6);

  async function save(patch: { inFrame?: number | null; outFrame?: number | null }) {
    let body: { clip: { inFrame: number | null; outFrame: number | null } };
    try {
      body = await write(`/api/clips/${clipId}`, "PATCH", patch);
    } catch (e) {
      return setMsg({ tone: "error", text: (e as Error).message });
    }
    setIn(body.clip.inFrame);
    setOut(body.clip.outFrame);
    setMsg({ tone: "ok", text: "Saved." });
  }

  return (
    <div className="space-y-3">
      <div className="relative overflow-hidden rounded-plank bg-black">
        <video ref={video} src={url} controls className="mx-auto max-h-[60vh] w-full" onTimeUpdate={(e) => setFrame(toFrame(e.currentTarget.currentTime))} onSeeked={(e) => setFrame(toFrame(e.currentTarget.currentTime))} data-testid="clip-video" />
        <div className="num pointer-events-none absolute left-2 top-2 rounded-plank bg-black/70 px-2 py-0.5 text-sm text-white" data-testid="clip-timecode" aria-live="off">
          {formatTimecode(frame, rate)}
          {offset != null ? <span className="ml-2 text-timber-300">source {formatTimecode(frame + offset, { ...rate, dropFrame: false })}</span> : null}
        </div>
      </div>
      <div className="flex flex-wrap items-center gap-3 text-sm">
        <span>
          In <span className="num">{inF != null ? formatTimecode(inF, rate) : "—"}</span>
        </span>
        <span>
          Out <span className="num">{outF != null ? formatTimecode(outF, rate) : "—"}</span>
        </span>
        {canEdit ? (
          <>
            <Button onClick={() => void save({ inFrame: frame })}>Set in here</Button>
            <Button onClick={() => void save({ outFrame: frame })}>Set out here</Button>
            <Button variant="quiet" onClick={() => void save({ inFrame: null, outFrame: null })}>
              Clear in/out
            </Button>
          </>
        ) : null}
      </div>
      {msg ? <Notice tone={msg.tone}>{msg.text}</Notice> : null}
    </div>
  );
}
