// Shapes the roster API answers with (lib/rosters/view.ts), as the browser sees them after JSON.
import type { RosterView, WeekOverview } from "@/lib/rosters/view";

export type { RosterView, WeekOverview };

export interface JobState {
  id: number;
  kind: string;
  status: "queued" | "running" | "done" | "failed";
  progress: number;
  message: string;
  result: unknown;
}
