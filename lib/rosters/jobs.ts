// The roster jobs the worker runs: building a week's draft, and mailing a publication.
import { z } from "zod";
import type { JobHandlers } from "@/lib/jobs/worker";
import { buildDraftRoster } from "./build";
import { mailPublishedRoster } from "./mail";
import { ROSTER_BUILD_JOB, ROSTER_MAIL_JOB } from "./publish";

const buildPayload = z.object({ siteId: z.number().int(), startsOn: z.string(), userId: z.number().int().nullable().default(null) });
const mailPayload = z.object({ rosterId: z.number().int() });

export const rosterJobHandlers: JobHandlers = {
  [ROSTER_BUILD_JOB]: async ({ db, job, progress }) => {
    const payload = buildPayload.parse(job.payload);
    return buildDraftRoster(db, payload, progress);
  },
  [ROSTER_MAIL_JOB]: async ({ db, job, progress }) => {
    const { rosterId } = mailPayload.parse(job.payload);
    // A re-queued job carries what its earlier attempt already sent.
    const earlier = (job.result as { sent?: unknown } | null)?.sent;
    const alreadySent = Array.isArray(earlier) ? earlier.filter((id): id is number => typeof id === "number") : [];
    return mailPublishedRoster(db, rosterId, alreadySent, progress);
  },
};
