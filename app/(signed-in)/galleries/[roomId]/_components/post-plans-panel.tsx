"use client";
// Operations' part of the room page: the exhibition's conditions (sight range, double cover, pinned
// posts, forbidden zones), "compute and save" (the real planner on the server) and approval.
import { useState } from "react";
import { ApiRequestError, apiFetch } from "@/lib/api/client";
import type { Point, Ring } from "@/lib/geometry/types";
import type { RoomExhibition } from "@/db/queries/rooms";
import type { PostPlanView } from "@/db/queries/post-plans";
import type { PostPlanRequest } from "@/lib/api/plan-input";

interface Props {
  roomId: number;
  roomVersion: number;
  dirty: boolean;
  exhibition: RoomExhibition;
  plans: PostPlanView[];
  sightRange: number | null;
  doubleCover: boolean;
  pinned: Point[];
  forbidden: Ring[];
  shownPlanId: number | null;
  onShow: (plan: PostPlanView) => void;
  onSightRange: (value: number | null) => void;
  onDoubleCover: (value: boolean) => void;
  onClearConditions: () => void;
  onChanged: () => void;
}

export function PostPlansPanel(props: Props) {
  const { exhibition, plans } = props;
  const [busy, setBusy] = useState<string | null>(null);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);

  async function compute() {
    setBusy("compute");
    setMessage(null);
    try {
      const body: PostPlanRequest = {
        exhibitionId: exhibition.id,
        roomVersion: props.roomVersion,
        sightRange: props.sightRange,
        doubleCover: props.doubleCover,
        pinned: props.pinned,
        forbidden: props.forbidden,
      };
      const { plan, stoppedBecause } = await apiFetch<{ plan: PostPlanView; stoppedBecause?: string }>(`/api/rooms/${props.roomId}/post-plans`, { body });
      const stopped = stoppedBecause === "deadline" || stoppedBecause === "memory-limit" ? " The planner stopped at the server's limit, so this is the guaranteed plan." : "";
      setMessage({ kind: "ok", text: `Plan ${plan.id} proposed: ${plan.posts.length} posts, ${plan.covered >= 1 ? "the whole floor seen" : `${(plan.covered * 100).toFixed(1)}% seen`}.${stopped}` });
      // Show what would be approved: the stored plan's posts and sight on the drawing.
      props.onShow(plan);
      props.onChanged();
    } catch (error) {
      setMessage({ kind: "error", text: error instanceof ApiRequestError ? error.message : "The plan could not be computed; try again." });
    } finally {
      setBusy(null);
    }
  }

  async function approve(plan: PostPlanView) {
    setBusy(`approve-${plan.id}`);
    setMessage(null);
    try {
      await apiFetch(`/api/post-plans/${plan.id}/approve`, { method: "POST", body: {} });
      setMessage({ kind: "ok", text: `Plan ${plan.id} approved: rosters for ${exhibition.name} now staff its ${plan.posts.length} posts.` });
      props.onChanged();
    } catch (error) {
      setMessage({ kind: "error", text: error instanceof ApiRequestError ? error.message : "The plan could not be approved; try again." });
    } finally {
      setBusy(null);
    }
  }

  const latestApproved = plans.find((p) => p.status === "approved");
  return (
    <section className="card space-y-3" aria-labelledby="post-plans-heading" data-testid="post-plans">
      <h2 id="post-plans-heading" className="text-lg">
        Post plan for {exhibition.name}
      </h2>
      <p className="text-sm text-stone-700">
        Risk <span className={exhibition.risk_level === "high" ? "tag-high" : "tag"}>{exhibition.risk_level}</span>; the exhibition sets sight range{" "}
        {exhibition.sight_range == null ? "unlimited" : `${exhibition.sight_range} m`} and double cover {exhibition.double_cover ? "on" : "off"}.
      </p>
      <div className="grid grid-cols-2 gap-2">
        <label className="text-sm">
          <span className="field-label">Sight range (m)</span>
          <input
            className="field-input"
            type="number"
            min={0.5}
            step={0.5}
            placeholder="unlimited"
            value={props.sightRange ?? ""}
            onChange={(e) => props.onSightRange(e.target.value === "" ? null : Math.max(0.5, Number(e.target.value)))}
          />
        </label>
        <label className="mt-6 inline-flex items-center gap-2 text-sm">
          <input type="checkbox" checked={props.doubleCover} onChange={(e) => props.onDoubleCover(e.target.checked)} />
          Double cover
        </label>
      </div>
      <p className="text-sm">
        {props.pinned.length} pinned post{props.pinned.length === 1 ? "" : "s"}, {props.forbidden.length} forbidden zone{props.forbidden.length === 1 ? "" : "s"}.{" "}
        {(props.pinned.length > 0 || props.forbidden.length > 0) && (
          <button type="button" className="underline" onClick={props.onClearConditions}>
            Clear
          </button>
        )}
      </p>
      <p className="text-xs text-stone-700">Forbid zones at exits, evacuation routes and fire-safety equipment: posts must never block them.</p>
      <button type="button" className="button w-full" disabled={busy !== null || props.dirty} onClick={compute}>
        {busy === "compute" ? "Computing on the server…" : "Compute and save plan"}
      </button>
      {props.dirty && <p className="text-xs text-stone-700">Save or discard the wall changes first: plans are computed for saved walls.</p>}
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "rounded-md bg-alert-50 p-2 text-sm text-alert-700" : "rounded-md bg-ok-50 p-2 text-sm text-ok-700"}>
          {message.text}
        </p>
      )}
      {plans.length > 0 && (
        <ol className="space-y-2 text-sm" aria-label="Plans for this exhibition, newest first">
          {plans.slice(0, 6).map((plan) => {
            const stale = plan.room_version !== props.roomVersion;
            return (
              <li key={plan.id} className="rounded-md border border-stone-200 p-2" data-testid="post-plan">
                <div className="flex items-center justify-between gap-2">
                  <span className="font-semibold">
                    Plan {plan.id}: {plan.posts.length} posts
                  </span>
                  <span className={plan.status === "approved" ? "rounded-full bg-ok-50 px-2 py-0.5 text-xs font-semibold text-ok-700" : "tag"}>
                    {plan.status}
                    {plan === latestApproved ? " · counts" : ""}
                  </span>
                </div>
                <p className="text-xs text-stone-700">
                  {plan.method}, {plan.covered >= 1 ? "whole floor seen" : `${(plan.covered * 100).toFixed(1)}% seen`}
                  {plan.lower_bound != null ? `, lower bound ${plan.lower_bound}` : ""}
                  {plan.proven ? ", proven minimal" : ""}; room version {plan.room_version}
                  {stale ? " (walls changed since)" : ""}
                  {plan.approved_by_name ? `; approved by ${plan.approved_by_name}` : ""}
                </p>
                <button
                  type="button"
                  className="mt-1 text-xs underline"
                  aria-pressed={props.shownPlanId === plan.id}
                  disabled={stale}
                  onClick={() => props.onShow(plan)}
                >
                  {props.shownPlanId === plan.id ? "Shown on the drawing" : `Show plan ${plan.id} on the drawing`}
                </button>
                {plan.status === "proposed" && (
                  <button type="button" className="button-quiet mt-1 w-full" disabled={busy !== null} onClick={() => approve(plan)}>
                    {busy === `approve-${plan.id}` ? "Approving…" : `Approve plan ${plan.id}`}
                  </button>
                )}
              </li>
            );
          })}
        </ol>
      )}
    </section>
  );
}
