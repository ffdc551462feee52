"use client";
// A roster's totals, its rule violations (there should be none) and every hour it could not fill, with the reason.
import { useSiteFormat } from "@/components/site-format";
import { formatMoney, formatNumber, formatShortDay, formatTime, siteDate } from "@/lib/format";
import type { RosterView } from "./roster-types";
import { GuardWeeksTable } from "./guard-weeks-table";

export function RosterSummary({ roster }: { roster: RosterView }) {
  const totals = roster.totals;
  const shown = { ...useSiteFormat(), timeZone: roster.timeZone };
  const stretch = (start: string, end: string) => `${formatShortDay(shown, start)}, ${formatTime(shown, start)}–${formatTime(shown, end)}`;
  // Unfilled hours with the same post and reason read best as one line per run of hours.
  const groups = new Map<string, { label: string; reason: string; hours: string[] }>();
  for (const u of roster.unfilled) {
    const key = `${u.post}|${u.reason}|${siteDate(shown, u.start)}`;
    const group = groups.get(key) ?? { label: u.label, reason: u.reason, hours: [] };
    group.hours.push(stretch(u.start, u.end));
    groups.set(key, group);
  }
  return (
    <div className="space-y-4">
      {roster.status === "published" && roster.publishReview?.needsConfirmation && (
        <div className="rounded-md border border-alert-200 bg-alert-50 p-3 text-sm" data-testid="publish-confirmation">
          <p className="font-semibold text-alert-700">
            Published with {roster.publishReview.emptyRooms.length === 1 ? "a room" : `${roster.publishReview.emptyRooms.length} rooms`} left without a guard while open:{" "}
            {roster.publishReview.emptyRooms.map((r) => r.room).join(", ")}.
          </p>
          <p>
            Confirmed by typing “{roster.publishConfirmation}”. Note: {roster.publishNote}
          </p>
        </div>
      )}
      {totals && (
        <dl className="grid grid-cols-2 gap-x-6 gap-y-1 text-sm sm:grid-cols-4" aria-label="Roster totals">
          <Total term="Post-hours" value={formatNumber(shown, totals.postHours)} />
          <Total term="Filled" value={formatNumber(shown, totals.filledPostHours)} />
          <Total term="Unfilled" value={formatNumber(shown, totals.unfilledPostHours)} />
          <Total term="Paid hours" value={formatNumber(shown, totals.paidHours)} />
          <Total term="Overtime hours" value={formatNumber(shown, totals.overtimeHours)} />
          <Total term="Cost" value={formatMoney(shown, totals.cost)} />
          <Total term="Lower bound" value={formatMoney(shown, totals.lowerBoundCost)} />
          <Total term="Gap to bound" value={`${formatNumber(shown, totals.gap * 100)} %`} />
          {typeof totals.unfilledLowerBound === "number" && <Total term="Unfilled at least" value={formatNumber(shown, totals.unfilledLowerBound)} />}
        </dl>
      )}
      {totals && typeof totals.unfilledLowerBound === "number" && totals.unfilledPostHours > 0 && (
        <p className="text-sm" data-testid="unfilled-bound">
          {totals.unfilledPostHours <= totals.unfilledLowerBound + 1e-6
            ? "This roster is as full as these guards allow: no roster can staff more post-hours. "
            : `At least ${formatNumber(shown, totals.unfilledLowerBound)} of the ${formatNumber(shown, totals.unfilledPostHours)} unfilled post-hours cannot be staffed by any roster with these guards. `}
          {totals.unfilledBoundReason ? `Why: ${totals.unfilledBoundReason}.` : ""}
        </p>
      )}
      <div data-testid="empty-rooms">
        <h3>Rooms without a guard</h3>
        {roster.emptyRooms.length === 0 ? (
          <p className="text-sm">None: every room open to visitors has a guard in every open hour.</p>
        ) : (
          <>
            <ul className="list-disc pl-5 text-sm text-alert-700">
              {roster.emptyRooms.map((e, i) => (
                <li key={i}>
                  <span className="font-semibold">{e.room}</span>
                  {e.risk === "high" ? " (high risk)" : ""}: {stretch(e.start, e.end)}
                </li>
              ))}
            </ul>
            <p className="text-sm text-stone-700">
              Proposal: close these rooms to visitors for those hours, or add guards and rebuild. Publishing such a week asks you to confirm it.
            </p>
          </>
        )}
      </div>
      <GuardWeeksTable roster={roster} />
      <div>
        <h3>Rule violations</h3>
        {roster.violations.length === 0 ? (
          <p className="text-sm" data-testid="violations">None: every shift keeps every rule.</p>
        ) : (
          <ul className="list-disc pl-5 text-sm text-alert-700" data-testid="violations">
            {roster.violations.map((v, i) => (
              <li key={i}>
                {v.message} <span className="tag-high">{v.rule}</span>
              </li>
            ))}
          </ul>
        )}
      </div>
      <details open={roster.unfilled.length > 0 && roster.unfilled.length <= 20}>
        <summary className="cursor-pointer font-semibold">
          Unfilled: {roster.unfilled.length} post-hours {roster.unfilled.length > 0 ? "(with reasons)" : ""}
        </summary>
        {groups.size > 0 && (
          <ul className="mt-2 space-y-1 text-sm">
            {[...groups.values()].map((group, i) => (
              <li key={i}>
                <span className="font-semibold">{group.label}</span>, {group.hours.length === 1 ? group.hours[0] : `${group.hours[0]} and ${group.hours.length - 1} more hours that day`}: {group.reason}
              </li>
            ))}
          </ul>
        )}
      </details>
    </div>
  );
}

function Total({ term, value }: { term: string; value: string }) {
  return (
    <div>
      <dt className="text-stone-700">{term}</dt>
      <dd className="font-semibold">{value}</dd>
    </div>
  );
}
