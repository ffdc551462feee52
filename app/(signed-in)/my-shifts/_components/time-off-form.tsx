"use client";
// A guard asks for days off; operations approves or declines on the staffing page.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useForm } from "react-hook-form";
import { apiFetch } from "@/lib/api/client";
import { timeOffRequestSchema, type TimeOffRequestBody } from "@/lib/rosters/schemas";

export interface OwnTimeOff {
  id: number;
  startsOn: string;
  endsOn: string;
  note: string;
  status: "requested" | "approved" | "declined";
}

export function TimeOffForm({ requests }: { requests: OwnTimeOff[] }) {
  const router = useRouter();
  const form = useForm<TimeOffRequestBody>({ resolver: zodResolver(timeOffRequestSchema), defaultValues: { startsOn: "", endsOn: "", note: "" } });
  const ask = useMutation({
    mutationFn: (body: TimeOffRequestBody) => apiFetch("/api/time-off", { body }),
    onSuccess: () => {
      form.reset({ startsOn: "", endsOn: "", note: "" });
      router.refresh();
    },
  });
  const errors = form.formState.errors;
  return (
    <>
      <form className="grid gap-3 sm:grid-cols-2" onSubmit={form.handleSubmit((values) => ask.mutate(values))} noValidate>
        <div>
          <label htmlFor="off-from" className="field-label">First day off</label>
          <input id="off-from" type="date" className="field-input" aria-invalid={errors.startsOn ? true : undefined} aria-describedby="off-from-error" {...form.register("startsOn")} />
          <p id="off-from-error" className="text-sm text-alert-700">{errors.startsOn?.message}</p>
        </div>
        <div>
          <label htmlFor="off-to" className="field-label">Last day off</label>
          <input id="off-to" type="date" className="field-input" aria-invalid={errors.endsOn ? true : undefined} aria-describedby="off-to-error" {...form.register("endsOn")} />
          <p id="off-to-error" className="text-sm text-alert-700">{errors.endsOn?.message}</p>
        </div>
        <div className="sm:col-span-2">
          <label htmlFor="off-note" className="field-label">Note for operations</label>
          <textarea id="off-note" rows={2} className="field-input" {...form.register("note")} />
          <p className="text-sm text-alert-700">{errors.note?.message}</p>
        </div>
        <div className="sm:col-span-2">
          <button type="submit" className="button" disabled={ask.isPending}>Ask for time off</button>
          {ask.error && <p role="alert" className="mt-2 text-sm text-alert-700">{ask.error.message}</p>}
          {ask.isSuccess && <p role="status" className="mt-2 text-sm">Asked; operations will decide.</p>}
        </div>
      </form>
      {requests.length > 0 && (
        <table className="data-table">
          <caption className="sr-only">Your time-off requests</caption>
          <thead>
            <tr>
              <th scope="col">From</th>
              <th scope="col">To</th>
              <th scope="col">Note</th>
              <th scope="col">Status</th>
            </tr>
          </thead>
          <tbody>
            {requests.map((r) => (
              <tr key={r.id}>
                <td>{r.startsOn}</td>
                <td>{r.endsOn}</td>
                <td>{r.note || "—"}</td>
                <td><span className="tag">{r.status}</span></td>
              </tr>
            ))}
          </tbody>
        </table>
      )}
    </>
  );
}
