// Recording a change in the audit trail: route handlers call recordAudit after a change is made,
// with who (the signed-in user as the server checked them), what (an action such as
// "room.save-walls"), on what, and what changed (before and after of each field that differs).
import type { Kysely, Transaction } from "kysely";
import type { Database } from "@/db/schema";
import { insertAuditEvent } from "@/db/queries/audit";

import { AUDIT_AREAS } from "./areas";

export { AUDIT_AREAS };
export type AuditArea = keyof typeof AUDIT_AREAS;

export interface AuditActor {
  id: number;
  name: string;
  role: string;
}

export interface AuditEvent {
  action: `${AuditArea}.${string}`;
  subject: { type: string; id?: number | null; label?: string };
  siteId?: number | null;
  /** One line a person reads: "saved the walls of Textile Gallery (version 4)". */
  summary: string;
  changes?: Record<string, unknown>;
}

export async function recordAudit(db: Kysely<Database> | Transaction<Database>, actor: AuditActor, event: AuditEvent): Promise<void> {
  await insertAuditEvent(db, {
    actorId: actor.id,
    actorName: actor.name,
    actorRole: actor.role,
    action: event.action,
    subjectType: event.subject.type,
    subjectId: event.subject.id ?? null,
    subjectLabel: event.subject.label ?? "",
    siteId: event.siteId ?? null,
    summary: event.summary,
    changes: event.changes,
  });
}

/** The fields of two flat records that differ, as { field: { from, to } }; nested values compare as JSON. */
export function changedFields(before: Record<string, unknown>, after: Record<string, unknown>): Record<string, { from: unknown; to: unknown }> {
  const out: Record<string, { from: unknown; to: unknown }> = {};
  for (const key of new Set([...Object.keys(before), ...Object.keys(after)])) {
    if (after[key] === undefined) continue;
    if (JSON.stringify(before[key] ?? null) !== JSON.stringify(after[key] ?? null)) out[key] = { from: before[key] ?? null, to: after[key] ?? null };
  }
  return out;
}
