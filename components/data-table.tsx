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
