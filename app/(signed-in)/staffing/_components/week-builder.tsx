"use client";
// The draft week on a time grid: by post (a colour per post) or by guard (a colour per guard, one
// guard's lane at a time if chosen), unfilled hours as their own blocks with the reason. A segment
// is dragged or resized to move it, or chosen (click, or Tab and Enter) to change it in a form; each
// change is checked in the browser by the engine's rules, then saved and checked again on the server.
import FullCalendar from "@fullcalendar/react";
import timeGridPlugin from "@fullcalendar/timegrid";
import interactionPlugin from "@fullcalendar/interaction";
import type { DatesSetArg, DayHeaderContentArg, EventClickArg, EventContentArg, EventDropArg, EventMountArg, SlotLabelContentArg } from "@fullcalendar/core";
import type { EventResizeDoneArg } from "@fullcalendar/interaction";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useCallback, useEffect, useMemo, useRef, useState } from "react";
import { CalendarToolbar } from "@/components/calendar/calendar-toolbar";
import { addCalendarDays, periodTitle, type CalendarView } from "@/components/calendar/period-title";
import { calendarClock, calendarDay } from "@/components/calendar/wall-clock";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch } from "@/lib/api/client";
import { formatClock, formatShortDay, formatTime } from "@/lib/format";
import type { BuilderData } from "@/lib/rosters/builder";
import { editCheckContext } from "@/lib/rosters/edit-check";
import type { AdjustRequestBody } from "@/lib/rosters/schemas";
import { localToInstant } from "@/lib/scheduling/time";
import { AdjustPanel, type ProposedChange } from "./adjust-panel";
import { BuilderOverrides, BuilderTotals } from "./builder-totals";
import type { RosterView } from "./roster-types";
import { builderBlocks, builderEvents, engineRosterOf, segmentId, type BuilderView } from "./week-builder-events";

const VIEW_TYPES: Record<CalendarView, string> = { week: "timeGridWeek", day: "timeGridDay" };
const VIEWS: { view: BuilderView; label: string }[] = [
  { view: "post", label: "By post" },
  { view: "guard", label: "By guard" },
];

