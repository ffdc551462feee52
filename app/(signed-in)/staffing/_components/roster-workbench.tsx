"use client";
// The week's roster work: pick a Monday, build (a background job, polled), look at the draft,
// edit it, publish it; earlier published versions stay readable.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useState } from "react";
import { DateField } from "@/components/date-field";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch } from "@/lib/api/client";
import { dateInputShape, formatDateTime, isCalendarDate } from "@/lib/format";
import { addCalendarDays as shiftDate, isMonday } from "@/lib/rosters/scenario";
import type { JobState, RosterView, WeekOverview } from "./roster-types";
import { RosterGrid } from "./roster-grid";
import { RosterSummary } from "./roster-summary";
import { PublishReviewPanel } from "./publish-review";
import { WeekBuilder } from "./week-builder";

function useJob(jobId: number | null) {
  return useQuery({
    queryKey: ["job", jobId],
    queryFn: () => apiFetch<{ job: JobState }>(`/api/jobs/${jobId}`).then((r) => r.job),
    enabled: jobId !== null,
    // Poll while the job is on its way; stop once it is done or failed.
    refetchInterval: (query) => (query.state.data && (query.state.data.status === "done" || query.state.data.status === "failed") ? false : 1000),
    staleTime: 0,
  });
}

export function RosterWorkbench({ initialWeek, initialRosterId = null }: { initialWeek: string; initialRosterId?: number | null }) {
  const router = useRouter();
  const queryClient = useQueryClient();
  const { locale } = useSiteFormat();
  const [week, setWeek] = useState(initialWeek);
  const [weekInput, setWeekInput] = useState(initialWeek);
  const [shownRosterId, setShownRosterId] = useState<number | null>(initialRosterId);
  const [buildJobId, setBuildJobId] = useState<number | null>(null);
  const [mailJobId, setMailJobId] = useState<number | null>(null);
  const [interactive, setInteractive] = useState(false);
  // Publishing opens the review first; the draft is published from there.
  const [reviewing, setReviewing] = useState(false);
  useEffect(() => setInteractive(true), []);

  const overview = useQuery({
    queryKey: ["roster-week", week],
    queryFn: () => apiFetch<{ week: WeekOverview }>(`/api/rosters?startsOn=${week}`).then((r) => r.week),
    staleTime: 0,
  });
  // A build still running for this week (e.g. started before a reload) is followed too.
  const pendingBuild = overview.data?.build && (overview.data.build.status === "queued" || overview.data.build.status === "running") ? overview.data.build.id : null;
  const activeBuildId = buildJobId ?? pendingBuild;
  const buildJob = useJob(activeBuildId);
  const mailJob = useJob(mailJobId);

  // Only a roster of the chosen week is shown (an address may name another week's roster).
  const ofWeek = (id: number | null) => id !== null && (overview.data?.draft?.id === id || (overview.data?.published ?? []).some((p) => p.id === id));
  const rosterId = (ofWeek(shownRosterId) ? shownRosterId : null) ?? overview.data?.draft?.id ?? overview.data?.published[0]?.id ?? null;
  const roster = useQuery({
    queryKey: ["roster", rosterId],
    queryFn: () => apiFetch<{ roster: RosterView }>(`/api/rosters/${rosterId}`).then((r) => r.roster),
    enabled: rosterId !== null,
    staleTime: 0,
  });

  useEffect(() => {
    if (buildJob.data?.status === "done") {
      setShownRosterId(null);
      void queryClient.invalidateQueries({ queryKey: ["roster-week", week] });
      // A rebuilt draft keeps its id: drop what was shown, so nobody edits or publishes the old revision.
      void queryClient.resetQueries({ queryKey: ["roster"] });
      router.refresh();
    }
  }, [buildJob.data?.status, queryClient, week, router]);

  const build = useMutation({
    mutationFn: () => apiFetch<{ job: JobState }>("/api/rosters/build", { body: { startsOn: week } }),
    onSuccess: ({ job }) => setBuildJobId(job.id),
  });
  const publish = useMutation({
    mutationFn: ({ draft, confirmation, note }: { draft: RosterView; confirmation?: string; note?: string }) =>
      apiFetch<{ roster: { id: number; version: number }; mailJob: { id: number } }>(`/api/rosters/${draft.id}/publish`, {
        body: { revision: draft.revision, ...(confirmation !== undefined ? { confirmation } : {}), ...(note !== undefined ? { note } : {}) },
      }),
    onSuccess: ({ mailJob: job }) => {
      setReviewing(false);
      setMailJobId(job.id);
      void queryClient.invalidateQueries({ queryKey: ["roster-week", week] });
      router.refresh();
    },
  });

  const weekProblem = !isCalendarDate(weekInput)
    ? `Type the Monday as ${dateInputShape(locale).placeholder}.`
    : isMonday(weekInput)
      ? null
      : "Pick a Monday: rosters run Monday to Sunday.";
  const chooseWeek = (next: string) => {
    setWeekInput(next);
    if (isMonday(next)) {
      setWeek(next);
      setShownRosterId(null);
      setBuildJobId(null);
      setMailJobId(null);
      setReviewing(false);
      build.reset();
      publish.reset();
    }
  };

  const building = buildJob.data ? buildJob.data.status === "queued" || buildJob.data.status === "running" : build.isPending;
  const draft = overview.data?.draft ?? null;
  // While a build runs the draft on screen is about to be replaced: show it again once rebuilt.
  const shown = building ? null : (roster.data ?? null);
  // The draft on screen is already a version: publishing it again would change nothing.
  const draftPublished = shown?.status === "draft" && overview.data?.draft?.revision === shown.revision && overview.data.status.draftIsNewer === false;

  return (
    <section aria-labelledby="roster-heading" className="card space-y-4">
      <h2 id="roster-heading">Roster</h2>
      <div className="flex flex-wrap items-end gap-3">
        <DateField
          id="roster-week"
          label="Week starting (Monday)"
          value={weekInput}
          onChange={chooseWeek}
          invalid={weekProblem !== null}
          describedBy="roster-week-message"
        />
        <button type="button" className="button-quiet" onClick={() => chooseWeek(shiftDate(week, -7))}>Previous week</button>
        <button type="button" className="button-quiet" onClick={() => chooseWeek(shiftDate(week, 7))}>Next week</button>
        <button type="button" className="button" disabled={!interactive || building || weekProblem !== null} onClick={() => build.mutate()}>
          {draft ? "Rebuild roster" : "Build roster"}
        </button>
      </div>
      <p id="roster-week-message" role={weekProblem ? "alert" : undefined} className={weekProblem ? "text-sm text-alert-700" : "sr-only"}>
        {weekProblem ?? ""}
      </p>
      {build.error && <p role="alert" className="text-alert-700">{build.error.message}</p>}

      {activeBuildId !== null && buildJob.data && (
        <JobProgress label="Building the roster" job={buildJob.data} />
      )}

      <Versions
        overview={overview.data ?? null}
        shownId={shown?.id ?? null}
        onShow={(id) => setShownRosterId(id)}
      />

      {overview.error && <p role="alert" className="text-alert-700">{overview.error.message}</p>}
      {roster.error && <p role="alert" className="text-alert-700">{roster.error.message}</p>}
      {overview.data && <WeekStatus overview={overview.data} timeZone={shown?.timeZone ?? null} />}
      {shown && (
        <>
          <div className="flex flex-wrap items-center gap-3">
            <p className="font-semibold" data-testid="roster-status">
              {shown.status === "draft" ? `Showing the draft (revision ${shown.revision})` : `Showing published version ${shown.version}`}
              {shown.status === "published" && shown.id !== overview.data?.status.current?.id ? " (superseded)" : ""}
            </p>
            <a className="button-quiet" href={`/api/rosters/${shown.id}/csv`} download>
              Download CSV
            </a>
            <a className="button-quiet" href={`/staffing/sheet?date=${shown.days.find((d) => d.opening !== null)?.date ?? shown.startsOn}`}>
              Sign-in sheets
            </a>
            {shown.status === "draft" && (
              <button
                type="button"
                className="button"
                disabled={!interactive || publish.isPending || roster.isFetching || shown.violations.length > 0 || draftPublished || reviewing}
                aria-expanded={reviewing}
                onClick={() => {
                  publish.reset();
                  setReviewing(true);
                }}
              >
                Publish…
              </button>
            )}
          </div>
          {shown.status === "draft" && reviewing && !draftPublished && (
            <PublishReviewPanel
              roster={shown}
              busy={publish.isPending}
              onPublish={(confirmation) => publish.mutate({ draft: shown, ...confirmation })}
              onCancel={() => setReviewing(false)}
            />
          )}
          {shown.status === "draft" && draftPublished && (
            <p className="text-sm text-stone-700">This revision is published; reassign or rebuild to make a new version.</p>
          )}
          {publish.error && <p role="alert" className="text-alert-700">{publish.error.message}</p>}
          {publish.data && (
            <p role="status" className="text-ink-800">
              Published version {publish.data.roster.version}; e-mailing every guard on it.
            </p>
          )}
          {mailJobId !== null && mailJob.data && <JobProgress label="E-mailing guards" job={mailJob.data} />}
          <RosterSummary roster={shown} />
          {shown.status === "draft" && <WeekBuilder roster={shown} onChanged={() => void queryClient.invalidateQueries({ queryKey: ["roster-week", week] })} />}
          <RosterGrid roster={shown} onChanged={() => void queryClient.invalidateQueries({ queryKey: ["roster-week", week] })} />
        </>
      )}
      {!shown && overview.data && !overview.data.draft && overview.data.published.length === 0 && !building && (
        <p>No roster for this week yet. Build one: it takes a few seconds.</p>
      )}
    </section>
  );
}

