"use client";
import { useEffect, useRef, useState } from "react";
import { SEGMENT_KIND_LABELS, type SegmentKind } from "@/lib/script-timing";

interface Item {
  id: string;
  kind: SegmentKind;
  text: string;
  start: string;
  durationMs: number;
  step: string | null;
}

/**
 * Large type for recording: the current segment is highlighted and, when
 * running, the view moves on at the presenter's rate. Space starts and
 * pauses; the arrow keys step through.
 */
export function ReadThrough({ items, wpm }: { items: Item[]; wpm: number }) {
  const [current, setCurrent] = useState(0);
  const [running, setRunning] = useState(false);
  const refs = useRef<(HTMLElement | null)[]>([]);

  useEffect(() => {
    refs.current[current]?.scrollIntoView({ behavior: "smooth", block: "center" });
  }, [current]);

  useEffect(() => {
    if (!running) return;
    const item = items[current];
    // State changes only from the timer, never synchronously in the effect.
    const t = setTimeout(() => (item && current + 1 < items.length ? setCurrent(current + 1) : setRunning(false)), item ? Math.max(500, item.durationMs) : 0);
    return () => clearTimeout(t);
  }, [running, current, items]);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key === " ") {
        e.preventDefault();
        setRunning((r) => !r);
      } else if (e.key === "ArrowDown" || e.key === "ArrowRight") setCurrent((c) => Math.min(items.length - 1, c + 1));
      else if (e.key === "ArrowUp" || e.key === "ArrowLeft") setCurrent((c) => Math.max(0, c - 1));
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  }, [items.length]);

  return (
    <div className="mx-auto max-w-3xl">
      <div className="sticky top-0 z-10 flex items-center gap-3 bg-walnut-900 px-3 py-2 text-timber-50">
        <button type="button" className="rounded-plank bg-chalk-600 px-3 py-1 font-medium" onClick={() => setRunning((r) => !r)}>
          {running ? "Pause" : "Start"}
        </button>
        <span className="text-sm">
          Space to start or pause · arrows to step · {wpm} words a minute
        </span>
        <span className="num ml-auto text-sm" aria-live="polite">
          {current + 1} / {items.length}
        </span>
      </div>
      <ol className="space-y-8 py-[30vh]">
        {items.map((it, i) => (
          <li
            key={it.id}
            ref={(el) => {
              refs.current[i] = el;
            }}
            aria-current={i === current ? "step" : undefined}
            onClick={() => setCurrent(i)}
            className={`cursor-pointer rounded-plank px-4 py-3 transition-colors ${i === current ? "bg-white ring-4 ring-chalk-600" : "text-walnut-600"}`}
            data-testid="read-item"
          >
            <p className="num text-sm text-walnut-600">
              {it.start} · {SEGMENT_KIND_LABELS[it.kind]}
              {it.step ? ` · ${it.step}` : ""}
            </p>
            <p className="text-3xl leading-snug">
              {it.text
                ? it.text.split(/(\{\s*\d+(?:\.\d+)?\s*(?:s|ms)\s*\})/i).map((part, k) =>
                    /^\{/.test(part) ? (
                      <span key={k} className="mx-1 rounded-plank border border-walnut-500 px-1 align-middle text-base text-walnut-700">
                        pause {part.replace(/[{}\s]/g, "")}
                      </span>
                    ) : (
                      <span key={k}>{part}</span>
                    ),
                  )
                : "…"}
            </p>
          </li>
        ))}
      </ol>
    </div>
  );
}
