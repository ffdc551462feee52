"use client";
// Week or day: two toggle buttons joined into one control; aria-pressed says which one is shown.
import type { CalendarView } from "./period-title";

const VIEWS: { view: CalendarView; label: string }[] = [
  { view: "week", label: "Week" },
  { view: "day", label: "Day" },
];

export function ViewSwitch({ view, onChange }: { view: CalendarView; onChange: (view: CalendarView) => void }) {
  return (
    <div role="group" aria-label="Calendar view" className="segmented w-full sm:w-auto">
      {VIEWS.map((option) => (
        <button key={option.view} type="button" aria-pressed={view === option.view} onClick={() => onChange(option.view)} className="segmented-option">
          {option.label}
        </button>
      ))}
    </div>
  );
}
