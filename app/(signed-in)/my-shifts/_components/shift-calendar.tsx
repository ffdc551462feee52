"use client";
import FullCalendar from "@fullcalendar/react";
import timeGridPlugin from "@fullcalendar/timegrid";
import { useEffect, useState } from "react";

export interface CalendarShift {
  id: string;
  start: string;
  end: string;
  title: string;
}

// A week of shifts; on a phone the day view reads better, so narrow screens start there.
export function ShiftCalendar({ shifts }: { shifts: CalendarShift[] }) {
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
        events={shifts}
        eventTimeFormat={{ hour: "2-digit", minute: "2-digit", hour12: false }}
        slotLabelFormat={{ hour: "2-digit", minute: "2-digit", hour12: false }}
      />
    </div>
  );
}
