// The roster list: one entry per week, its draft and published versions beneath it (newest
// first), with the version guards go by and whether the draft holds changes not yet published.
import { weekStatus, type WeekOverview } from "./view";

export interface RosterListRow {
  id: number;
  starts_on: string;
  status: "draft" | "published";
  version: number;
  revision: number;
  draft_revision: number | null;
  published_at: Date | null;
}

export interface RosterWeek<Row extends RosterListRow> {
  startsOn: string;
  /** The draft first, then versions newest first. */
  rows: Row[];
  current: WeekOverview["status"]["current"];
  draftIsNewer: boolean;
}

/** Groups a site's rosters by week, newest week first. */
export function rosterWeeks<Row extends RosterListRow>(rosters: readonly Row[]): RosterWeek<Row>[] {
  const byWeek = new Map<string, Row[]>();
  for (const roster of rosters) byWeek.set(roster.starts_on, [...(byWeek.get(roster.starts_on) ?? []), roster]);
  return [...byWeek.entries()]
    .sort(([a], [b]) => b.localeCompare(a))
    .map(([startsOn, rows]) => {
      const draft = rows.find((r) => r.status === "draft") ?? null;
      const published = rows.filter((r) => r.status === "published").sort((a, b) => b.version - a.version);
      const status = weekStatus(draft, published);
      return { startsOn, rows: [...(draft ? [draft] : []), ...published], current: status.current, draftIsNewer: status.draftIsNewer };
    });
}
