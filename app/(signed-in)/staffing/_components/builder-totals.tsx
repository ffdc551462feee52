"use client";
// The week builder's totals, re-read from the server after each change, and the changes kept
// against a rule with their note, who and when.
import { useSiteFormat } from "@/components/site-format";
import { formatDateTime, formatMoney, formatNumber, formatShortDay, formatTime } from "@/lib/format";
import type { RosterOverrideView } from "@/lib/rosters/builder";
import type { RosterView } from "./roster-types";

export function BuilderTotals({ roster }: { roster: RosterView }) {
  const f = { ...useSiteFormat(), timeZone: roster.timeZone };
  const t = roster.totals;
  if (!t) return null;
  const items: [string, string, string][] = [
    ["post-hours", "Post-hours staffed", `${formatNumber(f, t.filledPostHours, 2)} of ${formatNumber(f, t.postHours, 2)}`],
    ["unfilled-hours", "Post-hours unfilled", formatNumber(f, t.unfilledPostHours, 2)],
    ["paid-hours", "Paid hours", formatNumber(f, t.paidHours, 2)],
    ["overtime-hours", "Overtime hours", formatNumber(f, t.overtimeHours, 2)],
    ["cost", "Cost", formatMoney(f, t.cost)],
    ["gap", "Gap to the lower bound", `${formatMoney(f, t.cost - t.lowerBoundCost)} (${formatNumber(f, t.gap * 100, 1)} %)`],
  ];
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-2 sm:grid-cols-3 lg:grid-cols-6" data-testid="builder-totals" aria-live="polite">
      {items.map(([key, label, value]) => (
        <div key={key} className="rounded-md border border-stone-200 p-2">
          <dt className="text-xs text-stone-700">{label}</dt>
          <dd className="font-semibold tabular-nums" data-testid={`total-${key}`}>{value}</dd>
        </div>
      ))}
    </dl>
  );
}

export function BuilderOverrides({ overrides, roster }: { overrides: RosterOverrideView[]; roster: RosterView }) {
  const f = { ...useSiteFormat(), timeZone: roster.timeZone };
  const labels = new Map(roster.posts.map((p) => [p.id, p.label]));
  const names = new Map(roster.guards.map((g) => [g.id, g.name]));
  if (overrides.length === 0) return null;
  return (
    <section aria-labelledby="builder-overrides-heading" className="rounded-md border border-brass-300 bg-brass-100 p-3" data-testid="builder-overrides">
      <h4 id="builder-overrides-heading" className="font-semibold">Kept against a rule</h4>
      <ul className="mt-1 space-y-2 text-sm">
        {overrides.map((o) => (
          <li key={o.id}>
            <p>
              <span className="font-semibold">{o.guardId !== null ? (names.get(o.guardId) ?? `Guard ${o.guardId}`) : "Unfilled"}</span> at {labels.get(o.post) ?? o.post},{" "}
              {formatShortDay(f, o.start)} {formatTime(f, o.start)}–{formatTime(f, o.end)}: rule {o.rules.join(", ")}
            </p>
            <p>Note: “{o.note}” ({o.by}, {formatDateTime(f, o.at)})</p>
          </li>
        ))}
      </ul>
    </section>
  );
}
