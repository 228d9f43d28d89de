"use client";
import { useState } from "react";

/** A cell that turns into an input on click; Enter or leaving saves, Escape cancels. */
export function InlineEdit({
  value,
  display = value || <span className="text-walnut-500">—</span>,
  label,
  canEdit,
  onSave,
}: {
  value: string;
  display?: React.ReactNode;
  label: string;
  canEdit: boolean;
  /** Resolves to an error message to show beside the input, or null when saved. */
  onSave: (v: string) => Promise<string | null>;
}) {
  const [editing, setEditing] = useState(false);
  const [draft, setDraft] = useState(value);
  const [error, setError] = useState<string | null>(null);
  if (!canEdit) return <>{display}</>;
  if (!editing)
    return (
      // The visible value stays part of the button's name (WCAG 2.5.3), after what the button edits.
      <button type="button" className="jb-tap w-full rounded-plank px-1 text-left hover:bg-timber-100" onClick={() => (setDraft(value), setEditing(true))}>
        <span className="sr-only">Edit {label}: </span>
        {display}
      </button>
    );
  const save = async () => {
    if (draft === value) return setEditing(false);
    const err = await onSave(draft);
    if (err) setError(err);
    else {
      setError(null);
      setEditing(false);
    }
  };
  return (
    <span className="block">
      <input
        autoFocus
        aria-label={label}
        aria-invalid={error ? true : undefined}
        className="w-full min-w-16 rounded-plank border border-chalk-600 px-1 aria-[invalid]:border-fault-700"
        value={draft}
        onChange={(e) => setDraft(e.target.value)}
        onBlur={save}
        onKeyDown={(e) => {
          if (e.key === "Enter") void save();
          if (e.key === "Escape") setEditing(false);
        }}
      />
      {error ? (
        <span role="alert" className="block text-xs text-fault-700">
          {error}
        </span>
      ) : null}
    </span>
  );
}
