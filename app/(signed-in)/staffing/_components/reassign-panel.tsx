"use client";
// Giving one stretch of the draft to another guard: the server lists who can take it (skills,
// availability, rest, hours) with their hours so far, and the others with the rule they would break;
// the change is checked again when it is made.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch } from "@/lib/api/client";
import { formatHours } from "@/lib/format";
import type { ReassignOption } from "@/lib/rosters/edit";
import type { RosterView } from "./roster-types";
import type { Selection } from "./roster-grid";

export function ReassignPanel({ roster, selection, onDone, onCancel }: { roster: RosterView; selection: Selection; onDone: () => void; onCancel: () => void }) {
  const queryClient = useQueryClient();
  const site = useSiteFormat();
  const hours = (h: number) => formatHours(site, h);
  const query = new URLSearchParams({ post: selection.post, start: selection.cell.segmentStart });
  if (selection.cell.guardId !== null) query.set("guardId", String(selection.cell.guardId));
  const options = useQuery({
    queryKey: ["reassign-options", roster.id, roster.revision, query.toString()],
    queryFn: () => apiFetch<{ options: ReassignOption[] }>(`/api/rosters/${roster.id}/reassign?${query}`).then((r) => r.options),
    staleTime: 0,
  });
  const able = (options.data ?? []).filter((o) => o.ok);
  const others = (options.data ?? []).filter((o) => !o.ok);
  const [guardId, setGuardId] = useState<number>(0);
  // Once the list is in, preselect the first guard who can take the stretch.
  useEffect(() => {
    const list = options.data;
    if (!list) return;
    setGuardId((current) => (list.some((o) => o.guardId === current) ? current : (list.find((o) => o.ok) ?? list[0])?.guardId ?? 0));
  }, [options.data]);
  const chosen = options.data?.find((o) => o.guardId === guardId) ?? null;
  const change = useMutation({
    mutationFn: () =>
      apiFetch<{ roster: RosterView }>(`/api/rosters/${roster.id}/reassign`, {
        body: { revision: roster.revision, from: { guardId: selection.cell.guardId, post: selection.post, start: selection.cell.segmentStart }, toGuardId: guardId },
      }),
    onSuccess: ({ roster: updated }) => {
      queryClient.setQueryData(["roster", roster.id], updated);
      onDone();
    },
  });
  const label = (o: ReassignOption) => `${o.name} — ${hours(o.hoursSoFar)} of ${hours(o.contractHours)} so far`;
  return (
    <form
      className="rounded-md border border-brass-300 bg-brass-100 p-3"
      onSubmit={(event) => {
        event.preventDefault();
        change.mutate();
      }}
      aria-label="Reassign"
    >
      <p className="font-semibold">
        {selection.postLabel}, {selection.when}: {selection.cell.guardName ?? "unfilled"}
      </p>
      {selection.cell.reason && <p className="text-sm text-stone-700">Unfilled because {selection.cell.reason}</p>}
      {options.isPending && <p role="status" className="text-sm">Checking who can take this stretch…</p>}
      {options.error && <p role="alert" className="text-sm text-alert-700">{options.error.message}</p>}
      {options.data && (
        <div className="mt-2 flex flex-wrap items-end gap-2">
          <div className="min-w-0 max-w-full">
            <label htmlFor="reassign-guard" className="field-label">Give this stretch to</label>
            <select id="reassign-guard" className="field-input" value={guardId} onChange={(event) => setGuardId(Number(event.target.value))} aria-describedby="reassign-choice">
              <optgroup label={able.length ? `Can take it (${able.length})` : "Nobody can take it without breaking a rule"}>
                {able.map((o) => (
                  <option key={o.guardId} value={o.guardId}>{label(o)}</option>
                ))}
              </optgroup>
              {others.length > 0 && (
                <optgroup label={`Would break a rule (${others.length})`}>
                  {others.map((o) => (
                    <option key={o.guardId} value={o.guardId}>
                      {label(o)} — {o.rule}
                    </option>
                  ))}
                </optgroup>
              )}
            </select>
          </div>
          <button type="submit" className="button" disabled={change.isPending || !guardId || chosen?.ok === false}>Reassign</button>
          <button type="button" className="button-quiet" onClick={onCancel}>Cancel</button>
        </div>
      )}
      <p id="reassign-choice" className="mt-2 text-sm text-stone-700">
        {chosen && !chosen.ok ? `${chosen.name} cannot take it: ${chosen.reason}` : chosen ? `${chosen.name} can take it within every rule.` : ""}
      </p>
      {change.error && <p role="alert" className="mt-2 text-sm text-alert-700">{change.error.message}</p>}
    </form>
  );
}
