"use client";
// Upload several rooms to a floor from a GeoJSON FeatureCollection (one Feature per room, named by
// its `name` property): the file is checked and previewed first (which rooms are new, which get
// new walls), and saved only when the curator says so; a file with one bad room saves nothing.
import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import { UPLOAD_BYTE_LIMIT } from "@/lib/galleries/room-upload";

interface PreviewRow {
  name: string;
  action: "create" | "update";
  version?: number;
  corners: number;
  obstacles: number;
}

export function RoomsUpload({ floorId, floorName }: { floorId: number; floorName: string }) {
  const router = useRouter();
  const inputId = useId();
  const [geojson, setGeojson] = useState<unknown>(null);
  const [preview, setPreview] = useState<PreviewRow[] | null>(null);
  const [problems, setProblems] = useState<{ room: string; message: string }[]>([]);
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [busy, setBusy] = useState(false);

  function fail(error: unknown) {
    if (error instanceof ApiRequestError) {
      setMessage({ kind: "error", text: error.message });
      const listed = (error.details as { problems?: { room: string; message: string }[] } | undefined)?.problems;
      setProblems(Array.isArray(listed) ? listed : []);
    } else setMessage({ kind: "error", text: "The file could not be checked; try again." });
  }

  async function choose(file: File | undefined) {
    setPreview(null);
    setProblems([]);
    setMessage(null);
    setGeojson(null);
    if (!file) return;
    if (file.size > UPLOAD_BYTE_LIMIT) {
      setMessage({ kind: "error", text: `${file.name} is ${(file.size / 1024 / 1024).toFixed(1)} MB; at most 5 MB in one upload. Split it into several files.` });
      return;
    }
    let value: unknown;
    try {
      value = JSON.parse(await file.text());
    } catch (error) {
      setMessage({ kind: "error", text: `${file.name} is not JSON (${(error as Error).message}); export the rooms as a GeoJSON FeatureCollection.` });
      return;
    }
    setBusy(true);
    try {
      const answer = await apiFetch<{ preview: PreviewRow[] }>(`/api/floors/${floorId}/rooms-import`, { method: "POST", body: { geojson: value, dryRun: true } });
      setGeojson(value);
      setPreview(answer.preview);
    } catch (error) {
      fail(error);
    } finally {
      setBusy(false);
    }
  }

  async function save() {
    if (!preview) return;
    setBusy(true);
    try {
      const versions = Object.fromEntries(preview.filter((r) => r.version !== undefined).map((r) => [r.name, r.version!]));
      const answer = await apiFetch<{ created: number; updated: number }>(`/api/floors/${floorId}/rooms-import`, { method: "POST", body: { geojson, dryRun: false, versions } });
      setMessage({ kind: "ok", text: `Saved: ${answer.created} new room${answer.created === 1 ? "" : "s"}, ${answer.updated} with new walls on ${floorName}.` });
      setPreview(null);
      setGeojson(null);
      router.refresh();
    } catch (error) {
      fail(error);
    } finally {
      setBusy(false);
    }
  }

  return (
    <div className="space-y-2 rounded-md border border-stone-300 p-3">
      <label htmlFor={inputId} className="block text-sm font-semibold">
        Upload rooms to {floorName} <span className="font-normal text-stone-600">(GeoJSON FeatureCollection, one Feature per room with a name; at most 5 MB)</span>
      </label>
      <input id={inputId} type="file" accept=".geojson,.json,application/geo+json,application/json" className="block text-sm file:mr-3 file:min-h-[2.75rem] file:cursor-pointer file:rounded-md file:border file:border-ink-700 file:bg-white file:px-3 file:font-semibold file:text-ink-800 hover:file:bg-ink-50" disabled={busy} onChange={(e) => void choose(e.target.files?.[0])} />
      {preview && (
        <div className="space-y-2">
          <div className="overflow-x-auto">
            <table className="data-table" data-testid={`upload-preview-${floorId}`}>
              <caption className="sr-only">What the upload will change on {floorName}</caption>
              <thead>
                <tr>
                  <th scope="col">Room</th>
                  <th scope="col">Change</th>
                  <th scope="col">Corners</th>
                  <th scope="col">Obstacles</th>
                </tr>
              </thead>
              <tbody>
                {preview.map((row) => (
                  <tr key={row.name}>
                    <td>{row.name}</td>
                    <td>{row.action === "create" ? "new room" : `new walls (now version ${row.version})`}</td>
                    <td>{row.corners}</td>
                    <td>{row.obstacles}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <div className="flex flex-wrap gap-2">
            <button type="button" className="button" disabled={busy} onClick={() => void save()}>
              Save {preview.length} room{preview.length === 1 ? "" : "s"}
            </button>
            <button type="button" className="button-quiet" disabled={busy} onClick={() => { setPreview(null); setGeojson(null); }}>
              Cancel
            </button>
          </div>
        </div>
      )}
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "text-sm font-semibold text-alert-700" : "text-sm text-ok-700"}>
          {message.text}
        </p>
      )}
      {problems.length > 1 && (
        <ul className="list-disc pl-5 text-sm text-alert-700">
          {problems.map((p, i) => (
            <li key={i}>
              {p.room}: {p.message}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
