"use client";
/**
 * Autosave for one script segment. Words typed are saved after a pause
 * (debounced); every save names the version it was based on. Saves of one
 * segment run one at a time through a TanStack mutation scope, each reading
 * the newest stored version when it starts, so an autosave and a pin change
 * never race each other into a conflict. A 409 stops saving and offers a
 * three-way merge; a network failure retries; words typed while a save was on
 * its way go out next.
 */
import { useCallback, useEffect, useRef, useState } from "react";
import { useMutation } from "@tanstack/react-query";
import { ApiError, send } from "@/components/fetch-json";
import type { SegmentDto } from "@/lib/schemas/script";
import { proposeMerge } from "./merge";

export type SaveState = "saved" | "pending" | "saving" | "offline" | "conflict";
export interface Conflict {
  theirs: SegmentDto;
  mine: string;
  merged: string;
}
export type SegmentFields = Partial<Omit<SegmentDto, "id" | "version" | "position" | "updatedAt" | "updatedBy">>;

export const AUTOSAVE_DEBOUNCE_MS = 700;
export const OFFLINE_RETRY_MS = 3000;

export function segmentSaveScope(segmentId: string) {
  return { id: `segment:${segmentId}` };
}

export function useSegmentAutosave(
  segment: SegmentDto,
  opts: { onSaved?: (s: SegmentDto) => void; onState?: (s: SaveState) => void; onDraft?: (text: string) => void } = {},
) {
  const [base, setBase] = useState(segment);
  const [text, setText] = useState(segment.text);
  const [state, setState] = useState<SaveState>("saved");
  const [conflict, setConflictState] = useState<Conflict | null>(null);
  const [fieldError, setFieldError] = useState<string | null>(null);
  const timer = useRef<ReturnType<typeof setTimeout> | null>(null);
  const conflictRef = useRef<Conflict | null>(null);
  const inflight = useRef<Promise<SegmentDto | null> | null>(null);
  const textRef = useRef(text);
  const baseRef = useRef(base);
  const optsRef = useRef(opts);
  useEffect(() => {
    optsRef.current = opts;
  });

  // A newer stored version arrives (someone else, or a structural change): adopt it unless we hold unsaved words.
  useEffect(() => {
    if (segment.version > baseRef.current.version) {
      const dirty = textRef.current !== baseRef.current.text;
      baseRef.current = segment;
      setBase(segment);
      if (!dirty) {
        textRef.current = segment.text;
        setText(segment.text);
      }
    }
  }, [segment]);

  const report = useCallback((s: SaveState) => {
    setState(s);
    optsRef.current.onState?.(s);
  }, []);

  const setConflict = useCallback((c: Conflict | null) => {
    conflictRef.current = c;
    setConflictState(c);
  }, []);

  const mutation = useMutation({
    scope: segmentSaveScope(segment.id),
    mutationFn: async (fields: SegmentFields): Promise<SegmentDto | null> => {
      if (conflictRef.current) return null;
      report("saving");
      try {
        const { segment: stored } = await send<{ segment: SegmentDto }>(`/api/segments/${segment.id}`, "PATCH", { version: baseRef.current.version, ...fields });
        // Here, not in the caller: the next save in the scope may start before the caller hears of this one.
        baseRef.current = stored;
        return stored;
      } catch (e) {
        const err = e as ApiError;
        if (err.status === 409 && err.current) {
          const theirs = err.current as SegmentDto;
          conflictRef.current = { theirs, mine: textRef.current, merged: proposeMerge(baseRef.current.text, textRef.current, theirs.text).text };
        }
        throw e;
      }
    },
  });
  const { mutateAsync } = mutation;

  const flushRef = useRef<() => Promise<SegmentDto | null>>(async () => null);

  const save = useCallback(
    async (fields: SegmentFields): Promise<SegmentDto | null> => {
      try {
        const stored = await mutateAsync(fields);
        if (!stored) return null;
        setBase(stored);
        optsRef.current.onSaved?.(stored);
        setFieldError(null);
        report(textRef.current === stored.text ? "saved" : "pending");
        return stored;
      } catch (e) {
        const err = e as ApiError;
        if (err.status === 409 && err.current) {
          setConflict(conflictRef.current);
          report("conflict");
        } else if (err.status === 0) {
          report("offline");
          timer.current = setTimeout(() => void flushRef.current(), OFFLINE_RETRY_MS);
        } else {
          setFieldError(err.fields ? Object.values(err.fields).flat().join("; ") : err.message);
          report("pending");
        }
        return null;
      }
    },
    [mutateAsync, report, setConflict],
  );

  /** Saves pending words now; resolves to the stored segment, or null when they could not be saved. */
  const flush = useCallback(async (): Promise<SegmentDto | null> => {
    if (timer.current) clearTimeout(timer.current);
    timer.current = null;
    // Wait for every save on its way (one may start another for words typed meanwhile).
    while (inflight.current) await inflight.current;
    if (conflictRef.current) return null;
    if (textRef.current === baseRef.current.text) return baseRef.current;
    const p = save({ text: textRef.current });
    inflight.current = p;
    const r = await p;
    inflight.current = null;
    // Words typed while that save was on its way go out next.
    if (r && textRef.current !== r.text) return flushRef.current();
    return r;
  }, [save]);
  useEffect(() => {
    flushRef.current = flush;
  }, [flush]);

  useEffect(() => () => void (timer.current && clearTimeout(timer.current)), []);

  /** The writer typed: keep the words and save them after a pause. */
  const change = useCallback(
    (v: string) => {
      textRef.current = v;
      setText(v);
      optsRef.current.onDraft?.(v);
      report("pending");
      if (timer.current) clearTimeout(timer.current);
      timer.current = setTimeout(() => void flushRef.current(), AUTOSAVE_DEBOUNCE_MS);
    },
    [report],
  );

  /** Ends a conflict by saving the chosen text on top of the other writer's version. */
  const resolve = useCallback(
    async (textToSave: string) => {
      const c = conflictRef.current;
      if (!c) return null;
      baseRef.current = c.theirs;
      setBase(c.theirs);
      setConflict(null);
      textRef.current = textToSave;
      setText(textToSave);
      optsRef.current.onDraft?.(textToSave);
      return save({ text: textToSave });
    },
    [save, setConflict],
  );

  const editMerged = useCallback((merged: string) => conflictRef.current && setConflict({ ...conflictRef.current, merged }), [setConflict]);

  return { base, text, state, conflict, fieldError, setFieldError, change, save, flush, resolve, editMerged };
}
