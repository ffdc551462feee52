"use client";
// What a page shows when it fails: "database unavailable" when /api/health says PostgreSQL is down,
// otherwise a plain apology. Never the error's message or stack (they stay in the server log).
import { useRouter } from "next/navigation";
import { startTransition, useEffect, useState } from "react";

type Cause = "checking" | "database" | "other";

export function ErrorPanel({ reset }: { reset: () => void }) {
  const [cause, setCause] = useState<Cause>("checking");
  const router = useRouter();
  // The failure came from the server, so ask it again before re-rendering the boundary.
  const retry = () =>
    startTransition(() => {
      router.refresh();
      reset();
    });

  useEffect(() => {
    let cancelled = false;
    fetch("/api/health", { cache: "no-store" })
      .then(async (response) => {
        const body = (await response.json().catch(() => null)) as { database?: string } | null;
        if (!cancelled) setCause(body?.database === "down" || response.status === 503 ? "database" : "other");
      })
      .catch(() => !cancelled && setCause("other"));
    return () => {
      cancelled = true;
    };
  }, []);

  return (
    <div className="mx-auto my-section max-w-lg">
      <div role="alert" className="card border-alert-200">
        <p className="text-sm font-semibold uppercase tracking-widest text-alert-700">Error</p>
        {cause === "checking" ? (
          <h1 className="mb-2">Checking what went wrong…</h1>
        ) : cause === "database" ? (
          <>
            <h1 className="mb-2">Database unavailable</h1>
            <p>Sightward cannot reach its database right now. Try again in a minute; tell your administrator if it lasts.</p>
          </>
        ) : (
          <>
            <h1 className="mb-2">Something went wrong</h1>
            <p>This page could not be shown. The problem has been logged on the server; try again.</p>
          </>
        )}
        <button type="button" className="button mt-4" onClick={retry}>Try again</button>
      </div>
    </div>
  );
}
