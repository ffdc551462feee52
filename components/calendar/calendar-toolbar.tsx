"use client";
// Our own calendar toolbar (the library's is switched off): the shown period as a heading that is
// announced when it changes, previous/next, a jump back to now, extra actions and the view switch.
import type { ReactNode } from "react";
import type { CalendarView, PeriodTitle } from "./period-title";
import { ViewSwitch } from "./view-switch";

export interface CalendarToolbarProps {
  period: PeriodTitle;
  view: CalendarView;
  onPrevious: () => void;
  onNext: () => void;
  onNow: () => void;
  onViewChange: (view: CalendarView) => void;
  /** Buttons of the page beside "This week" / "Today", e.g. "Next shift". */
  children?: ReactNode;
  /** The heading level of the period title within the page. */
  headingLevel?: "h3" | "h4";
}

export function CalendarToolbar({ period, view, onPrevious, onNext, onNow, onViewChange, children, headingLevel = "h3" }: CalendarToolbarProps) {
  const unit = view === "week" ? "week" : "day";
  const Heading = headingLevel;
  return (
    <div className="flex flex-col gap-3 lg:flex-row lg:items-center lg:justify-between" data-testid="calendar-toolbar">
      <div aria-live="polite" aria-atomic="true">
        <Heading className="text-lg font-semibold text-ink-900" data-testid="calendar-title">
          {period.title}
        </Heading>
        {period.range && <p className="text-sm text-stone-700">{period.range}</p>}
      </div>
      <div className="flex flex-wrap items-center gap-2">
        <div className="grid w-full grid-cols-2 gap-2 sm:flex sm:w-auto">
          <button type="button" className="button-quiet" onClick={onPrevious}>
            <span aria-hidden="true">‹</span> Previous {unit}
          </button>
          <button type="button" className="button-quiet" onClick={onNext}>
            Next {unit} <span aria-hidden="true">›</span>
          </button>
        </div>
        <div className="grid w-full grid-cols-2 gap-2 sm:flex sm:w-auto">
          <button type="button" className="button-quiet" onClick={onNow}>
            {view === "week" ? "This week" : "Today"}
          </button>
          {children}
        </div>
        <ViewSwitch view={view} onChange={onViewChange} />
      </div>
    </div>
  );
}
