"use client";
import FullCalendar from "@fullcalendar/react";
import timeGridPlugin from "@fullcalendar/timegrid";
import type { DatesSetArg, DayHeaderContentArg, EventClickArg, EventContentArg, EventMountArg, SlotLabelContentArg } from "@fullcalendar/core";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { CalendarToolbar } from "@/components/calendar/calendar-toolbar";
import { addCalendarDays, mondayOf, periodTitle, type CalendarView } from "@/components/calendar/period-title";
import { calendarClock, calendarDay, wallClock } from "@/components/calendar/wall-clock";
import { useSiteFormat } from "@/components/site-format";
import { formatClock, formatDay, formatShortDay } from "@/lib/format";
import type { CalendarShift } from "../calendar-shifts";
import { ShiftCard, shiftCardLabel } from "./shift-card";
import { ShiftDetails } from "./shift-details";

const VIEW_TYPES: Record<CalendarView, string> = { week: "timeGridWeek", day: "timeGridDay" };

interface ShownPeriod {
  view: CalendarView;
  first: string;
  lastExclusive: string;
}

// A week of shifts; on a phone the day view reads better, so narrow screens start there.
// Shifts show in the site's time zone whatever the phone's zone: each instant becomes the site's
// wall-clock time without offset, which FullCalendar (no time-zone plugin) places as given.
// It opens on the guard's next shift (`initialDate`, a site date) and is driven by our own toolbar.
export function ShiftCalendar({ shifts, timeZone, initialDate }: { shifts: CalendarShift[]; timeZone: string; initialDate: string }) {
  const site = useSiteFormat();
  // The zone comes from the page: the site's locale may still be the default, its zone must not be.
  const format = useMemo(() => ({ ...site, timeZone }), [site, timeZone]);
  const calendarRef = useRef<FullCalendar>(null);
  const wrapperRef = useRef<HTMLDivElement>(null);
  const detailsHeading = useRef<HTMLHeadingElement>(null);
  const focusDetails = useRef(false);
  const [narrow, setNarrow] = useState<boolean | null>(null);
  const [period, setPeriod] = useState<ShownPeriod | null>(null);
  const [selectedId, setSelectedId] = useState<string | null>(null);

  useEffect(() => {
    setNarrow(window.matchMedia("(max-width: 640px)").matches);
  }, []);

  const byId = useMemo(() => new Map(shifts.map((shift) => [shift.id, shift])), [shifts]);
  const events = useMemo(
    () => shifts.map((shift) => ({ id: shift.id, title: shift.title, start: wallClock(shift.start, timeZone), end: wallClock(shift.end, timeZone) })),
    [shifts, timeZone],
  );
  const selected = selectedId ? byId.get(selectedId) ?? null : null;

  useEffect(() => {
    if (selected && focusDetails.current) detailsHeading.current?.focus();
    focusDetails.current = false;
  }, [selected]);

  const api = () => calendarRef.current?.getApi();
  const siteDayOf = useCallback((shift: CalendarShift) => wallClock(shift.start, timeZone).slice(0, 10), [timeZone]);

  const onDatesSet = useCallback((arg: DatesSetArg) => {
    setPeriod({ view: arg.view.type === VIEW_TYPES.day ? "day" : "week", first: calendarDay(arg.view.currentStart), lastExclusive: calendarDay(arg.view.currentEnd) });
  }, []);

  const onEventClick = useCallback((arg: EventClickArg) => {
    arg.jsEvent.preventDefault();
    focusDetails.current = true;
    setSelectedId(arg.event.id);
  }, []);

  const onEventMount = useCallback(
    (arg: EventMountArg) => {
      const shift = byId.get(arg.event.id);
      arg.el.setAttribute("role", "button");
      arg.el.dataset.shiftId = arg.event.id;
      if (shift) arg.el.setAttribute("aria-label", shiftCardLabel(shift, formatDay(format, shift.start), format));
    },
    [byId, format],
  );

  const now = useCallback(() => wallClock(new Date(), timeZone), [timeZone]);
  const eventClassNames = useCallback((arg: EventContentArg) => (arg.event.id === selectedId ? ["is-chosen"] : []), [selectedId]);
  const eventContent = useCallback(
    (arg: EventContentArg) => {
      const shift = byId.get(arg.event.id);
      return shift ? <ShiftCard shift={shift} format={format} /> : arg.event.title;
    },
    [byId, format],
  );
  const dayHeaderContent = useCallback((arg: DayHeaderContentArg) => formatShortDay(format, calendarDay(arg.date)), [format]);
  const slotLabelContent = useCallback((arg: SlotLabelContentArg) => formatClock(format, calendarClock(arg.date)), [format]);

  const closeDetails = () => {
    const id = selectedId;
    setSelectedId(null);
    // Back to the card the details came from, so a keyboard user keeps their place.
    wrapperRef.current?.querySelector<HTMLElement>(`[data-shift-id="${id}"]`)?.focus();
  };

  const nextShift = shifts.find((shift) => Date.parse(shift.end) > Date.now()) ?? null;
  const goToNextShift = () => {
    if (!nextShift) return;
    api()?.gotoDate(siteDayOf(nextShift));
    setSelectedId(nextShift.id);
  };

  const changeView = (view: CalendarView) => {
    if (view !== "day" || !period || period.view === "day") {
      api()?.changeView(VIEW_TYPES[view]);
      return;
    }
    // From a week to one of its days: the chosen shift's, else today, else the first shift's, else Monday.
    const inView = (day: string) => day >= period.first && day < period.lastExclusive;
    const today = wallClock(new Date(), timeZone).slice(0, 10);
    const firstShift = shifts.find((shift) => inView(siteDayOf(shift)));
    const day = selected && inView(siteDayOf(selected)) ? siteDayOf(selected) : inView(today) ? today : firstShift ? siteDayOf(firstShift) : period.first;
    api()?.changeView(VIEW_TYPES.day, day);
  };

  if (narrow === null) return <p className="text-sm text-stone-700">Loading the calendar…</p>;
  // Until the calendar reports its dates, the title is worked out from where it opens.
  const shown: ShownPeriod =
    period ??
    (narrow
      ? { view: "day", first: initialDate, lastExclusive: addCalendarDays(initialDate, 1) }
      : { view: "week", first: mondayOf(initialDate), lastExclusive: addCalendarDays(mondayOf(initialDate), 7) });

  return (
    <div className="space-y-4">
      <CalendarToolbar
        period={periodTitle(format, shown.view, shown.first, shown.lastExclusive)}
        view={shown.view}
        onPrevious={() => api()?.prev()}
        onNext={() => api()?.next()}
        onNow={() => api()?.today()}
        onViewChange={changeView}
      >
        <button type="button" className="button-quiet disabled:cursor-not-allowed disabled:text-stone-500" onClick={goToNextShift} disabled={!nextShift}>
          Next shift
        </button>
      </CalendarToolbar>
      <div ref={wrapperRef} className="calendar-theme" data-testid="shift-calendar">
        <FullCalendar
          ref={calendarRef}
          plugins={[timeGridPlugin]}
          initialView={narrow ? VIEW_TYPES.day : VIEW_TYPES.week}
          initialDate={initialDate}
          headerToolbar={false}
          firstDay={1}
          allDaySlot={false}
          slotMinTime="06:00:00"
          slotMaxTime="24:00:00"
          height="auto"
          nowIndicator
          now={now}
          events={events}
          datesSet={onDatesSet}
          eventClick={onEventClick}
          eventDidMount={onEventMount}
          eventClassNames={eventClassNames}
          eventContent={eventContent}
          dayHeaderContent={dayHeaderContent}
          slotLabelContent={slotLabelContent}
        />
      </div>
      {selected ? (
        <ShiftDetails shift={selected} format={format} onClose={closeDetails} headingRef={detailsHeading} />
      ) : (
        <p className="text-sm text-stone-700">Choose a shift in the calendar (click it, or Tab to it and press Enter) to see its posts, breaks and who else is on your floor.</p>
      )}
    </div>
  );
}
