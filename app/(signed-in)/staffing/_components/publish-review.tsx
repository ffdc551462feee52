"use client";
// The publish review: before a draft goes to every guard, what it leaves unguarded and whom it works
// past their contract. With a room left empty while open, publishing needs the room's name typed and
// a note (the API checks both again and keeps them with the version).
import { useEffect, useRef } from "react";
import { useQuery } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { zodResolver } from "@hookform/resolvers/zod";
import { z } from "zod";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch } from "@/lib/api/client";
import { formatHours, formatSpan, type SiteFormat } from "@/lib/format";
import type { PublishReview } from "@/lib/rosters/review";
import type { RosterView } from "./roster-types";

interface Props {
  roster: RosterView;
  busy: boolean;
  onPublish: (confirmation: { confirmation?: string; note?: string }) => void;
  onCancel: () => void;
}

export function PublishReviewPanel({ roster, busy, onPublish, onCancel }: Props) {
  const heading = useRef<HTMLHeadingElement>(null);
  const shown = { ...useSiteFormat(), timeZone: roster.timeZone };
  const review = useQuery({
    queryKey: ["roster-review", roster.id, roster.revision],
    queryFn: () => apiFetch<{ review: PublishReview }>(`/api/rosters/${roster.id}/review`).then((r) => r.review),
    staleTime: 0,
  });
  useEffect(() => heading.current?.focus(), []);
  const data = review.data;

  return (
    <section aria-labelledby="publish-review-heading" className="space-y-4 rounded-card border-2 border-ink-300 bg-stone-50 p-gutter" data-testid="publish-review">
      <h3 id="publish-review-heading" ref={heading} tabIndex={-1}>
        Before publishing revision {roster.revision}
      </h3>
      {review.isPending && <p role="status">Checking the week…</p>}
      {review.error && <p role="alert" className="text-alert-700">{review.error.message}</p>}
      {data && (
        <>
          <EmptyRooms review={data} shown={shown} />
          <Shortfalls review={data} shown={shown} />
          <OverContract review={data} shown={shown} />
          {data.needsConfirmation ? (
            <ConfirmForm review={data} busy={busy} onPublish={onPublish} onCancel={onCancel} />
          ) : (
            <div className="flex flex-wrap gap-3">
              <button type="button" className="button" disabled={busy} onClick={() => onPublish({})}>
                Publish and e-mail guards
              </button>
              <button type="button" className="button-quiet" onClick={onCancel}>
                Back to the draft
              </button>
            </div>
          )}
        </>
      )}
    </section>
  );
}

function EmptyRooms({ review, shown }: { review: PublishReview; shown: SiteFormat }) {
  if (review.emptyRooms.length === 0) {
    return <p data-testid="review-empty-rooms">Every room open to visitors has a guard in every open hour.</p>;
  }
  return (
    <div className="space-y-2" data-testid="review-empty-rooms">
      <p className="font-semibold text-alert-700">
        {review.emptyRooms.length === 1 ? "A room stands" : `${review.emptyRooms.length} rooms stand`} without a guard while open to visitors:
      </p>
      <ul className="space-y-1">
        {review.emptyRooms.map((room) => (
          <li key={room.room}>
            <span className="font-semibold">{room.room}</span>
            {room.risk === "high" && <span className="tag-high ml-2">high risk</span>}
            <span className="block text-sm text-stone-700">{room.hours.map((h) => formatSpan(shown, h.start, h.end)).join("; ")}</span>
          </li>
        ))}
      </ul>
      <p className="text-sm text-stone-700">
        Close these rooms to visitors for those hours (rope them off, tell the front desk), or add guards and rebuild. Posts and staffing are
        an aid: local codes and your security plan decide what an unguarded room needs.
      </p>
    </div>
  );
}

