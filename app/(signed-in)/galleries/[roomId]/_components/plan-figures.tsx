"use client";
// The numbers beside the drawing: n, h, the guaranteed bound and count, the fewest count with its
// lower bound, and whether the fewest plan is proven minimal.
import { SIGHT_DRAWING_LIMIT, type PlanAnswer } from "@/components/plan/plan-messages";
import { useSiteFormat } from "@/components/site-format";
import { formatNumber } from "@/lib/format";
import type { FewestPreview } from "@/lib/api/plan-input";

interface Props {
  answer: PlanAnswer | null;
  /** Whose posts the worker certified: "the fewest plan", "plan 12", ... */
  sightOf: string;
  fewest: FewestPreview | null;
  fewestState: "idle" | "computing" | "unavailable" | "failed" | "stopped";
  fewestMessage: string | null;
  colourName: string | null;
}

function percent(share: number): string {
  return share >= 1 ? "100%" : `${(Math.floor(share * 1000) / 10).toFixed(1)}%`;
}

export function PlanFigures({ answer, sightOf, fewest, fewestState, fewestMessage, colourName }: Props) {
  const site = useSiteFormat();
  const ok = answer?.ok ? answer : null;
  const proven = fewest?.proven === true;
  // The worker certifies the fewest plan's posts once known, else the guaranteed posts.
  const covered = ok ? ok.sight.covered : null;
  return (
    <section className="card space-y-3" aria-labelledby="figures-heading" data-testid="plan-figures">
      <div className="flex items-center justify-between gap-2">
        <h2 id="figures-heading" className="text-lg">
          Posts
        </h2>
        {proven && (
          <span className="rounded-full bg-ok-50 px-2 py-0.5 text-xs font-semibold text-ok-700" data-testid="proven-minimal">
            proven minimal
          </span>
        )}
      </div>
      <dl className="grid grid-cols-[1fr_auto] gap-x-3 gap-y-1 text-sm">
        <dt>Vertices (n)</dt>
        <dd className="text-right font-semibold">{ok?.vertices ?? "–"}</dd>
        <dt>Obstacles (h)</dt>
        <dd className="text-right font-semibold">{ok?.obstacles ?? "–"}</dd>
        <dt>Floor area</dt>
        <dd className="text-right">{ok ? `${formatNumber(site, ok.area)} m²` : "–"}</dd>
        <dt title="floor((n + 2h) / 3): no room of this size needs more">Bound ⌊(n+2h)/3⌋</dt>
        <dd className="text-right font-semibold">{ok?.bound ?? "–"}</dd>
        <dt>Guaranteed plan</dt>
        <dd className="text-right font-semibold" data-testid="guaranteed-count">
          {ok ? ok.guaranteed.posts.length : "–"}
        </dd>
        <dt>Fewest plan</dt>
        <dd className="text-right font-semibold" data-testid="fewest-count">
          {fewest ? fewest.posts.length : fewestState === "computing" ? "computing…" : "–"}
        </dd>
        <dt title="No plan under these conditions has fewer posts">Lower bound</dt>
        <dd className="text-right">{fewest?.lowerBound ?? "–"}</dd>
        <dt>{ok?.guaranteed.doubleCover ? `Floor seen by two posts (${sightOf})` : `Floor seen by ${sightOf}`}</dt>
        <dd data-testid="covered" className={`text-right ${covered !== null && covered < 1 ? "font-semibold text-alert-700" : ""}`}>
          {covered === null ? "–" : percent(covered)}
        </dd>
      </dl>
      {ok && colourName && !ok.guaranteed.doubleCover && (
        <p className="text-xs text-stone-700">
          Guaranteed posts stand on the {colourName} corners of the triangulation: every triangle has one corner of each colour, so the smallest colour class sees the whole floor (Fisk, 1978).
        </p>
      )}
      {ok && ok.guaranteed.doubleCover && (
        <p className="text-xs text-stone-700" data-testid="double-cover-note">
          Every point must be seen by two posts, so the guaranteed plan takes the corners of the two smallest colour classes: every triangle has one corner of each colour and each class sees the whole floor, so together they see it twice (Fisk, 1978).
        </p>
      )}
      {ok?.sight.regionsOmitted && (
        <p className="text-xs text-stone-700" data-testid="sight-omitted">
          Sight shading is drawn for plans of up to {SIGHT_DRAWING_LIMIT} posts; this plan has {ok.sight.posts.length || ok.guaranteed.posts.length}.
        </p>
      )}
      {fewestState === "computing" && <p className="text-sm text-stone-700" aria-live="polite">Fewest plan: computing…</p>}
      {fewestState === "unavailable" && <p className="text-sm text-stone-700">The fewest plan preview is not available on this server yet.</p>}
      {fewestState === "stopped" && (
        <p className="text-sm text-stone-700">
          The planner reached {fewestMessage} before it found a plan with fewer posts; the guaranteed plan stands (its coverage is shown above).
        </p>
      )}
      {fewestState === "failed" && <p className="text-sm text-alert-700">The fewest plan could not be computed: {fewestMessage}</p>}
    </section>
  );
}
