"use client";
// The product's sortable, filterable table over @tanstack/react-table: headers are buttons that
// sort (aria-sort tells screen readers), filters come from the page as column filters and a
// free-text filter, so every list (outbox, audit trail) sorts and filters the same way.
import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type ColumnFiltersState,
  type SortingState,
} from "@tanstack/react-table";
import { useState } from "react";

export interface DataTableProps<T> {
  data: T[];
  // eslint-disable-next-line @typescript-eslint/no-explicit-any
  columns: ColumnDef<T, any>[];
  caption: string;
  initialSorting?: SortingState;
  columnFilters?: ColumnFiltersState;
  /** Free text matched against every column's text. */
  search?: string;
  empty: string;
  /** Said when there are no rows at all (rather than none matching the filters). */
  none?: string;
  testId?: string;
}

export function DataTable<T>({ data, columns, caption, initialSorting = [], columnFilters = [], search = "", empty, none, testId }: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const table = useReactTable({
    data,
    columns,
    state: { sorting, columnFilters, globalFilter: search },
    onSortingChange: setSorting,
    globalFilterFn: "includesString",
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });
  const rows = table.getRowModel().rows;
  return (
    <div className="overflow-x-auto">
      <table className="data-table" data-testid={testId}>
        <caption className="sr-only">{caption}</caption>
        <thead>
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const sorted = header.column.getIsSorted();
                const label = flexRender(header.column.columnDef.header, header.getContext());
                return (
                  <th key={header.id} scope="col" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                    {header.column.getCanSort() ? (
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="font-semibold text-ink-800">
                        {label}
                        <span aria-hidden="true">{sorted === "asc" ? " ▲" : sorted === "desc" ? " ▼" : ""}</span>
                      </button>
                    ) : (
                      label
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {rows.length === 0 ? (
            <tr>
              <td colSpan={columns.length} className="text-stone-700">
                {data.length === 0 && none ? none : empty}
              </td>
            </tr>
          ) : (
            rows.map((row) => (
              <tr key={row.id}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
                ))}
              </tr>
            ))
          )}
        </tbody>
      </table>
      <p className="mt-2 text-sm text-stone-700" role="status">
        {rows.length === data.length ? `${data.length} in all` : `${rows.length} of ${data.length} shown`}
      </p>
    </div>
  );
}

/** A filter above a DataTable: "" is the all-rows choice, named by `all`. */
export function FilterSelect({ id, label, value, onChange, all, options }: { id: string; label: string; value: string; onChange: (value: string) => void; all: string; options: [value: string, label: string][] }) {
  return (
    <div>
      <label htmlFor={id} className="block text-sm font-semibold">{label}</label>
      <select id={id} className="field-input mt-0" value={value} onChange={(e) => onChange(e.target.value)}>
        <option value="">{all}</option>
        {options.map(([v, l]) => (
          <option key={v} value={v}>{l}</option>
        ))}
      </select>
    </div>
  );
}

/** The free-text filter above a DataTable. */
export function FilterSearch({ id, value, onChange, placeholder }: { id: string; value: string; onChange: (value: string) => void; placeholder: string }) {
  return (
    <div className="min-w-[12rem] flex-1">
      <label htmlFor={id} className="block text-sm font-semibold">Search</label>
      <input id={id} type="search" className="field-input mt-0" placeholder={placeholder} value={value} onChange={(e) => onChange(e.target.value)} />
    </div>
  );
}
