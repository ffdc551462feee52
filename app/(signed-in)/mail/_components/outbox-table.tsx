"use client";
// The outbox as a table: filter by kind, status and recipient; sort by any column; resend.
import Link from "next/link";
import { createColumnHelper } from "@tanstack/react-table";
import { useMemo, useState } from "react";
import { DataTable, FilterSearch, FilterSelect } from "@/components/data-table";
import { useSiteFormat } from "@/components/site-format";
import { formatDateTime } from "@/lib/format";
import { OUTBOX_KINDS, OUTBOX_KIND_LABELS, OUTBOX_STATUSES } from "@/lib/api/outbox";
import { ResendButton } from "./resend-button";

export interface OutboxRow {
  id: number;
  kind: (typeof OUTBOX_KINDS)[number];
  recipient: string;
  subject: string;
  status: (typeof OUTBOX_STATUSES)[number];
  attempts: number;
  last_error: string | null;
  created_at: string;
  sent_at: string | null;
  attachment_count: number;
}

const KIND_LABELS = OUTBOX_KIND_LABELS;
const STATUS_CLASS: Record<OutboxRow["status"], string> = { queued: "tag", sent: "tag-ok", failed: "tag-high" };

const column = createColumnHelper<OutboxRow>();

export function OutboxTable({ rows }: { rows: OutboxRow[] }) {
  const format = useSiteFormat();
  const [kind, setKind] = useState("");
  const [status, setStatus] = useState("");
  const [search, setSearch] = useState("");
  const columns = useMemo(
    () => [
      column.accessor("created_at", { header: "Time", cell: (info) => <span className="whitespace-nowrap">{formatDateTime(format, info.getValue())}</span> }),
      column.accessor("kind", { header: "Kind", cell: (info) => KIND_LABELS[info.getValue()], filterFn: "equalsString" }),
      column.accessor("recipient", { header: "To" }),
      column.accessor("subject", { header: "Subject", cell: (info) => <Link href={`/mail/${info.row.original.id}`}>{info.getValue() || "(no subject)"}</Link> }),
      column.accessor("status", {
        header: "Status",
        filterFn: "equalsString",
        cell: (info) => {
          const row = info.row.original;
          return (
            <div>
              <span className={STATUS_CLASS[row.status]}>{row.status}</span>
              {row.attempts > 1 && <span className="ml-1 text-sm text-stone-700">after {row.attempts} attempts</span>}
              {row.status === "failed" && row.last_error && <p className="mt-1 max-w-xs text-sm text-alert-700">{row.last_error}</p>}
            </div>
          );
        },
      }),
      column.display({
        id: "actions",
        header: () => <span className="sr-only">Actions</span>,
        cell: (info) => <ResendButton id={info.row.original.id} kind={info.row.original.kind} label={`${KIND_LABELS[info.row.original.kind].toLowerCase()} to ${info.row.original.recipient}`} />,
      }),
    ],
    [format],
  );
  const filters = [...(kind ? [{ id: "kind", value: kind }] : []), ...(status ? [{ id: "status", value: status }] : [])];
  return (
    <div className="space-y-3">
      <div className="flex flex-wrap items-end gap-3">
        <FilterSelect id="outbox-kind" label="Kind" value={kind} onChange={setKind} all="all kinds" options={OUTBOX_KINDS.map((k) => [k, KIND_LABELS[k]])} />
        <FilterSelect id="outbox-status" label="Status" value={status} onChange={setStatus} all="any status" options={OUTBOX_STATUSES.map((s) => [s, s])} />
        <FilterSearch id="outbox-search" value={search} onChange={setSearch} placeholder="recipient or subject" />
      </div>
      <DataTable
        data={rows}
        columns={columns}
        caption="Messages the product sent, newest first"
        initialSorting={[{ id: "created_at", desc: true }]}
        columnFilters={filters}
        search={search}
        empty="No messages match."
        none="No mail sent yet."
        testId="outbox"
      />
    </div>
  );
}
