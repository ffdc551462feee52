"use client";
// The audit trail as a table: filter by part of the product, by person and by free text; sort by
// any column. Each change lists its fields as "before → after".
import { createColumnHelper } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { DataTable, FilterSearch, FilterSelect } from "@/components/data-table";
import { useSiteFormat } from "@/components/site-format";
import { formatDate, formatDateTime, type SiteFormat } from "@/lib/format";
import { AUDIT_AREAS } from "@/lib/audit/areas";

export interface AuditRowView {
  id: string;
  at: string;
  actorId: number | null;
  actorName: string;
  actorRole: string;
  area: string;
  action: string;
  subject: string;
  summary: string;
  changes: Record<string, unknown>;
}

const column = createColumnHelper<AuditRowView>();
// Dates inside a change read like every other date of the site; other values as they were sent.
function shown(format: SiteFormat, value: unknown): string {
  if (value === null || value === undefined) return "none";
  if (typeof value === "string") {
    if (/^\d{4}-\d{2}-\d{2}$/.test(value)) return formatDate(format, value);
    if (/^\d{4}-\d{2}-\d{2}T[\d:.]+(Z|[+-]\d{2}:\d{2})$/.test(value)) return formatDateTime(format, value);
    return value;
  }
  if (Array.isArray(value)) return `[${value.map((v) => shown(format, v)).join(", ")}]`;
  if (typeof value === "object") return `{ ${Object.entries(value as Record<string, unknown>).map(([k, v]) => `${k}: ${shown(format, v)}`).join(", ")} }`;
  return String(value);
}

function Changes({ changes }: { changes: Record<string, unknown> }) {
  const format = useSiteFormat();
  const entries = Object.entries(changes);
  if (entries.length === 0) return <span className="text-stone-600">—</span>;
  const list = (
    <ul className="space-y-0.5 text-sm">
      {entries.map(([field, value]) => {
        const pair = value && typeof value === "object" && !Array.isArray(value) && ("from" in value || "to" in value) ? (value as { from?: unknown; to?: unknown }) : null;
        return (
          <li key={field} className="max-w-md break-words">
            <span className="font-semibold">{field}</span>: {pair ? `${shown(format, pair.from)} → ${shown(format, pair.to)}` : shown(format, value)}
          </li>
        );
      })}
    </ul>
  );
  // Long lists stay folded so the trail reads row by row, on a phone too.
  if (entries.length <= 2) return list;
  return (
    <details>
      <summary className="cursor-pointer text-sm font-semibold">{entries.length} fields</summary>
      {list}
    </details>
  );
}

export function AuditTable({ rows }: { rows: AuditRowView[] }) {
  const format = useSiteFormat();
  const [area, setArea] = useState("");
  const [actor, setActor] = useState("");
  const [search, setSearch] = useState("");
  const actors = useMemo(() => [...new Map(rows.map((r) => [r.actorName, r.actorRole])).entries()].sort(([a], [b]) => a.localeCompare(b)), [rows]);
  const columns = useMemo(
    () => [
      column.accessor("at", { header: "When", cell: (info) => <span className="whitespace-nowrap">{formatDateTime(format, info.getValue())}</span> }),
      column.accessor("actorName", { header: "Who", filterFn: "equalsString", cell: (info) => <span>{info.getValue()} <span className="tag">{info.row.original.actorRole}</span></span> }),
      column.accessor("area", { header: "Part", filterFn: "equalsString", cell: (info) => AUDIT_AREAS[info.getValue() as keyof typeof AUDIT_AREAS] ?? info.getValue() }),
      column.accessor("summary", { header: "What", cell: (info) => <span><span className="font-semibold">{info.row.original.subject}</span>{info.row.original.subject ? ": " : ""}{info.getValue()}</span> }),
      column.accessor((row) => JSON.stringify(row.changes), { id: "changes", header: "Changes", enableSorting: false, cell: (info) => <Changes changes={info.row.original.changes} /> }),
    ],
    [format],
  );
  const filters = [...(area ? [{ id: "area", value: area }] : []), ...(actor ? [{ id: "actorName", value: actor }] : [])];
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <FilterSelect id="audit-area" label="Part" value={area} onChange={setArea} all="every part" options={Object.entries(AUDIT_AREAS)} />
        <FilterSelect id="audit-actor" label="Who" value={actor} onChange={setActor} all="everyone" options={actors.map(([name, role]) => [name, `${name} (${role})`])} />
        <FilterSearch id="audit-search" value={search} onChange={setSearch} placeholder="room, guard, week, note…" />
      </div>
      <DataTable data={rows} columns={columns} caption="Changes, newest first" initialSorting={[{ id: "at", desc: true }]} columnFilters={filters} search={search} empty="No changes match." none="No changes recorded yet." testId="audit" />
    </div>
  );
}
