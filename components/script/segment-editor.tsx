"use client";
import { CheckboxLabel } from "@/components/ui/checkbox";
import { forwardRef, useEffect, useImperativeHandle, useRef, useState } from "react";
import { useSortable } from "@dnd-kit/sortable";
import { CSS } from "@dnd-kit/utilities";
import { SEGMENT_KINDS, SEGMENT_KIND_LABELS, type TimedSegment } from "@/lib/script-timing";
import { formatTimecode, framesToSeconds, msToFrames, parseTimecode, type Rate } from "@/lib/timecode";
import { useSegmentAutosave, type SaveState } from "./use-segment-autosave";
import type { SegmentDto } from "@/lib/schemas/script";

export type { SaveState };

export interface SegmentHandle {
  /** Saves any pending text now; resolves to the stored segment or null when it could not be saved. */
  flush(): Promise<SegmentDto | null>;
  focusAt(pos: "start" | "end"): void;
}

interface Props {
  segment: SegmentDto;
  index: number;
  timing: TimedSegment | undefined;
  rate: Rate;
  steps: { id: string; title: string }[];
  canWrite: boolean;
  canAnnotate: boolean;
  chapterProblems: string[];
  onDraft: (id: string, text: string) => void;
  onSaved: (s: SegmentDto) => void;
  onState: (id: string, s: SaveState) => void;
  onSplit: (id: string, before: string, after: string) => void;
  onJoinPrevious: (id: string) => void;
  onMove: (id: string, delta: -1 | 1) => void;
  onInsertAfter: (id: string) => void;
  onDelete: (id: string) => void;
  /** Others editing this segment right now (from live presence). */
  editingBy?: string[];
  onPresence?: (segmentId: string | null) => void;
}

function secs(frames: number, rate: Rate) {
  return framesToSeconds(frames, rate).toFixed(1);
}

