"use client";
import { flexRender, type Table } from "@tanstack/react-table";

/** Column headers of a TanStack table: sortable ones are buttons, and the sort is announced with aria-sort. */
export function TableHead<T>({ table }: { table: Table<T> }) {
  return (
    <thead>
      {table.getHeaderGroups().map((hg) => (
        <tr key={hg.id} className="border-b border-timber-300 bg-timber-100 text-left">
          {hg.headers.map((h) => {
            const sorted = h.column.getIsSorted();
            return (
              <th key={h.id} className="px-2 py-1.5 font-medium" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : undefined}>
                {h.column.getCanSort() ? (
                  <button type="button" onClick={h.column.getToggleSortingHandler()} className="flex items-center gap-1">
                    {flexRender(h.column.columnDef.header, h.getContext())}
                    <span aria-hidden className="text-xs">
                      {sorted === "asc" ? "▲" : sorted === "desc" ? "▼" : "↕"}
                    </span>
                  </button>
                ) : (
                  flexRender(h.column.columnDef.header, h.getContext())
                )}
              </th>
            );
          })}
        </tr>
      ))}
    </thead>
  );
}
