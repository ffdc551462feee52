"use client";
import FullCalendar from "@fullcalendar/react";
import timeGridPlugin from "@fullcalendar/timegrid";
import { TZDate } from "@date-fns/tz";
import { format } from "date-fns";
import { useEffect, useState } from "react";

/** The site's wall-clock time of an instant, without offset, which FullCalendar places as given. */
function wallClock(instant: string, timeZone: string): string {
  return format(new TZDate(new Date(instant), timeZone), "yyyy-MM-dd'T'HH:mm:ss");
}

export interface CalendarShift {
  id: string;
  start: string;
  end: string;
  title: string;
}

// A week of shifts; on a phone the day view reads better, so narrow screens start there.
// Shifts show in the site's time zone whatever the phone's zone: each instant becomes the site's
// wall-clock time without offset, which FullCalendar (no time-zone plugin) places as given.
export function ShiftCalendar({ shifts, timeZone }: { shifts: CalendarShift[]; timeZone: string }) {
  const [narrow, setNarrow] = useState<boolean | null>(null);
  useEffect(() => {
    const query = window.matchMedia("(max-width: 640px)");
    setNarrow(query.matches);
  }, []);
  if (narrow === null) return <p className="text-sm text-stone-700">Loading the calendar…</p>;
  return (
    <div className="text-sm">
      <FullCalendar
        plugins={[timeGridPlugin]}
        initialView={narrow ? "timeGridDay" : "timeGridWeek"}
        headerToolbar={{ left: "prev,next today", center: "title", right: "timeGridWeek,timeGridDay" }}
        firstDay={1}
        allDaySlot={false}
        slotMinTime="06:00:00"
        slotMaxTime="24:00:00"
        height="auto"
        nowIndicator
        events={shifts.map((shift) => ({ ...shift, start: wallClock(shift.start, timeZone), end: wallClock(shift.end, timeZone) }))}
        eventTimeFormat={{ hour: "2-digit", minute: "2-digit", hour12: false }}
        slotLabelFormat={{ hour: "2-digit", minute: "2-digit", hour12: false }}
      />
    </div>
  );
}
