"use client";
// A guard asks for days off; operations approves or declines on the staffing page.
import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { Controller, useForm } from "react-hook-form";
import { DateField, dateFieldProblem } from "@/components/date-field";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch } from "@/lib/api/client";
import { formatDate } from "@/lib/format";
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
  const format = useSiteFormat();
  const form = useForm<TimeOffRequestBody>({ resolver: zodResolver(timeOffRequestSchema), defaultValues: { startsOn: "", endsOn: "", note: "" } });
  const ask = useMutation({
    mutationFn: (body: TimeOffRequestBody) => apiFetch("/api/time-off", { body }),
    onSuccess: () => {
      form.reset({ startsOn: "", endsOn: "", note: "" });
      router.refresh();
    },
  });
  const errors = form.formState.errors;
  const [startsOn, endsOn] = form.watch(["startsOn", "endsOn"]);
  return (
    <>
      <form className="grid gap-3 sm:grid-cols-2" onSubmit={form.handleSubmit((values) => ask.mutate(values))} noValidate>
        <div>
          <Controller
            control={form.control}
            name="startsOn"
            render={({ field }) => (
              <DateField id="off-from" label="First day off" name={field.name} value={field.value} onChange={field.onChange} onBlur={field.onBlur} inputRef={field.ref} invalid={Boolean(errors.startsOn)} describedBy="off-from-error" />
            )}
          />
          <p id="off-from-error" className="text-sm text-alert-700">{dateFieldProblem(format.locale, startsOn, errors.startsOn?.message)}</p>
        </div>
        <div>
          <Controller
            control={form.control}
            name="endsOn"
            render={({ field }) => (
              <DateField id="off-to" label="Last day off" name={field.name} value={field.value} onChange={field.onChange} onBlur={field.onBlur} inputRef={field.ref} invalid={Boolean(errors.endsOn)} describedBy="off-to-error" />
            )}
          />
          <p id="off-to-error" className="text-sm text-alert-700">{dateFieldProblem(format.locale, endsOn, errors.endsOn?.message)}</p>
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
        <div className="overflow-x-auto">
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
                <td className="whitespace-nowrap">{formatDate(format, r.startsOn)}</td>
                <td className="whitespace-nowrap">{formatDate(format, r.endsOn)}</td>
                <td>{r.note || "—"}</td>
                <td><span className="tag">{r.status}</span></td>
              </tr>
            ))}
          </tbody>
        </table>
        </div>
      )}
    </>
  );
}
