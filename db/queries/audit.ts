// The audit trail: rows are added, never changed (the table's trigger refuses UPDATE and DELETE).
import { sql, type Kysely, type Transaction } from "kysely";
import type { Database } from "../schema";

type Handle = Kysely<Database> | Transaction<Database>;

export interface NewAuditEvent {
  actorId: number | null;
  actorName: string;
  actorRole: string;
  action: string;
  subjectType: string;
  subjectId?: number | null;
  subjectLabel?: string;
  siteId?: number | null;
  summary: string;
  changes?: Record<string, unknown>;
}

export async function insertAuditEvent(handle: Handle, event: NewAuditEvent): Promise<void> {
  await handle
    .insertInto("audit_events")
    .values({
      actor_id: event.actorId,
      actor_name: event.actorName,
      actor_role: event.actorRole,
      action: event.action,
      subject_type: event.subjectType,
      subject_id: event.subjectId ?? null,
      subject_label: event.subjectLabel ?? "",
      site_id: event.siteId ?? null,
      summary: event.summary,
      changes: JSON.stringify(event.changes ?? {}),
    })
    .execute();
}

export interface AuditFilter {
  /** The part of the action before the dot: "room", "roster", … */
  area?: string;
  actorId?: number;
  subjectType?: string;
  subjectId?: number;
  /** Inclusive instants. */
  from?: Date;
  to?: Date;
  limit?: number;
}

export async function listAuditEvents(handle: Handle, filter: AuditFilter = {}) {
  let query = handle.selectFrom("audit_events").selectAll().orderBy("at", "desc").orderBy("id", "desc").limit(filter.limit ?? 500);
  if (filter.area) query = query.where(sql<boolean>`split_part(action, '.', 1) = ${filter.area}`);
  if (filter.actorId !== undefined) query = query.where("actor_id", "=", filter.actorId);
  if (filter.subjectType) query = query.where("subject_type", "=", filter.subjectType);
  if (filter.subjectId !== undefined) query = query.where("subject_id", "=", filter.subjectId);
  if (filter.from) query = query.where("at", ">=", filter.from);
  if (filter.to) query = query.where("at", "<=", filter.to);
  return query.execute();
}

export type AuditRow = Awaited<ReturnType<typeof listAuditEvents>>[number];
