// The outbox API's query and path schemas (pure zod; the mail page's filters use the same words).
import { z } from "zod";
import { idParam } from "@/lib/api/ids";

export const OUTBOX_KINDS = ["roster", "invitation", "reset", "notice"] as const;
export const OUTBOX_STATUSES = ["queued", "sent", "failed"] as const;

export const OUTBOX_KIND_LABELS: Record<(typeof OUTBOX_KINDS)[number], string> = {
  roster: "Roster",
  invitation: "Invitation",
  reset: "Password reset",
  notice: "Notice",
};

export const outboxQuerySchema = z.object({
  kind: z.enum(OUTBOX_KINDS, { error: `kind is one of ${OUTBOX_KINDS.join(", ")}` }).optional(),
  status: z.enum(OUTBOX_STATUSES, { error: `status is one of ${OUTBOX_STATUSES.join(", ")}` }).optional(),
  to: z.string().trim().max(320, "to is at most 320 characters").optional(),
  limit: z.coerce.number().int("limit must be a whole number").min(1, "limit must be at least 1").max(500, "limit must be at most 500").optional(),
});

export const outboxIdSchema = z.object({ id: idParam("id") });
