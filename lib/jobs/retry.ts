// Failures that will likely pass (the mail server restarting, a connection timing out) should not
// end a job: the handler throws RetryLater and the worker queues the job again after a pause that
// doubles with each attempt, until it runs out of attempts and fails with the reason.

/** Thrown by a job handler when trying again later will likely succeed. */
export class RetryLater extends Error {
  constructor(message: string) {
    super(message);
    this.name = "RetryLater";
  }
}

export interface RetryPolicy {
  /** Attempts in all, the first included. */
  maxAttempts: number;
  firstDelaySeconds: number;
  maxDelaySeconds: number;
}

/** 30 s, 1, 2, 4 and 8 minutes: about a quarter of an hour before a job gives up (common practice: exponential backoff). */
export const DEFAULT_RETRY: RetryPolicy = { maxAttempts: 6, firstDelaySeconds: 30, maxDelaySeconds: 900 };

/** The pause after failed attempt number `attempt` (1 for the first). */
export function retryDelaySeconds(attempt: number, policy: RetryPolicy = DEFAULT_RETRY): number {
  return Math.min(policy.maxDelaySeconds, policy.firstDelaySeconds * 2 ** Math.max(0, attempt - 1));
}

/** "30 s", "2 min" */
export function describeDelay(seconds: number): string {
  return seconds < 90 ? `${Math.round(seconds)} s` : `${Math.round(seconds / 60)} min`;
}
