"use client";
// What the plan costs to staff: post-hours per week from the site's weekly opening hours, the FTE
// they need and the money at the site's hourly rate, for the guaranteed and the fewest plan.
import { useState } from "react";
import { useSiteFormat } from "@/components/site-format";
import type { OpeningHours } from "@/db/schema";
import { formatMoney, formatNumber } from "@/lib/format";
import { DEFAULT_CONTRACT_HOURS, DEFAULT_RELIEF_FACTOR, staffingCost, weeklyOpenHours, type StaffingCost } from "@/lib/guarding/staffing-cost";

interface Props {
  site: { name: string; hourly_rate: number; opening_hours: OpeningHours };
  guaranteedPosts: number | null;
  fewestPosts: number | null;
}

export function StaffingPanel({ site, guaranteedPosts, fewestPosts }: Props) {
  const format = useSiteFormat();
  const money = (value: number) => formatMoney(format, value, { whole: true });
  const [contractHours, setContractHours] = useState(DEFAULT_CONTRACT_HOURS);
  const [reliefFactor, setReliefFactor] = useState(DEFAULT_RELIEF_FACTOR);
  const [hourlyRate, setHourlyRate] = useState(site.hourly_rate);
  let openHours = 0;
  let problem: string | null = null;
  try {
    openHours = weeklyOpenHours(site.opening_hours.weekly ?? {});
  } catch (error) {
    problem = error instanceof Error ? error.message : String(error);
  }
  const cost = (posts: number | null): StaffingCost | null => {
    if (posts === null || problem) return null;
    try {
      return staffingCost({ posts, weeklyOpenHours: openHours, hourlyRate, contractHours, reliefFactor });
    } catch {
      return null;
    }
  };
  const rows: [string, StaffingCost | null][] = [
    ["Guaranteed", cost(guaranteedPosts)],
    ["Fewest", cost(fewestPosts)],
  ];
  const invalid = !(contractHours > 0) || !(reliefFactor >= 1) || !(hourlyRate >= 0);
  return (
    <section className="card space-y-3" aria-labelledby="staffing-heading" data-testid="staffing-cost">
      <h2 id="staffing-heading" className="text-lg">
        Staffing cost
      </h2>
      <p className="text-sm text-stone-700">
        {site.name} is open {formatNumber(format, openHours, 2)} hours in a typical week (weekly pattern; dated exceptions aside).
      </p>
      <table className="data-table">
        <thead>
          <tr>
            <th scope="col">Plan</th>
            <th scope="col">Post-h/wk</th>
            <th scope="col">FTE</th>
            <th scope="col">Per week</th>
          </tr>
        </thead>
        <tbody>
          {rows.map(([label, c]) => (
            <tr key={label}>
              <th scope="row" className="font-normal">
                {label}
              </th>
              <td>{c ? formatNumber(format, c.postHoursPerWeek, 2) : "–"}</td>
              <td>{c ? formatNumber(format, c.fte, 2) : "–"}</td>
              <td>{c ? money(c.costPerWeek) : "–"}</td>
            </tr>
          ))}
        </tbody>
      </table>
      {rows[0][1] && rows[1][1] && rows[0][1].costPerWeek > rows[1][1].costPerWeek && (
        <p className="text-sm">
          The fewest plan saves {money(rows[0][1].costPerWeek - rows[1][1].costPerWeek)} a week ({money((rows[0][1].costPerWeek - rows[1][1].costPerWeek) * 52)} a year).
        </p>
      )}
      <div className="grid grid-cols-3 gap-2">
        <label className="text-xs">
          <span className="field-label text-xs">Contract h/wk</span>
          <input className="field-input" type="number" min={1} step={0.5} value={contractHours} onChange={(e) => setContractHours(Number(e.target.value))} />
        </label>
        <label className="text-xs">
          <span className="field-label text-xs">Relief factor</span>
          <input className="field-input" type="number" min={1} step={0.05} value={reliefFactor} onChange={(e) => setReliefFactor(Number(e.target.value))} />
        </label>
        <label className="text-xs">
          <span className="field-label text-xs">Rate / hour</span>
          <input className="field-input" type="number" min={0} step={0.5} value={hourlyRate} onChange={(e) => setHourlyRate(Number(e.target.value))} />
        </label>
      </div>
      {invalid && <p className="text-sm text-alert-700">Contract hours must be above 0, the relief factor at least 1 and the rate 0 or more.</p>}
      <p className="text-xs text-stone-700">
        FTE = post-hours ÷ contract hours × relief factor. The relief factor covers leave, sickness and training; {DEFAULT_RELIEF_FACTOR} is common practice, not a published figure — set your own.
      </p>
    </section>
  );
}
