"use client";
import Link from "next/link";
import { useCallback, useMemo, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { createColumnHelper, flexRender, getCoreRowModel, getFilteredRowModel, getSortedRowModel, useReactTable, type RowSelectionState, type SortingState } from "@tanstack/react-table";
import { SHOT_KINDS, SHOT_KIND_LABELS, SHOT_STATUSES, SHOT_STATUS_LABELS, type ShotDto } from "@/lib/schemas/footage";
import { Button } from "@/components/ui/button";
import { TableHead } from "@/components/ui/table-head";
import { InlineEdit } from "@/components/ui/inline-edit";
import { Notice } from "@/components/ui/field";
import { Checkbox } from "@/components/ui/checkbox";
import { fetchJson } from "@/components/fetch-json";
import { useWrite } from "@/components/use-write";

type Shot = ShotDto;

const col = createColumnHelper<Shot>();

/** A choice from a fixed list: a select for those who may change it, its label as text for the rest. */
function ChoiceCell<T extends string>({ canEdit, label, value, options, labels, onChange }: { canEdit: boolean; label: string; value: T; options: readonly T[]; labels: Record<T, string>; onChange: (v: T) => void }) {
  if (!canEdit) return <>{labels[value]}</>;
  return (
    <select aria-label={label} className="jb-tap rounded-plank border border-timber-300 bg-white px-1" value={value} onChange={(e) => onChange(e.target.value as T)}>
      {options.map((o) => (
        <option key={o} value={o}>
          {labels[o]}
        </option>
      ))}
    </select>
  );
}

export function ShotList({ episodeId, base, canEdit, steps }: { episodeId: string; base: string; canEdit: boolean; steps: { id: string; title: string; coverageKinds: string[] }[] }) {
  const write = useWrite({ scope: `shots:${episodeId}` });
  const qc = useQueryClient();
  const key = useMemo(() => ["shots", episodeId], [episodeId]);
  const { data } = useQuery({ queryKey: key, queryFn: () => fetchJson(`/api/episodes/${episodeId}/shots`) as Promise<{ shots: Shot[] }> });
  const [sorting, setSorting] = useState<SortingState>([]);
  const [selection, setSelection] = useState<RowSelectionState>({});
  const [statusFilter, setStatusFilter] = useState("");
  const [text, setText] = useState("");
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [planStep, setPlanStep] = useState("");
  const [newShot, setNewShot] = useState({ kind: "broll", description: "", stepId: "" });
  const refresh = useCallback(() => qc.invalidateQueries({ queryKey: key }), [qc, key]);
  const patch = useCallback(
    async (id: string, body: Record<string, unknown>) => {
      try {
        await write(`/api/shots/${id}`, "PATCH", body);
        await refresh();
      } catch (e) {
        setMessage({ tone: "error", text: (e as Error).message });
      }
    },
    [refresh, write],
  );

  // The table's data and columns must keep their identity between renders:
  // a fresh array on every render makes the table reset its page index, which
  // renders again, which makes a fresh array (a render loop that locks the tab).
  const rows = useMemo(() => {
    const needle = text.toLowerCase();
    return (data?.shots ?? []).filter((s) => (!statusFilter || s.status === statusFilter) && (!needle || `${s.description} ${s.framing} ${s.cameraNotes}`.toLowerCase().includes(needle)));
  }, [data, statusFilter, text]);
  const columns = useMemo(() => {
    const stepTitle = new Map(steps.map((s) => [s.id, s.title]));
    return [
      ...(canEdit
        ? [
            col.display({
              id: "select",
              header: ({ table }) => (
                <label className="jb-tap inline-flex items-center justify-center">
                  <Checkbox aria-label="Select all shots" checked={table.getIsAllRowsSelected()} onChange={table.getToggleAllRowsSelectedHandler()} />
                </label>
              ),
              cell: ({ row }) => (
                <label className="jb-tap inline-flex items-center justify-center">
                  <Checkbox aria-label={`Select ${row.original.description}`} checked={row.getIsSelected()} onChange={row.getToggleSelectedHandler()} />
                </label>
              ),
            }),
          ]
        : []),
      col.accessor("priority", { header: "Pri", cell: (c) => <InlineEdit canEdit={canEdit} label={`priority of ${c.row.original.description}`} value={String(c.getValue())} onSave={(v) => patch(c.row.original.id, { priority: Number(v) }).then(() => null)} /> }),
      col.accessor("kind", {
        header: "Kind",
        cell: (c) => <ChoiceCell canEdit={canEdit} label={`Kind of ${c.row.original.description}`} value={c.getValue()} options={SHOT_KINDS} labels={SHOT_KIND_LABELS} onChange={(kind) => void patch(c.row.original.id, { kind })} />,
      }),
      col.accessor("description", { header: "What it shows", cell: (c) => <InlineEdit canEdit={canEdit} label={`description of ${c.getValue()}`} value={c.getValue()} onSave={(v) => patch(c.row.original.id, { description: v }).then(() => null)} /> }),
      col.accessor((s) => (s.stepId ? (stepTitle.get(s.stepId) ?? "") : ""), { id: "step", header: "Build step" }),
      col.accessor("framing", { header: "Framing", cell: (c) => <InlineEdit canEdit={canEdit} label={`framing of ${c.row.original.description}`} value={c.getValue()} onSave={(v) => patch(c.row.original.id, { framing: v }).then(() => null)} /> }),
      col.accessor("cameraNotes", { header: "Camera and lens", cell: (c) => <InlineEdit canEdit={canEdit} label={`camera notes of ${c.row.original.description}`} value={c.getValue()} onSave={(v) => patch(c.row.original.id, { cameraNotes: v }).then(() => null)} /> }),
      col.accessor("status", {
        header: "Status",
        cell: (c) => <ChoiceCell canEdit={canEdit} label={`Status of ${c.row.original.description}`} value={c.getValue()} options={SHOT_STATUSES} labels={SHOT_STATUS_LABELS} onChange={(status) => void patch(c.row.original.id, { status })} />,
      }),
      col.display({ id: "gap", header: "From gap", cell: (c) => (c.row.original.gapId ? "yes" : "") }),
    ];
  }, [canEdit, steps, patch]);
  const table = useReactTable({ data: rows, columns, state: { sorting, rowSelection: selection }, getRowId: (r) => r.id, enableRowSelection: canEdit, autoResetAll: false, onRowSelectionChange: setSelection, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel(), getFilteredRowModel: getFilteredRowModel() });
  const selected = Object.keys(selection).filter((k) => selection[k]);

  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3 text-sm">
        <label>
          <span className="block text-walnut-700">Status</span>
          <select className="rounded-plank border border-timber-300 bg-white px-1 py-1" value={statusFilter} onChange={(e) => setStatusFilter(e.target.value)}>
            <option value="">Any</option>
            {SHOT_STATUSES.map((s) => (
              <option key={s} value={s}>
                {SHOT_STATUS_LABELS[s]}
              </option>
            ))}
          </select>
        </label>
        <label>
          <span className="block text-walnut-700">Find</span>
          <input className="rounded-plank border border-timber-300 px-1 py-1" value={text} onChange={(e) => setText(e.target.value)} placeholder="description, framing…" />
        </label>
        <a className="rounded-plank border border-timber-300 bg-white px-3 py-1 hover:bg-timber-100" href={`/api/episodes/${episodeId}/shots/csv`}>
          Export CSV
        </a>
        <Link className="rounded-plank border border-timber-300 bg-white px-3 py-1 hover:bg-timber-100" href={`${base}/shots/print`}>
          Print by build step
        </Link>
        {canEdit && selected.length ? (
          <span className="flex items-center gap-1" data-testid="bulk">
            {selected.length} selected: set
            {SHOT_STATUSES.map((s) => (
              <Button
                key={s}
                onClick={async () => {
                  try {
                    await write(`/api/episodes/${episodeId}/shots/bulk`, "POST", { ids: selected, status: s });
                    setSelection({});
                    setMessage({ tone: "ok", text: `${selected.length} shots set to ${SHOT_STATUS_LABELS[s]}.` });
                    await refresh();
                  } catch (e) {
                    setMessage({ tone: "error", text: (e as Error).message });
                  }
                }}
              >
                {SHOT_STATUS_LABELS[s]}
              </Button>
            ))}
          </span>
        ) : null}
      </div>
      {message ? <Notice tone={message.tone}>{message.text}</Notice> : null}
      {data && data.shots.length === 0 ? (
        <div className="rounded-plank border border-dashed border-timber-400 bg-white p-4 text-sm" data-testid="shots-empty">
          <strong>No shots planned yet.</strong> {canEdit ? "Create the shots a build step needs from its planned coverage below, or add one by hand." : "The team plans the shots."}
        </div>
      ) : null}
      {rows.length ? (
        <div className="overflow-x-auto rounded-plank border border-timber-300 bg-white">
          <table className="w-full border-collapse text-sm" data-testid="shot-table">
            <TableHead table={table} />
            <tbody>
              {table.getRowModel().rows.map((r) => (
                <tr key={r.id} className="border-b border-timber-200 align-top" data-testid="shot-row" data-status={r.original.status}>
                  {r.getVisibleCells().map((c) => (
                    <td key={c.id} className="px-2 py-1">
                      {flexRender(c.column.columnDef.cell, c.getContext())}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      ) : null}
      {canEdit ? (
        <div className="grid gap-3 md:grid-cols-2">
          <div className="flex flex-wrap items-end gap-2 rounded-plank border border-timber-300 bg-white p-3 text-sm">
            <label>
              <span className="block text-walnut-700">Planned coverage of step</span>
              <select className="rounded-plank border border-timber-300 px-1 py-1" value={planStep} onChange={(e) => setPlanStep(e.target.value)}>
                <option value="">Choose a build step</option>
                {steps.map((s) => (
                  <option key={s.id} value={s.id} disabled={!s.coverageKinds.length}>
                    {s.title} {s.coverageKinds.length ? `(${s.coverageKinds.length})` : "(none planned)"}
                  </option>
                ))}
              </select>
            </label>
            <Button
              disabled={!planStep}
              onClick={async () => {
                try {
                  const r = await write(`/api/steps/${planStep}/planned-shots`, "POST");
                  setMessage({ tone: "ok", text: `${r.shots.length} shots added${r.skipped ? `, ${r.skipped} already on the list` : ""}.` });
                  await refresh();
                } catch (e) {
                  setMessage({ tone: "error", text: (e as Error).message });
                }
              }}
            >
              Add its shots
            </Button>
          </div>
          <form
            className="flex flex-wrap items-end gap-2 rounded-plank border border-timber-300 bg-white p-3 text-sm"
            aria-label="Add a shot"
            onSubmit={async (e) => {
              e.preventDefault();
              try {
                await write(`/api/episodes/${episodeId}/shots`, "POST", { kind: newShot.kind, description: newShot.description, stepId: newShot.stepId || null });
                setNewShot({ ...newShot, description: "" });
                await refresh();
              } catch (err) {
                setMessage({ tone: "error", text: (err as Error).message });
              }
            }}
          >
            <select aria-label="Kind" className="rounded-plank border border-timber-300 px-1 py-1" value={newShot.kind} onChange={(e) => setNewShot({ ...newShot, kind: e.target.value })}>
              {SHOT_KINDS.map((k) => (
                <option key={k} value={k}>
                  {SHOT_KIND_LABELS[k]}
                </option>
              ))}
            </select>
            <input aria-label="What it shows" placeholder="What the shot shows" className="min-w-48 flex-1 rounded-plank border border-timber-300 px-1 py-1" value={newShot.description} onChange={(e) => setNewShot({ ...newShot, description: e.target.value })} />
            <select aria-label="Build step" className="rounded-plank border border-timber-300 px-1 py-1" value={newShot.stepId} onChange={(e) => setNewShot({ ...newShot, stepId: e.target.value })}>
              <option value="">No step</option>
              {steps.map((s) => (
                <option key={s.id} value={s.id}>
                  {s.title}
                </option>
              ))}
            </select>
            <Button type="submit" variant="primary">
              Add shot
            </Button>
          </form>
        </div>
      ) : null}
    </div>
  );
}
