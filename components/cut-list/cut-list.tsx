"use client";
import { useCallback, useMemo, useState } from "react";
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { formatInches, parseMeasure } from "@/lib/fraction";
import { MM_PER_INCH, PRICING_LABELS, PRICING_UNITS, formatMoney } from "@/lib/materials";
import { Button } from "@/components/ui/button";
import { TableHead } from "@/components/ui/table-head";
import { InlineEdit } from "@/components/ui/inline-edit";
import { Notice } from "@/components/ui/field";
import { ApiError, fetchJson } from "@/components/fetch-json";
import type { CutListDto, MaterialDto } from "@/lib/schemas/build";
import { useWrite } from "@/components/use-write";

type Row = MaterialDto;

function dim(v: number, unit: "in" | "mm") {
  return unit === "in" ? `${formatInches(v)} in` : `${Number(v.toFixed(1))} mm`;
}
function other(v: number, unit: "in" | "mm") {
  return unit === "in" ? `${(v * MM_PER_INCH).toFixed(1)} mm` : `${formatInches(v / MM_PER_INCH)} in`;
}

const col = createColumnHelper<Row>();

export function CutList({ episodeId, canEdit, defaultUnit, currency, steps }: { episodeId: string; canEdit: boolean; defaultUnit: "in" | "mm"; currency: string; steps: { id: string; title: string }[] }) {
  const write = useWrite({ scope: `cut-list:${episodeId}` });
  const qc = useQueryClient();
  const key = useMemo(() => ["cut-list", episodeId], [episodeId]);
  const { data } = useQuery({ queryKey: key, queryFn: () => fetchJson<CutListDto>(`/api/episodes/${episodeId}/materials`) });
  const [sorting, setSorting] = useState<SortingState>([]);
  const [notice, setNotice] = useState<{ tone: "ok" | "error"; text: string; list?: string[] } | null>(null);
  const refresh = useCallback(() => qc.invalidateQueries({ queryKey: key }), [qc, key]);

  const patch = useCallback(async (id: string, body: Record<string, unknown>): Promise<string | null> => {
    try {
      await write(`/api/materials/${id}`, "PATCH", body);
      await refresh();
      return null;
    } catch (e) {
      const f = (e as { fields?: Record<string, string[]> }).fields;
      return f ? Object.values(f).flat().join("; ") : (e as Error).message;
    }
  }, [refresh, write]);

  // Stable columns and data: see the shot list for the render loop that unstable ones cause.
  const columns = useMemo(() => {
    const stepTitle = new Map(steps.map((s) => [s.id, s.title]));
    return [
    col.accessor("partName", {
      header: "Part",
      cell: (c) => <InlineEdit label={`part name of ${c.row.original.partName}`} canEdit={canEdit} value={c.getValue()} display={c.getValue()} onSave={(v) => patch(c.row.original.id, { partName: v })} />,
    }),
    col.accessor("material", {
      header: "Material",
      cell: (c) => <InlineEdit label={`material of ${c.row.original.partName}`} canEdit={canEdit} value={c.getValue()} display={c.getValue() || "—"} onSave={(v) => patch(c.row.original.id, { material: v })} />,
    }),
    col.accessor((r) => (r.stepId ? (stepTitle.get(r.stepId) ?? "") : ""), { id: "step", header: "Cut in step", cell: (c) => <span className="text-xs">{c.getValue() || "—"}</span> }),
    ...(["thickness", "width", "length"] as const).map((d) =>
      col.accessor(d, {
        header: d === "thickness" ? "T" : d === "width" ? "W" : "L",
        cell: (c) => {
          const r = c.row.original;
          return (
            <InlineEdit
              label={`${d} of ${r.partName}`}
              canEdit={canEdit}
              value={r.unit === "in" ? formatInches(c.getValue()) : String(c.getValue())}
              display={
                <span className="num whitespace-nowrap">
                  {dim(c.getValue(), r.unit)}
                  <span className="block text-xs text-walnut-600" data-testid="size-other-unit">
                    {other(c.getValue(), r.unit)}
                  </span>
                </span>
              }
              onSave={async (v) => {
                const p = parseMeasure(v);
                if (!p.ok) return p.message;
                return patch(r.id, { [d]: v });
              }}
            />
          );
        },
      }),
    ),
    col.accessor("sizing", { header: "Sizing", cell: (c) => <span className="text-xs">{c.getValue()}</span> }),
    col.accessor("quantity", {
      header: "Qty",
      cell: (c) => <InlineEdit label={`quantity of ${c.row.original.partName}`} canEdit={canEdit} value={String(c.getValue())} display={<span className="num">{c.getValue()}</span>} onSave={(v) => patch(c.row.original.id, { quantity: Number(v) })} />,
    }),
    col.accessor((r) => r.figures.boardFeet, { id: "bf", header: "Board ft", cell: (c) => <span className="num">{c.getValue().toFixed(2)}</span> }),
    col.accessor((r) => r.figures.cubicMetres, { id: "m3", header: "m³", cell: (c) => <span className="num">{c.getValue().toFixed(4)}</span> }),
    col.accessor("pricingUnit", { header: "Priced", cell: (c) => <span className="text-xs">{PRICING_LABELS[c.getValue()]}</span> }),
    col.accessor("unitPriceMinor", {
      header: "Unit price",
      cell: (c) => (
        <InlineEdit
          label={`unit price of ${c.row.original.partName}`}
          canEdit={canEdit}
          value={(c.getValue() / 100).toFixed(2)}
          display={<span className="num">{formatMoney(c.getValue(), c.row.original.currency)}</span>}
          onSave={(v) => (Number.isFinite(Number(v)) && v.trim() !== "" ? patch(c.row.original.id, { unitPriceMinor: Math.round(Number(v) * 100) }) : Promise.resolve("enter a price such as 12.50"))}
        />
      ),
    }),
    col.accessor("wastePercent", {
      header: "Waste %",
      cell: (c) => <InlineEdit label={`waste of ${c.row.original.partName}`} canEdit={canEdit} value={String(c.getValue())} display={<span className="num">{c.getValue()}</span>} onSave={(v) => patch(c.row.original.id, { wastePercent: Number(v) })} />,
    }),
    col.accessor((r) => r.figures.costMinor, { id: "cost", header: "Cost", cell: (c) => <span className="num">{formatMoney(c.getValue(), c.row.original.currency)}</span> }),
    col.display({
      id: "actions",
      header: () => <span className="sr-only">Actions</span>,
      cell: (c) =>
        canEdit ? (
          <Button
            variant="quiet"
            aria-label={`Delete ${c.row.original.partName}`}
            onClick={async () => {
              await write(`/api/materials/${c.row.original.id}`, "DELETE");
              await refresh();
            }}
          >
            ✕
          </Button>
        ) : null,
    }),
  ];
  }, [canEdit, steps, patch, refresh, write]);

  const rows = useMemo(() => data?.rows ?? [], [data]);
  const table = useReactTable({ data: rows, columns, autoResetAll: false, state: { sorting }, onSortingChange: setSorting, getCoreRowModel: getCoreRowModel(), getSortedRowModel: getSortedRowModel() });

  async function importFile(file: File) {
    setNotice(null);
    const text = await file.text();
    let body: { imported: number };
    try {
      body = await write(`/api/episodes/${episodeId}/materials/csv`, "POST", undefined, { body: text, contentType: "text/csv" });
    } catch (e) {
      const err = e as ApiError;
      const list = err.fields ? Object.entries(err.fields).map(([k, v]) => `${k}: ${v.join("; ")}`) : undefined;
      setNotice({ tone: "error", text: err.message || "Import failed.", list });
      return;
    }
    setNotice({ tone: "ok", text: `Imported ${body.imported} rows.` });
    await refresh();
  }

  const t = data?.totals.total;
  return (
    <div className="space-y-4">
      <div className="flex flex-wrap items-center gap-2">
        <a className="rounded-plank border border-timber-300 bg-white px-3 py-1.5 text-sm hover:bg-timber-100" href={`/api/episodes/${episodeId}/materials/csv`} download>
          Export CSV
        </a>
        {canEdit ? (
          <label className="cursor-pointer rounded-plank border border-timber-300 bg-white px-3 py-1.5 text-sm hover:bg-timber-100">
            Import CSV…
            <input type="file" accept=".csv,text/csv" className="sr-only" onChange={(e) => e.target.files?.[0] && void importFile(e.target.files[0])} data-testid="csv-import" />
          </label>
        ) : null}
        <span className="text-xs text-walnut-600">Sizes accept 3/4, 1-1/2 or decimals. Each size also shows in the other unit, under it.</span>
      </div>
      {notice ? (
        <div data-testid="cut-list-notice">
          <Notice tone={notice.tone}>
            {notice.text}
            {notice.list ? (
              <ul className="mt-1 list-disc pl-5">
                {notice.list.map((l) => (
                  <li key={l}>{l}</li>
                ))}
              </ul>
            ) : null}
          </Notice>
        </div>
      ) : null}

      {data && data.rows.length === 0 ? (
        <div className="rounded-plank border border-dashed border-timber-400 bg-white p-4 text-sm" data-testid="cut-list-empty">
          <strong>The cut list is empty.</strong> {canEdit ? "Add the first part below, or import a CSV (export an empty list to get the columns)." : "The presenter adds the parts."}
        </div>
      ) : null}

      {data && data.rows.length > 0 ? (
        <div className="overflow-x-auto rounded-plank border border-timber-300 bg-white">
          <table className="w-full border-collapse text-sm" data-testid="cut-list-table">
            <TableHead table={table} />
            <tbody>
              {table.getRowModel().rows.map((r) => (
                <tr key={r.id} className="border-b border-timber-200 align-top">
                  {r.getVisibleCells().map((c) => (
                    <td key={c.id} className="px-2 py-1">
                      {flexRender(c.column.columnDef.cell, c.getContext())}
                    </td>
                  ))}
                </tr>
              ))}
            </tbody>
            {t ? (
              <tfoot>
                <tr className="bg-timber-100 font-medium" data-testid="cut-list-total">
                  <td className="px-2 py-1.5" colSpan={8}>
                    Total ({t.rows} rows{t.sheetsToBuy ? `, ${t.sheetsToBuy} sheets to buy` : ""})
                  </td>
                  <td className="num px-2">{t.boardFeet.toFixed(2)}</td>
                  <td className="num px-2">{t.cubicMetres.toFixed(4)}</td>
                  <td colSpan={3} />
                  <td className="num px-2">{formatMoney(t.costMinor, currency)}</td>
                  <td />
                </tr>
              </tfoot>
            ) : null}
          </table>
        </div>
      ) : null}

      {data && data.totals.byMaterial.length > 0 ? (
        <section>
          <h2 className="font-bold">Purchase list by material</h2>
          <table className="mt-1 text-sm" data-testid="by-material">
            <thead>
              <tr className="text-left text-walnut-700">
                <th className="pr-4">Material</th>
                <th className="pr-4">Board ft</th>
                <th className="pr-4">m³</th>
                <th className="pr-4">Sheets</th>
                <th>Cost with waste</th>
              </tr>
            </thead>
            <tbody>
              {data.totals.byMaterial.map((m) => (
                <tr key={m.material}>
                  <td className="pr-4">{m.material}</td>
                  <td className="num pr-4">{m.boardFeet.toFixed(2)}</td>
                  <td className="num pr-4">{m.cubicMetres.toFixed(4)}</td>
                  <td className="num pr-4">{m.sheetsToBuy || "—"}</td>
                  <td className="num">{formatMoney(m.costMinor, currency)}</td>
                </tr>
              ))}
            </tbody>
          </table>
        </section>
      ) : null}

      {canEdit ? <AddRow episodeId={episodeId} defaultUnit={defaultUnit} currency={currency} steps={steps} onAdded={refresh} /> : null}
    </div>
  );
}

