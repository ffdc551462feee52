"use client";
// While the walls are edited: what the live plan costs against the approved plan of the current
// exhibition (posts, post-hours a week, FTE and money in the site's currency), and a plain warning
// when the approval belongs to walls the room no longer has.
import { useSiteFormat } from "@/components/site-format";
import type { OpeningHours } from "@/db/schema";
import { costDifference, postsChange, signed, staleApprovalText } from "@/lib/galleries/approval";
import { weeklyOpenHours } from "@/lib/guarding/staffing-cost";
import { formatMoney, formatNumber } from "@/lib/format";

interface Props {
  site: { hourly_rate: number; opening_hours: OpeningHours };
  roomName: string;
  roomVersion: number;
  exhibitionName: string;
  approved: { id: number; posts: number; roomVersion: number } | null;
  /** Posts of the live plan (the fewest plan when it is ready, else the guaranteed one). */
  livePosts: number | null;
  liveKind: string;
}

export function CostOfChange({ site, roomName, roomVersion, exhibitionName, approved, livePosts, liveKind }: Props) {
  const format = useSiteFormat();
  if (!approved) {
    return (
      <section className="card text-sm" aria-labelledby="cost-of-change" data-testid="cost-of-change">
        <h2 id="cost-of-change" className="text-lg">Against the approved plan</h2>
        <p className="mt-1 text-stone-700">No plan is approved for {roomName} in {exhibitionName} yet: nothing to compare with.</p>
      </section>
    );
  }
  let open = 0;
  try {
    open = weeklyOpenHours(site.opening_hours.weekly ?? {});
  } catch {
    open = 0;
  }
  const diff = livePosts === null ? null : costDifference(approved.posts, livePosts, open, site.hourly_rate);
  const stale = approved.roomVersion !== roomVersion;
  return (
    <section className="card space-y-2 text-sm" aria-labelledby="cost-of-change" data-testid="cost-of-change">
      <h2 id="cost-of-change" className="text-lg">Against the approved plan</h2>
      <p className="text-stone-700">
        Plan {approved.id} for {exhibitionName}: {approved.posts} post{approved.posts === 1 ? "" : "s"}. The {liveKind} for these walls{livePosts === null ? " is being computed." : `: ${livePosts}.`}
      </p>
      {diff && (
        <p className="text-base font-semibold" data-testid="cost-difference">
          {postsChange(diff.posts)} · {signed(diff.postHoursPerWeek, (n) => formatNumber(format, n, 1))} post-hours a week · {signed(diff.fte, (n) => formatNumber(format, n, 2))} FTE ·{" "}
          {signed(diff.costPerWeek, (n) => formatMoney(format, n, { whole: true }))} a week
        </p>
      )}
      {stale && (
        <p role="status" className="rounded-md bg-alert-50 p-2 font-semibold text-alert-700" data-testid="stale-approval">
          Approval stale. {staleApprovalText({ roomName, exhibitionName, planId: approved.id, planRoomVersion: approved.roomVersion, roomVersion })}
        </p>
      )}
    </section>
  );
}
