"use client";
// Each guard's week on the roster shown: contract, planned hours against contract and limit,
// overtime, late shifts, weekend days, the longest run of days, and flags in plain words.
import { createColumnHelper, flexRender, getCoreRowModel, getSortedRowModel, useReactTable, type SortingState } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { useSiteFormat } from "@/components/site-format";
import { formatNumber, type SiteFormat } from "@/lib/format";
import type { RosterView } from "./roster-types";

type Row = RosterView["guardWeeks"][number];
const column = createColumnHelper<Row>();
const columnsFor = (site: SiteFormat) => {
  const h = (value: number) => formatNumber(site, value);
  return [
    column.accessor("name", { header: "Guard" }),
    column.accessor("contractHours", { header: "Contract h", cell: (info) => h(info.getValue()) }),
    column.accessor("plannedHours", { header: "Planned h", cell: (info) => h(info.getValue()) }),
    column.accessor("limitHours", { header: "Limit h", cell: (info) => h(info.getValue()) }),
    column.accessor("overtimeHours", { header: "Overtime h", cell: (info) => h(info.getValue()) }),
    column.accessor("lateShifts", { header: "Late shifts" }),
    column.accessor("weekendDays", { header: "Weekend days" }),
    column.accessor("daysInARow", { header: "Days in a row" }),
    column.accessor((row) => row.flags.join(", "), {
      id: "flags",
      header: "Flags",
      cell: (info) =>
        info.row.original.flags.length === 0 ? (
          <span className="text-stone-600">none</span>
        ) : (
          <ul className="flex flex-wrap gap-1">
            {info.row.original.flags.map((flag) => (
              <li key={flag} className={flag === "over the limit" || flag === "at the legal maximum" ? "tag-high" : "tag"}>
                {flag}
              </li>
            ))}
          </ul>
        ),
    }),
  ];
};

export function GuardWeeksTable({ roster }: { roster: RosterView }) {
  const site = useSiteFormat();
  const columns = useMemo(() => columnsFor(site), [site]);
  const [sorting, setSorting] = useState<SortingState>([{ id: "plannedHours", desc: true }]);
  const table = useReactTable({
    data: roster.guardWeeks,
    columns,
    state: { sorting },
    onSortingChange: setSorting,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
  });
  return (
    <details>
      <summary className="cursor-pointer font-semibold">Hours per guard ({roster.guardWeeks.length} guards)</summary>
      <div className="mt-2 overflow-x-auto">
        <table className="data-table" data-testid="guard-weeks">
          <caption className="sr-only">Each guard's hours this week against contract, with overtime, late shifts, weekend days and flags</caption>
          <thead>
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  return (
                    <th key={header.id} scope="col" aria-sort={sorted === "asc" ? "ascending" : sorted === "desc" ? "descending" : "none"}>
                      <button type="button" onClick={header.column.getToggleSortingHandler()} className="font-semibold text-ink-800">
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        <span aria-hidden="true">{sorted === "asc" ? " ▲" : sorted === "desc" ? " ▼" : ""}</span>
                      </button>
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {table.getRowModel().rows.map((row) => (
              <tr key={row.id}>
                {row.getVisibleCells().map((cell) => (
                  <td key={cell.id}>{flexRender(cell.column.columnDef.cell, cell.getContext())}</td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <p className="mt-2 text-sm text-stone-700">
        The limit is the contract plus the extra hours the guard accepts, never above the legal weekly maximum. These are the product&apos;s
        defaults; contracts and local law govern.
      </p>
    </details>
  );
}