function JobProgress({ label, job }: { label: string; job: JobState }) {
  const percent = Math.round(job.progress * 100);
  return (
    <div className="space-y-1" data-testid="job-progress">
      <p className="text-sm font-semibold text-ink-800" id={`job-${job.id}-label`}>
        {label}: {job.status === "failed" ? "failed" : job.status === "done" ? "done" : `${percent}%`}
      </p>
      <progress className="w-full" max={100} value={percent} aria-labelledby={`job-${job.id}-label`} />
      <p role="status" className={job.status === "failed" ? "text-sm text-alert-700" : "text-sm text-stone-700"}>{job.message}</p>
    </div>
  );
}

/** The week's state in one line: the version guards go by, and whether the draft holds more. */
function WeekStatus({ overview, timeZone }: { overview: WeekOverview; timeZone: string | null }) {
  const site = useSiteFormat();
  const { current, draftIsNewer } = overview.status;
  if (!current && !overview.draft) return null;
  const when = current?.publishedAt && timeZone ? ` on ${formatDateTime({ ...site, timeZone }, current.publishedAt)}` : "";
  return (
    <div className="rounded-md border border-stone-300 p-3" data-testid="week-status">
      <p className="font-semibold" data-testid="published-version">
        {current ? `Published version ${current.version}${when}` : "Not published yet"}
      </p>
      {overview.draft && (
        <p className={draftIsNewer ? "text-sm font-semibold text-brass-700" : "text-sm text-stone-700"} data-testid="draft-state">
          {draftIsNewer
            ? current
              ? `A newer draft (revision ${overview.draft.revision}) is not published yet; guards still go by version ${current.version}.`
              : `Draft (revision ${overview.draft.revision}): guards see nothing of this week until it is published.`
            : `The draft (revision ${overview.draft.revision}) is what version ${current!.version} holds.`}
        </p>
      )}
    </div>
  );
}

function Versions({ overview, shownId, onShow }: { overview: WeekOverview | null; shownId: number | null; onShow: (id: number) => void }) {
  if (!overview || (!overview.draft && overview.published.length === 0)) return null;
  return (
    <div className="flex flex-wrap items-center gap-2 text-sm">
      <span className="font-semibold">This week:</span>
      {overview.draft && (
        <button type="button" className={overview.draft.id === shownId ? "button" : "button-quiet"} onClick={() => onShow(overview.draft!.id)}>
          Draft
        </button>
      )}
      {overview.published.map((version, index) => (
        <button key={version.id} type="button" className={version.id === shownId ? "button" : "button-quiet"} onClick={() => onShow(version.id)}>
          Version {version.version}
          {index === 0 ? " (current)" : " (superseded)"}
        </button>
      ))}
    </div>
  );
}