export const SegmentEditor = forwardRef<SegmentHandle, Props>(function SegmentEditor(props, ref) {
  const { segment, index, timing, rate, steps, canWrite, canAnnotate, chapterProblems } = props;
  const { onDraft, onSaved, onState } = props;
  const seenVersion = useRef(segment.version);
  const autosave = useSegmentAutosave(segment, {
    onDraft: (t) => onDraft(segment.id, t),
    onSaved: (stored) => {
      // Our own save: the pin field already shows what we saved (and may hold new typing).
      seenVersion.current = Math.max(seenVersion.current, stored.version);
      onSaved(stored);
    },
    onState: (st) => onState(segment.id, st),
  });
  const { base, text, state, conflict, fieldError, setFieldError, save, flush: flushText } = autosave;
  const [pinText, setPinText] = useState(segment.pinnedStartFrame != null ? formatTimecode(segment.pinnedStartFrame, rate) : "");
  const area = useRef<HTMLTextAreaElement>(null);

  // A newer stored version from elsewhere (another writer, or a structural change): its pin shows.
  useEffect(() => {
    if (segment.version > seenVersion.current) {
      seenVersion.current = segment.version;
      setPinText(segment.pinnedStartFrame != null ? formatTimecode(segment.pinnedStartFrame, rate) : "");
    }
  }, [segment, rate]);

  useImperativeHandle(ref, () => ({
    flush: flushText,
    focusAt(pos) {
      const el = area.current;
      if (!el) return;
      el.focus();
      const at = pos === "start" ? 0 : el.value.length;
      el.setSelectionRange(at, at);
    },
  }));

  function onChange(v: string) {
    autosave.change(v);
  }

  async function resolve(textToSave: string) {
    if (!conflict) return;
    setPinText(conflict.theirs.pinnedStartFrame != null ? formatTimecode(conflict.theirs.pinnedStartFrame, rate) : "");
    await autosave.resolve(textToSave);
  }

  const { attributes, listeners, setNodeRef, transform, transition } = useSortable({ id: segment.id, disabled: !canWrite });
  const drift = timing?.drift ?? null;
  const driftText =
    drift == null ? null : drift === 0 ? "on the pin" : drift > 0 ? `the script before runs ${secs(drift, rate)} s past this pin` : `the script before ends ${secs(-drift, rate)} s before this pin`;

  return (
    <li ref={setNodeRef} style={{ transform: CSS.Transform.toString(transform), transition }} className="grid grid-cols-[7.5rem_1fr] gap-3 rounded-plank border border-timber-300 bg-white p-3" data-testid="segment" data-segment-id={segment.id}>
      <div className="space-y-1 text-xs">
        <div className="flex items-center gap-1">
          {canWrite ? (
            <button type="button" className="cursor-grab rounded-plank px-1 text-walnut-500 hover:bg-timber-100" aria-label={`Drag segment ${index + 1} to reorder`} {...attributes} {...listeners}>
              ⠿
            </button>
          ) : null}
          <span className="num text-walnut-600">#{index + 1}</span>
        </div>
        <p className="num text-sm text-walnut-900" data-testid="segment-start" title="start">
          {timing ? formatTimecode(timing.start, rate) : "—"}
        </p>
        <p className="num text-walnut-600" title="end">
          {timing ? formatTimecode(timing.end, rate) : ""}
        </p>
        <p className="num text-walnut-600">{timing ? `${secs(timing.duration, rate)} s · ${timing.words} w` : ""}</p>
        {driftText ? (
          <p className={`rounded-plank border px-1 ${drift === 0 ? "border-pass-600 text-pass-700" : "border-heed-600 text-heed-800"}`} data-testid="drift">
            Drift: {driftText}
          </p>
        ) : null}
        <p aria-live="polite" className="text-walnut-600" data-testid="save-state">
          {state === "saved" ? "Saved" : state === "saving" ? "Saving…" : state === "pending" ? "Unsaved" : state === "offline" ? "Offline, retrying" : "Needs merge"}
        </p>
      </div>
      <div className="min-w-0 space-y-2">
        {canWrite ? (
        <div className="flex flex-wrap items-center gap-2 text-sm">
            <select aria-label="Segment kind" disabled={!canWrite} className="rounded-plank border border-timber-300 bg-white px-1 py-0.5" value={base.kind} onChange={(e) => void save({ kind: e.target.value as SegmentDto["kind"] })}>
              {SEGMENT_KINDS.map((k) => (
                <option key={k} value={k}>
                  {SEGMENT_KIND_LABELS[k]}
                </option>
              ))}
            </select>
            <select aria-label="Build step" disabled={!canWrite} className="max-w-56 rounded-plank border border-timber-300 bg-white px-1 py-0.5" value={base.stepId ?? ""} onChange={(e) => void save({ stepId: e.target.value || null })}>
              <option value="">No build step</option>
              {steps.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.title}
                </option>
              ))}
            </select>
            <label className="flex items-center gap-1">
              <span className="text-walnut-700">Pin at</span>
              <input
                aria-label="Pinned start timecode"
                disabled={!canWrite}
                className="num w-32 rounded-plank border border-timber-300 px-1 py-0.5"
                placeholder={rate.dropFrame ? "00:00:00;00" : "00:00:00:00"}
                value={pinText}
                onChange={(e) => setPinText(e.target.value)}
                onBlur={() => {
                  const v = pinText.trim();
                  if (!v) {
                    if (base.pinnedStartFrame != null) void save({ pinnedStartFrame: null });
                    return;
                  }
                  const p = parseTimecode(v, rate);
                  if (!p.ok) return setFieldError(`Pin: ${p.message}`);
                  setPinText(formatTimecode(p.frames, rate));
                  if (p.frames !== base.pinnedStartFrame) void save({ pinnedStartFrame: p.frames });
                }}
              />
            </label>
            <label className="flex items-center gap-1">
              <span className="text-walnut-700">Fixed length (s)</span>
              <input
                aria-label="Fixed length in seconds"
                disabled={!canWrite}
                inputMode="decimal"
                className="num w-16 rounded-plank border border-timber-300 px-1 py-0.5"
                defaultValue={base.explicitDurationFrames != null ? secs(base.explicitDurationFrames, rate) : ""}
                onBlur={(e) => {
                  const v = e.target.value.trim();
                  if (!v) return void (base.explicitDurationFrames != null && save({ explicitDurationFrames: null }));
                  const n = Number(v);
                  if (!Number.isFinite(n) || n < 0) return setFieldError("Fixed length: enter seconds, e.g. 4.5");
                  void save({ explicitDurationFrames: msToFrames(n * 1000, rate) });
                }}
              />
            </label>
          </div>
        ) : (
          // Roles that cannot edit the words read them as text, not as greyed-out controls.
          <p className="flex flex-wrap gap-x-3 text-sm text-walnut-700" data-testid="segment-facts">
            <span>{SEGMENT_KIND_LABELS[base.kind]}</span>
            {base.stepId ? <span>Step: {steps.find((s) => s.id === base.stepId)?.title ?? "a removed step"}</span> : null}
            {base.pinnedStartFrame != null ? <span className="num">Pinned at {formatTimecode(base.pinnedStartFrame, rate)}</span> : null}
            {base.explicitDurationFrames != null ? <span className="num">Fixed length {secs(base.explicitDurationFrames, rate)} s</span> : null}
          </p>
        )}
        {props.editingBy?.length ? (
          <p className="text-xs font-medium text-heed-800" data-testid="presence" role="status">
            {props.editingBy.join(", ")} {props.editingBy.length === 1 ? "is" : "are"} editing this segment
          </p>
        ) : null}
        {canWrite ? (
        <textarea
            ref={area}
            onFocus={() => props.onPresence?.(segment.id)}
            aria-label={`Segment ${index + 1} text`}
            readOnly={!canWrite}
            value={text}
            rows={Math.max(2, Math.ceil(text.length / 90))}
            className="w-full resize-y rounded-plank border border-timber-200 bg-timber-50/40 px-2 py-1.5 text-[15px] leading-relaxed focus:bg-white"
            onChange={(e) => onChange(e.target.value)}
            onBlur={() => {
              void flushText();
              props.onPresence?.(null);
            }}
            onKeyDown={(e) => {
              if (!canWrite) return;
              const el = e.currentTarget;
              if ((e.ctrlKey || e.metaKey) && e.key === "Enter") {
                e.preventDefault();
                props.onSplit(segment.id, el.value.slice(0, el.selectionStart), el.value.slice(el.selectionEnd));
              } else if (e.key === "Backspace" && el.selectionStart === 0 && el.selectionEnd === 0 && index > 0) {
                e.preventDefault();
                props.onJoinPrevious(segment.id);
              } else if (e.altKey && (e.key === "ArrowUp" || e.key === "ArrowDown")) {
                e.preventDefault();
                props.onMove(segment.id, e.key === "ArrowUp" ? -1 : 1);
              }
            }}
          />
        ) : (
          <p className="whitespace-pre-wrap border-l-2 border-timber-300 py-0.5 pl-3 text-[15px] leading-relaxed" aria-label={`Segment ${index + 1} text`} data-testid="segment-text">
            {text || <span className="text-walnut-600">(no words yet)</span>}
          </p>
        )}
        {fieldError ? (
          <p role="alert" className="text-sm text-fault-700">
            {fieldError}
          </p>
        ) : null}
        {conflict ? (
          <div className="space-y-2 rounded-plank border-2 border-heed-600 bg-heed-50 p-2 text-sm" data-testid="conflict" role="group" aria-label="Merge two versions">
            <p className="font-medium">Someone else saved this segment while you were writing. Nothing was overwritten. Choose what to keep:</p>
            <div className="grid gap-2 sm:grid-cols-2">
              <div>
                <p className="text-xs font-bold">Your words</p>
                <p className="whitespace-pre-wrap rounded-plank bg-white p-1" data-testid="conflict-mine">
                  {conflict.mine}
                </p>
              </div>
              <div>
                <p className="text-xs font-bold">Saved by someone else (version {conflict.theirs.version})</p>
                <p className="whitespace-pre-wrap rounded-plank bg-white p-1" data-testid="conflict-theirs">
                  {conflict.theirs.text}
                </p>
              </div>
            </div>
            <label className="block text-xs font-bold" htmlFor={`merge-${segment.id}`}>
              Merged text
            </label>
            <textarea id={`merge-${segment.id}`} className="w-full rounded-plank border border-timber-300 bg-white p-1" rows={4} value={conflict.merged} onChange={(e) => autosave.editMerged(e.target.value)} />
            <div className="flex flex-wrap gap-2">
              <button type="button" className="rounded-plank border border-chalk-700 bg-chalk-600 px-2 py-1 text-white" onClick={() => void resolve(conflict.merged)}>
                Save merged text
              </button>
              <button type="button" className="rounded-plank border border-timber-300 bg-white px-2 py-1" onClick={() => void resolve(conflict.mine)}>
                Keep mine
              </button>
              <button type="button" className="rounded-plank border border-timber-300 bg-white px-2 py-1" onClick={() => void resolve(conflict.theirs.text)}>
                Take theirs
              </button>
            </div>
          </div>
        ) : null}
        <div className="flex flex-wrap items-center gap-3 text-sm">
          {canAnnotate ? (
            <CheckboxLabel label="Chapter starts here" checked={base.chapterStart} onChange={(e) => void save({ chapterStart: e.target.checked })} />
          ) : base.chapterStart ? (
            <span className="font-medium">Chapter: {base.chapterTitle || "(untitled)"}</span>
          ) : null}
          {base.chapterStart && canAnnotate ? (
            <input
              aria-label="Chapter title"
              disabled={!canAnnotate}
              className="rounded-plank border border-timber-300 px-1 py-0.5"
              defaultValue={base.chapterTitle ?? ""}
              placeholder="Chapter title"
              onBlur={(e) => e.target.value !== (base.chapterTitle ?? "") && void save({ chapterTitle: e.target.value || null })}
            />
          ) : null}
          {chapterProblems.map((p) => (
            <span key={p} className="rounded-plank border border-fault-700 px-1 text-xs text-fault-700" data-testid="chapter-problem">
              Chapter: {p}
            </span>
          ))}
        </div>
        {canAnnotate ? (
          <label className="block text-xs text-walnut-700">
            Note to the editor
            <input
              className="mt-0.5 block w-full rounded-plank border border-timber-200 px-1 py-0.5 text-sm"
              defaultValue={base.editorNotes}
              onBlur={(e) => e.target.value !== base.editorNotes && void save({ editorNotes: e.target.value })}
            />
          </label>
        ) : base.editorNotes ? (
          <p className="text-xs text-walnut-700">Note to the editor: {base.editorNotes}</p>
        ) : null}
        {canWrite ? (
          <div className="flex flex-wrap gap-2 text-xs">
            <button type="button" className="rounded-plank border border-timber-300 px-2 py-0.5 hover:bg-timber-100" onClick={() => props.onInsertAfter(segment.id)}>
              Insert segment after
            </button>
            <button type="button" className="rounded-plank border border-timber-300 px-2 py-0.5 hover:bg-timber-100" onClick={() => props.onMove(segment.id, -1)} aria-label={`Move segment ${index + 1} up`}>
              ↑
            </button>
            <button type="button" className="rounded-plank border border-timber-300 px-2 py-0.5 hover:bg-timber-100" onClick={() => props.onMove(segment.id, 1)} aria-label={`Move segment ${index + 1} down`}>
              ↓
            </button>
            <button type="button" className="rounded-plank border border-timber-300 px-2 py-0.5 hover:bg-timber-100" onClick={() => props.onDelete(segment.id)}>
              Delete
            </button>
          </div>
        ) : null}
      </div>
    </li>
  );
});
