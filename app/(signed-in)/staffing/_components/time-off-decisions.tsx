"use client";
// Guards' time-off requests for operations to approve or decline; approved time off is
// unavailability in the next roster build.
import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useSiteFormat } from "@/components/site-format";
import { apiFetch } from "@/lib/api/client";
import { formatDate } from "@/lib/format";

export interface TimeOffRow {
  id: number;
  guardName: string;
  startsOn: string;
  endsOn: string;
  note: string;
  status: "requested" | "approved" | "declined";
}

export function TimeOffDecisions({ requests }: { requests: TimeOffRow[] }) {
  const site = useSiteFormat();
  if (requests.length === 0) return <p className="mt-2">No time-off requests.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="data-table mt-2">
        <thead>
          <tr>
            <th scope="col">Guard</th>
            <th scope="col">From</th>
            <th scope="col">To</th>
            <th scope="col">Note</th>
            <th scope="col">Decision</th>
          </tr>
        </thead>
        <tbody>
          {requests.map((request) => (
            <tr key={request.id}>
              <td>{request.guardName}</td>
              <td className="whitespace-nowrap">{formatDate(site, request.startsOn)}</td>
              <td className="whitespace-nowrap">{formatDate(site, request.endsOn)}</td>
              <td>{request.note || "—"}</td>
              <td>{request.status === "requested" ? <Decide request={request} /> : <span className="tag">{request.status}</span>}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function Decide({ request }: { request: TimeOffRow }) {
  const router = useRouter();
  const from = formatDate(useSiteFormat(), request.startsOn);
  const decide = useMutation({
    mutationFn: (status: "approved" | "declined") => apiFetch(`/api/time-off/${request.id}`, { method: "PATCH", body: { status } }),
    onSuccess: () => router.refresh(),
  });
  return (
    <div className="flex flex-wrap gap-2">
      <button type="button" className="button-quiet" disabled={decide.isPending} onClick={() => decide.mutate("approved")} aria-label={`Approve time off for ${request.guardName} from ${from}`}>
        Approve
      </button>
      <button type="button" className="button-quiet" disabled={decide.isPending} onClick={() => decide.mutate("declined")} aria-label={`Decline time off for ${request.guardName} from ${from}`}>
        Decline
      </button>
      {decide.error && <p role="alert" className="text-sm text-alert-700">{decide.error.message}</p>}
    </div>
  );
}
