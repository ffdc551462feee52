"use client";
// The guard's personal feed address with a copy button, and a reset that issues a new secret.
import { useMutation } from "@tanstack/react-query";
import { useEffect, useState } from "react";
import { apiFetch } from "@/lib/api/client";

export function CalendarFeed({ initialPath }: { initialPath: string }) {
  const [path, setPath] = useState(initialPath);
  const [origin, setOrigin] = useState("");
  const [copied, setCopied] = useState(false);
  useEffect(() => setOrigin(window.location.origin), []);
  const address = origin + path;
  const reset = useMutation({
    mutationFn: () => apiFetch<{ path: string }>("/api/calendar/reset", { method: "POST", body: {} }),
    onSuccess: ({ path: next }) => {
      setPath(next);
      setCopied(false);
    },
  });
  return (
    <div className="space-y-2">
      <label htmlFor="feed-address" className="field-label">Feed address</label>
      <input id="feed-address" className="field-input font-mono text-sm" readOnly value={address} onFocus={(event) => event.currentTarget.select()} />
      <div className="flex flex-wrap gap-2">
        <button
          type="button"
          className="button-quiet"
          disabled={!origin}
          onClick={async () => {
            try {
              await navigator.clipboard.writeText(address);
              setCopied(true);
            } catch {
              // Clipboard refused (e.g. not a secure context): the field is selectable instead.
              setCopied(false);
            }
          }}
        >
          Copy link
        </button>
        <button type="button" className="button-quiet" disabled={reset.isPending} onClick={() => reset.mutate()}>
          Reset link
        </button>
      </div>
      <p role="status" className="text-sm text-stone-700">
        {copied ? "Copied." : reset.isSuccess ? "New address issued; the old one no longer works." : ""}
      </p>
      {reset.error && <p role="alert" className="text-sm text-alert-700">{reset.error.message}</p>}
    </div>
  );
}
