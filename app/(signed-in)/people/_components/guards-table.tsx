"use client";
import {
  createColumnHelper,
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type SortingState,
} from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { useSiteFormat } from "@/components/site-format";
import { formatHours, formatNumber, type SiteFormat } from "@/lib/format";
import { GuardEditor } from "./guard-form";

export interface PeopleGuard {
  id: number;
  name: string;
  email: string;
  contractHours: number;
  maxHours: number;
  acceptedExtraHours: number | null;
  skills: string[];
  active: boolean;
  lastSignInAt: string | null;
  /** Paid hours on this week's published roster (null: no published roster this week). */
  weekHours: number | null;
  weekOvertime: number | null;
}

const column = createColumnHelper<PeopleGuard>();
const baseColumns = (site: SiteFormat) => [
  column.accessor("name", { header: "Name", cell: (info) => (
    <span>
      {info.getValue()}
      {!info.row.original.active && <span className="ml-2 tag">left</span>}
    </span>
  ) }),
  column.accessor("email", { header: "E-mail" }),
  column.accessor("contractHours", { header: "Contract hours", cell: (info) => formatNumber(site, info.getValue()) }),
  column.accessor("maxHours", { header: "Max hours", cell: (info) => formatNumber(site, info.getValue()) }),
  column.accessor((row) => row.weekHours ?? -1, { id: "week", header: "Hours this week", cell: (info) => (info.row.original.weekHours === null ? "not published" : formatHours(site, info.row.original.weekHours)) }),
  column.accessor((row) => row.weekOvertime ?? -1, { id: "overtime", header: "Overtime", cell: (info) => (info.row.original.weekOvertime === null ? "–" : formatHours(site, info.row.original.weekOvertime)) }),
  column.accessor((row) => row.acceptedExtraHours ?? -1, { id: "extra", header: "Accepted extra", cell: (info) => (info.row.original.acceptedExtraHours === null ? "site default" : formatHours(site, info.row.original.acceptedExtraHours)) }),
  column.accessor((row) => row.skills.join(", "), {
    id: "skills",
    header: "Skills",
    cell: (info) =>
      info.row.original.skills.length === 0 ? (
        <span className="text-stone-600">none</span>
      ) : (
        <ul className="flex flex-wrap gap-1">
          {info.row.original.skills.map((skill) => (
            <li key={skill} className="tag">{skill}</li>
          ))}
        </ul>
      ),
  }),
];

export function GuardsTable({ guards, siteId, editable }: { guards: PeopleGuard[]; siteId: number | null; editable: boolean }) {
  const site = useSiteFormat();
  const columns = useMemo(
    () =>
      editable && siteId !== null
        ? [...baseColumns(site), column.display({ id: "actions", header: "Change", cell: (info) => <GuardEditor siteId={siteId} guard={info.row.original} /> })]
        : baseColumns(site),
    [site, editable, siteId],
  );
  const [sorting, setSorting] = useState<SortingState>([{ id: "name", desc: false }]);
  const [filter, setFilter] = useState("");
  const table = useReactTable({
    data: guards,
    columns,
    state: { sorting, globalFilter: filter },
    onSortingChange: setSorting,
    onGlobalFilterChange: setFilter,
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
  });

  return (
    <div className="card">
      <label htmlFor="guard-filter" className="field-label">Filter guards</label>
      <input
        id="guard-filter"
        type="search"
        value={filter}
        onChange={(event) => setFilter(event.target.value)}
        placeholder="name or skill"
        className="field-input mb-4 max-w-sm"
      />
      <div className="overflow-x-auto">
        <table className="data-table">
          <caption className="sr-only">Guards with contract hours and skills</caption>
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
            {table.getRowModel().rows.length === 0 && (
              <tr>
                <td colSpan={columns.length}>No guard matches “{filter}”.</td>
              </tr>
            )}
          </tbody>
        </table>
      </div>
    </div>
  );
}