export function WeekBuilder({ roster, onChanged }: { roster: RosterView; onChanged: () => void }) {
  const site = useSiteFormat();
  const f = useMemo(() => ({ ...site, timeZone: roster.timeZone }), [site, roster.timeZone]);
  const queryClient = useQueryClient();
  const calendarRef = useRef<FullCalendar>(null);
  const wrapperRef = useRef<HTMLDivElement>(null);
  const [narrow, setNarrow] = useState<boolean | null>(null);
  const [view, setView] = useState<BuilderView>("post");
  // One post (or one guard's lane) at a time reads best; "every" is one choice away.
  const firstOf = (v: BuilderView) => (v === "post" ? (roster.posts[0]?.id ?? "") : String(roster.guards[0]?.id ?? ""));
  const [filter, setFilter] = useState(() => firstOf("post"));
  const [period, setPeriod] = useState<{ view: CalendarView; first: string; lastExclusive: string } | null>(null);
  const [proposal, setProposal] = useState<ProposedChange | null>(null);
  const [chosenGap, setChosenGap] = useState<string | null>(null);
  const [saved, setSaved] = useState<string | null>(null);
  useEffect(() => setNarrow(window.matchMedia("(max-width: 640px)").matches), []);

  const builder = useQuery({
    queryKey: ["roster-builder", roster.id, roster.revision],
    queryFn: () => apiFetch<{ builder: BuilderData }>(`/api/rosters/${roster.id}/adjust`).then((r) => r.builder),
    staleTime: 0,
  });
  // The engine's checks run here on the roster as loaded, with the names the server uses in messages.
  const edit = useMemo(() => {
    if (!builder.data) return null;
    const names = new Map(roster.guards.map((g) => [g.id, g.name]));
    for (const s of roster.shifts) names.set(s.guardId, s.guardName);
    return editCheckContext(builder.data.scenario, engineRosterOf(roster), names, new Map(roster.posts.map((p) => [p.id, p.label])));
  }, [builder.data, roster]);

  const blocks = useMemo(() => builderBlocks(roster), [roster]);
  const editable = roster.status === "draft";
  const events = useMemo(() => builderEvents(roster, blocks, view, filter, editable), [roster, blocks, view, filter, editable]);

  const save = useMutation({
    mutationFn: ({ change, overrideNote }: { change: ProposedChange; overrideNote?: string }) => {
      const body: AdjustRequestBody = {
        revision: roster.revision,
        from: { guardId: change.segment.guardId, post: change.segment.post, start: change.segment.start },
        start: change.start,
        end: change.end,
        ...(change.toGuardId !== change.segment.guardId ? { toGuardId: change.toGuardId } : {}),
        ...(overrideNote ? { overrideNote } : {}),
      };
      return apiFetch<{ revision: number }>(`/api/rosters/${roster.id}/adjust`, { body });
    },
    onSuccess: async (_data, { change, overrideNote }) => {
      setProposal(null);
      setSaved(`Saved: ${change.segment.guardName} at ${change.segment.postLabel} now ${formatShortDay(f, change.start)} ${formatTime(f, change.start)}–${formatTime(f, change.end)}${overrideNote ? ", kept with your note" : ""}.`);
      // Re-read the roster (totals, unfilled hours, violations) and the overrides after the change.
      await Promise.all([queryClient.invalidateQueries({ queryKey: ["roster", roster.id] }), queryClient.invalidateQueries({ queryKey: ["roster-builder", roster.id] })]);
      onChanged();
    },
  });

  const propose = useCallback(
    (id: string, start: Date | null, end: Date | null) => {
      const block = blocks.get(id);
      if (block?.kind !== "segment" || !start || !end) return;
      const zone = roster.timeZone;
      const instant = (d: Date) => new Date(localToInstant(zone, calendarDay(d), calendarClock(d))).toISOString();
      save.reset();
      setSaved(null);
      setProposal({ segment: block.segment, start: instant(start), end: instant(end), toGuardId: block.segment.guardId });
    },
    [blocks, roster.timeZone, save],
  );

  // The calendar snaps back at once: the move is only a proposal until the check and the server agree.
  const onDrop = useCallback((arg: EventDropArg) => {
    arg.revert();
    propose(arg.event.id, arg.event.start, arg.event.end);
  }, [propose]);
  const onResize = useCallback((arg: EventResizeDoneArg) => {
    arg.revert();
    propose(arg.event.id, arg.event.start, arg.event.end);
  }, [propose]);
  const onClick = useCallback(
    (arg: EventClickArg) => {
      arg.jsEvent.preventDefault();
      const block = blocks.get(arg.event.id);
      if (block?.kind === "unfilled") {
        setProposal(null);
        setChosenGap(arg.event.id);
        return;
      }
      setChosenGap(null);
      if (block?.kind === "segment" && editable) {
        save.reset();
        setSaved(null);
        setProposal({ segment: block.segment, start: block.segment.start, end: block.segment.end, toGuardId: block.segment.guardId });
      }
    },
    [blocks, editable, save],
  );
  const onMount = useCallback(
    (arg: EventMountArg) => {
      const block = blocks.get(arg.event.id);
      arg.el.setAttribute("role", "button");
      arg.el.setAttribute("tabindex", "0");
      arg.el.dataset.block = arg.event.id;
      if (!block) return;
      if (block.kind === "segment") {
        const s = block.segment;
        arg.el.setAttribute("aria-label", `${s.guardName} at ${s.postLabel}, ${formatShortDay(f, s.start)} ${formatTime(f, s.start)}–${formatTime(f, s.end)}; press Enter to change`);
      } else {
        const r = block.run;
        arg.el.setAttribute("aria-label", `Unfilled: ${r.postLabel}, ${formatShortDay(f, r.start)} ${formatTime(f, r.start)}–${formatTime(f, r.end)}: ${r.reason}`);
      }
    },
    [blocks, f],
  );
  const onDatesSet = useCallback((arg: DatesSetArg) => {
    setPeriod({ view: arg.view.type === VIEW_TYPES.day ? "day" : "week", first: calendarDay(arg.view.currentStart), lastExclusive: calendarDay(arg.view.currentEnd) });
  }, []);
  // Times in the site's locale, not the library's words.
  const eventContent = useCallback(
    (arg: EventContentArg) => (
      <div className="shift-card">
        <p className="shift-card-time">{arg.event.start && arg.event.end ? `${formatClock(f, calendarClock(arg.event.start))}–${formatClock(f, calendarClock(arg.event.end))}` : ""}</p>
        <p className="shift-card-line">{arg.event.title}</p>
      </div>
    ),
    [f],
  );
  const dayHeaderContent = useCallback((arg: DayHeaderContentArg) => formatShortDay(f, calendarDay(arg.date)), [f]);
  const slotLabelContent = useCallback((arg: SlotLabelContentArg) => formatClock(f, calendarClock(arg.date)), [f]);

  const api = () => calendarRef.current?.getApi();
  const firstOpen = roster.days.find((d) => d.opening)?.date ?? roster.startsOn;
  const weekEnd = addCalendarDays(roster.startsOn, roster.days.length);
  const openings = roster.days.flatMap((d) => (d.opening ? [d.opening] : []));
  const earliest = openings.reduce((min, o) => (o[0] < min ? o[0] : min), "10:00");
  const slotMin = `${String(Math.max(0, Number(earliest.slice(0, 2)) - 1)).padStart(2, "0")}:00:00`;
  const gap = chosenGap ? blocks.get(chosenGap) : null;

  if (narrow === null) return <p className="text-sm text-stone-700">Loading the week builder…</p>;
  const shown = period ?? (narrow ? { view: "day" as const, first: firstOpen, lastExclusive: addCalendarDays(firstOpen, 1) } : { view: "week" as const, first: roster.startsOn, lastExclusive: weekEnd });

  return (
    <section aria-labelledby="week-builder-heading" className="space-y-3" data-testid="week-builder">
      <h3 id="week-builder-heading">Week builder</h3>
      <p className="text-sm text-stone-700">
        Drag a block to move it, drag its lower edge to change its end, or choose it (Tab, then Enter) to set its day, times and guard. Every change is checked by the labour
        rules before it is saved.
      </p>
      <BuilderTotals roster={roster} />
      {builder.data && <BuilderOverrides overrides={builder.data.overrides} roster={roster} />}
      {builder.error && <p role="alert" className="text-sm text-alert-700">{builder.error.message}</p>}
      <div className="flex flex-wrap items-end gap-3">
        <div role="group" aria-label="Show the week" className="segmented w-full sm:w-auto">
          {VIEWS.map((option) => (
            <button key={option.view} type="button" aria-pressed={view === option.view} className="segmented-option" onClick={() => { setView(option.view); setFilter(firstOf(option.view)); }}>
              {option.label}
            </button>
          ))}
        </div>
        <div className="text-sm">
          <label htmlFor="builder-filter" className="block font-semibold">{view === "post" ? "Post" : "Guard's lane"}</label>
          <select id="builder-filter" className="field-input mt-1 block min-h-[2.75rem] w-full sm:w-64" value={filter} onChange={(e) => setFilter(e.target.value)}>
            <option value="">{view === "post" ? "Every post" : "Every guard"}</option>
            {view === "post"
              ? roster.posts.map((p) => <option key={p.id} value={p.id}>{p.label}</option>)
              : roster.guards.map((g) => <option key={g.id} value={String(g.id)}>{g.name}</option>)}
          </select>
        </div>
      </div>
      <CalendarToolbar
        headingLevel="h4"
        period={periodTitle(f, shown.view, shown.first, shown.lastExclusive)}
        view={shown.view}
        onPrevious={() => api()?.prev()}
        onNext={() => api()?.next()}
        onNow={() => api()?.gotoDate(shown.view === "week" ? roster.startsOn : firstOpen)}
        onViewChange={(next) => api()?.changeView(VIEW_TYPES[next], next === "day" ? (shown.view === "week" ? firstOpen : shown.first) : roster.startsOn)}
      />
      {saved && <p role="status" className="text-sm font-semibold text-ok-700" data-testid="adjust-saved">{saved}</p>}
      {proposal && (
        <AdjustPanel
          key={`${proposal.segment.guardId}|${proposal.segment.start}|${proposal.start}|${proposal.end}`}
          roster={roster}
          edit={edit}
          proposal={proposal}
          busy={save.isPending}
          serverError={save.error?.message ?? null}
          onSave={(change, overrideNote) => save.mutate({ change, overrideNote })}
          onCancel={() => {
            const id = proposal ? segmentId(proposal.segment) : null;
            setProposal(null);
            save.reset();
            // Back to the block the form came from, so a keyboard user keeps their place.
            if (id) wrapperRef.current?.querySelector<HTMLElement>(`[data-block="${CSS.escape(id)}"]`)?.focus();
          }}
        />
      )}
      {gap?.kind === "unfilled" && (
        <div role="status" className="rounded-md border border-alert-200 bg-alert-50 p-3 text-sm" data-testid="unfilled-details">
          <p className="font-semibold">
            Unfilled: {gap.run.postLabel}, {formatShortDay(f, gap.run.start)} {formatTime(f, gap.run.start)}–{formatTime(f, gap.run.end)}
          </p>
          <p>{gap.run.reason}</p>
        </div>
      )}
      <div ref={wrapperRef} className="calendar-theme week-builder" data-testid="week-builder-calendar">
        <FullCalendar
          ref={calendarRef}
          plugins={[timeGridPlugin, interactionPlugin]}
          initialView={narrow ? VIEW_TYPES.day : VIEW_TYPES.week}
          initialDate={narrow ? firstOpen : roster.startsOn}
          validRange={{ start: roster.startsOn, end: weekEnd }}
          headerToolbar={false}
          firstDay={1}
          allDaySlot={false}
          slotMinTime={slotMin}
          slotMaxTime="24:00:00"
          slotDuration={{ minutes: 30 }}
          snapDuration={{ minutes: builder.data?.scenario.rules.slotMinutes ?? 60 }}
          height="auto"
          editable={editable}
          eventDurationEditable={editable}
          eventStartEditable={editable}
          eventInteractive
          events={events}
          eventDrop={onDrop}
          eventResize={onResize}
          eventClick={onClick}
          eventDidMount={onMount}
          eventContent={eventContent}
          datesSet={onDatesSet}
          dayHeaderContent={dayHeaderContent}
          slotLabelContent={slotLabelContent}
          slotEventOverlap={false}
        />
      </div>
    </section>
  );
}