function Shortfalls({ review, shown }: { review: PublishReview; shown: SiteFormat }) {
  if (review.unfilledByRoom.length === 0) return <p>Every post-hour is staffed.</p>;
  return (
    <div className="overflow-x-auto"><table className="data-table">
      <caption className="text-left font-semibold">Unfilled post-hours by room</caption>
      <thead>
        <tr>
          <th scope="col">Room</th>
          <th scope="col">Risk</th>
          <th scope="col" className="text-right">Unfilled post-hours</th>
          <th scope="col" className="text-right">Hours empty</th>
        </tr>
      </thead>
      <tbody>
        {review.unfilledByRoom.map((r) => (
          <tr key={r.room}>
            <td>{r.room}</td>
            <td>{r.risk === "high" ? "high" : "standard"}</td>
            <td className="text-right">{formatHours(shown, r.postHours)}</td>
            <td className="text-right">{formatHours(shown, r.emptyHours ?? 0)}</td>
          </tr>
        ))}
      </tbody>
    </table></div>
  );
}

function OverContract({ review, shown }: { review: PublishReview; shown: SiteFormat }) {
  if (review.overContract.length === 0) return <p>Nobody is planned past their contract hours.</p>;
  return (
    <div className="overflow-x-auto"><table className="data-table" data-testid="review-over-contract">
      <caption className="text-left font-semibold">Guards planned past their contract</caption>
      <thead>
        <tr>
          <th scope="col">Guard</th>
          <th scope="col" className="text-right">Contract</th>
          <th scope="col" className="text-right">Planned</th>
          <th scope="col" className="text-right">Limit (contract + accepted extra)</th>
        </tr>
      </thead>
      <tbody>
        {review.overContract.map((g) => (
          <tr key={g.guardId} className={g.plannedHours > g.limitHours ? "text-alert-700" : undefined}>
            <td>{g.name}</td>
            <td className="text-right">{formatHours(shown, g.contractHours)}</td>
            <td className="text-right">{formatHours(shown, g.plannedHours)}</td>
            <td className="text-right">
              {formatHours(shown, g.limitHours)}
              {g.plannedHours > g.limitHours ? " — over the limit" : ""}
            </td>
          </tr>
        ))}
      </tbody>
    </table></div>
  );
}

function ConfirmForm({ review, busy, onPublish, onCancel }: { review: PublishReview; busy: boolean } & Pick<Props, "onPublish" | "onCancel">) {
  const word = review.confirmationWord ?? "";
  const schema = z.object({
    confirmation: z.string().refine((value) => value.trim().toLocaleLowerCase() === word.toLocaleLowerCase(), `Type ${word} to confirm.`),
    note: z.string().trim().min(1, "Say why the week is published this way; the note is kept with the version.").max(2000, "At most 2,000 characters."),
  });
  const form = useForm<z.infer<typeof schema>>({ resolver: zodResolver(schema), defaultValues: { confirmation: "", note: "" } });
  const errors = form.formState.errors;
  return (
    <form noValidate className="space-y-3" onSubmit={form.handleSubmit((values) => onPublish({ confirmation: values.confirmation, note: values.note }))}>
      <div>
        <label htmlFor="publish-confirmation" className="field-label">
          To publish anyway, type <span className="font-semibold">{word}</span>
        </label>
        <input
          id="publish-confirmation"
          className="field-input"
          autoComplete="off"
          aria-invalid={errors.confirmation ? true : undefined}
          aria-describedby="publish-confirmation-error"
          {...form.register("confirmation")}
        />
        <p id="publish-confirmation-error" role={errors.confirmation ? "alert" : undefined} className="text-sm text-alert-700">
          {errors.confirmation?.message ?? ""}
        </p>
      </div>
      <div>
        <label htmlFor="publish-note" className="field-label">Note (kept with the version)</label>
        <textarea id="publish-note" rows={3} className="field-input" aria-invalid={errors.note ? true : undefined} aria-describedby="publish-note-error" {...form.register("note")} />
        <p id="publish-note-error" role={errors.note ? "alert" : undefined} className="text-sm text-alert-700">
          {errors.note?.message ?? ""}
        </p>
      </div>
      <div className="flex flex-wrap gap-3">
        <button type="submit" className="button-danger" disabled={busy}>
          Publish anyway
        </button>
        <button type="button" className="button-quiet" onClick={onCancel}>
          Back to the draft
        </button>
      </div>
    </form>
  );
}