function AddRow({ episodeId, defaultUnit, currency, steps, onAdded }: { episodeId: string; defaultUnit: "in" | "mm"; currency: string; steps: { id: string; title: string }[]; onAdded: () => Promise<unknown> }) {
  const write = useWrite({ scope: `cut-list:${episodeId}` });
  const empty = { partName: "", material: "", thickness: "", width: "", length: "", quantity: "1", unit: defaultUnit, sizing: "actual", pricingUnit: "board_foot", price: "", wastePercent: "15", stepId: "" };
  const [f, setF] = useState(empty);
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [message, setMessage] = useState<string | null>(null);
  const set = (k: keyof typeof empty) => (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement>) => setF({ ...f, [k]: e.target.value });
  const field = (k: keyof typeof empty, label: string, extra: React.InputHTMLAttributes<HTMLInputElement> = {}) => (
    <label className="text-sm">
      <span className="block text-walnut-800">{label}</span>
      <input className="w-full rounded-plank border border-timber-300 px-2 py-1 aria-[invalid]:border-fault-700" value={f[k]} onChange={set(k)} aria-invalid={errors[k] ? true : undefined} {...extra} />
      {errors[k] ? <span className="block text-xs text-fault-700">{errors[k]!.join("; ")}</span> : null}
    </label>
  );
  return (
    <form
      aria-label="Add a part"
      className="grid gap-2 rounded-plank border border-timber-300 bg-white p-4 sm:grid-cols-6"
      onSubmit={async (e) => {
        e.preventDefault();
        setMessage(null);
        try {
          await write(`/api/episodes/${episodeId}/materials`, "POST", {
              partName: f.partName,
              material: f.material,
              unit: f.unit,
              thickness: f.thickness,
              width: f.width,
              length: f.length,
              quantity: Number(f.quantity),
              sizing: f.sizing,
              pricingUnit: f.pricingUnit,
              unitPriceMinor: f.price.trim() === "" ? 0 : Math.round(Number(f.price) * 100),
              currency,
              wastePercent: Number(f.wastePercent),
              stepId: f.stepId || null,
          });
          setErrors({});
          setF(empty);
          await onAdded();
        } catch (err) {
          const fields = (err as { fields?: Record<string, string[]> }).fields ?? {};
          setErrors({ ...fields, ...(fields.unitPriceMinor ? { price: fields.unitPriceMinor } : {}) });
          setMessage((err as Error).message);
        }
      }}
    >
      <h2 className="font-bold sm:col-span-6">Add a part</h2>
      {message ? (
        <div className="sm:col-span-6">
          <Notice tone="error">{message}</Notice>
        </div>
      ) : null}
      <div className="sm:col-span-2">{field("partName", "Part")}</div>
      <div className="sm:col-span-2">{field("material", "Material (species or sheet)")}</div>
      <label className="text-sm">
        <span className="block text-walnut-800">Unit</span>
        <select className="w-full rounded-plank border border-timber-300 px-2 py-1" value={f.unit} onChange={set("unit")}>
          <option value="in">inches</option>
          <option value="mm">millimetres</option>
        </select>
      </label>
      <label className="text-sm">
        <span className="block text-walnut-800">Sizing</span>
        <select className="w-full rounded-plank border border-timber-300 px-2 py-1" value={f.sizing} onChange={set("sizing")}>
          <option value="actual">actual</option>
          <option value="nominal">nominal</option>
        </select>
      </label>
      {field("thickness", "Thickness", { placeholder: "3/4" })}
      {field("width", "Width", { placeholder: "5-1/2" })}
      {field("length", "Length", { placeholder: "36" })}
      {field("quantity", "Quantity", { inputMode: "numeric" })}
      <label className="text-sm">
        <span className="block text-walnut-800">Priced</span>
        <select className="w-full rounded-plank border border-timber-300 px-2 py-1" value={f.pricingUnit} onChange={set("pricingUnit")}>
          {PRICING_UNITS.map((p) => (
            <option key={p} value={p}>
              {PRICING_LABELS[p]}
            </option>
          ))}
        </select>
      </label>
      {field("price", `Unit price (${currency})`, { inputMode: "decimal", placeholder: "12.50" })}
      {field("wastePercent", "Waste %", { inputMode: "decimal" })}
      <label className="text-sm sm:col-span-2">
        <span className="block text-walnut-800">Cut in step</span>
        <select className="w-full rounded-plank border border-timber-300 px-2 py-1" value={f.stepId} onChange={set("stepId")}>
          <option value="">—</option>
          {steps.map((s) => (
            <option key={s.id} value={s.id}>
              {s.title}
            </option>
          ))}
        </select>
      </label>
      <div className="flex items-end sm:col-span-3">
        <Button type="submit" variant="primary">
          Add part
        </Button>
      </div>
    </form>
  );
}
