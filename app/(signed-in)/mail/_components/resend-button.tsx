"use client";
// One more attempt at a recorded message; a set-password mail goes with a new link.
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { apiFetch } from "@/lib/api/client";

export function ResendButton({ id, kind, label }: { id: number; kind: string; label: string }) {
  const router = useRouter();
  const resend = useMutation({
    mutationFn: () => apiFetch(`/api/mail/${id}/resend`, { method: "POST", body: {} }),
    onSuccess: () => router.refresh(),
  });
  return (
    <span className="inline-flex flex-wrap items-center gap-2">
      <button type="button" className="button-quiet" disabled={resend.isPending} onClick={() => resend.mutate()} aria-label={`Resend ${label}`}>
        {resend.isPending ? "Sending…" : kind === "invitation" || kind === "reset" ? "Resend with a new link" : "Resend"}
      </button>
      {resend.isError && (
        <span role="alert" className="text-sm font-semibold text-alert-700">
          {resend.error.message}
        </span>
      )}
      {resend.isSuccess && (
        <span role="status" className="text-sm text-ok-700">
          Sent again
        </span>
      )}
    </span>
  );
}
