"use client";
// Every kept outline of the room: who saved it and when, corners n, obstacles h and floor area; a
// side-by-side drawing of a chosen version beside the current walls, and (for those who edit rooms)
// restore, which saves that outline again as a new version over the one on screen.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useState } from "react";
import { apiFetch, ApiRequestError } from "@/lib/api/client";
import type { RoomVersionDetail, RoomVersionSummary } from "@/db/queries/galleries";
import type { Ring } from "@/lib/geometry/types";
import { RoomOutline } from "@/components/room-outline";
import { useSiteFormat } from "@/components/site-format";
import { formatDateTime, formatNumber } from "@/lib/format";

interface Props {
  roomId: number;
  roomName: string;
  currentVersion: number;
  current: { outline: Ring; obstacles: Ring[] };
  canEdit: boolean;
  /** Unsaved edits on screen: restoring would throw them away, so it waits. */
  dirty: boolean;
  onRestored: () => void;
}

export function RoomVersions({ roomId, roomName, currentVersion, current, canEdit, dirty, onRestored }: Props) {
  const queryClient = useQueryClient();
  const site = useSiteFormat();
  const list = useQuery({
    queryKey: ["room-versions", roomId, currentVersion],
    queryFn: () => apiFetch<{ current: number; versions: RoomVersionSummary[] }>(`/api/rooms/${roomId}/versions`),
    staleTime: 0,
  });
  const [compared, setCompared] = useState<number | null>(null);
  const detail = useQuery({
    queryKey: ["room-version", roomId, compared],
    queryFn: () => apiFetch<{ version: RoomVersionDetail }>(`/api/rooms/${roomId}/versions/${compared}`).then((r) => r.version),
    enabled: compared !== null,
  });
  const [message, setMessage] = useState<{ kind: "ok" | "error"; text: string } | null>(null);

  async function restore(version: number) {
    setMessage(null);
    try {
      await apiFetch(`/api/rooms/${roomId}/versions/${version}/restore`, { body: { currentVersion } });
      setMessage({ kind: "ok", text: `Version ${version} restored as a new version; the approved plan, if any, is now out of date.` });
      setCompared(null);
      await queryClient.invalidateQueries({ queryKey: ["room-versions", roomId] });
      onRestored();
    } catch (error) {
      setMessage({ kind: "error", text: error instanceof ApiRequestError ? error.message : "The version could not be restored; try again." });
    }
  }

  return (
    <details className="card" data-testid="room-versions">
      <summary className="cursor-pointer font-semibold">Versions of the walls ({list.data?.versions.length ?? "…"})</summary>
      {list.error && <p role="alert" className="mt-2 text-sm text-alert-700">{list.error.message}</p>}
      {list.data && (
        <div className="mt-3 overflow-x-auto">
          <table className="data-table">
            <caption className="sr-only">Kept outlines of {roomName}, newest first</caption>
            <thead>
              <tr>
                <th scope="col">Version</th>
                <th scope="col">Saved</th>
                <th scope="col">By</th>
                <th scope="col" className="text-right">Corners n</th>
                <th scope="col" className="text-right">Obstacles h</th>
                <th scope="col" className="text-right">Area m²</th>
                <th scope="col"><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>
              {list.data.versions.map((v) => (
                <tr key={v.version}>
                  <td>
                    {v.version}
                    {v.version === currentVersion ? " (current)" : ""}
                  </td>
                  <td className="whitespace-nowrap">{formatDateTime(site, v.saved_at)}</td>
                  <td>{v.saved_by?.name ?? "the seed"}</td>
                  <td className="text-right">{v.corners}</td>
                  <td className="text-right">{v.holes}</td>
                  <td className="text-right">{formatNumber(site, v.area)}</td>
                  <td className="whitespace-nowrap">
                    {v.version !== currentVersion && (
                      <div className="flex gap-2">
                        <button type="button" className="button-quiet" aria-pressed={compared === v.version} onClick={() => setCompared(compared === v.version ? null : v.version)}>
                          Compare
                        </button>
                        {canEdit && (
                          <button type="button" className="button-quiet" disabled={dirty} title={dirty ? "Save or discard your changes first" : undefined} onClick={() => void restore(v.version)}>
                            Restore
                          </button>
                        )}
                      </div>
                    )}
                  </td>
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
      {compared !== null && (
        <div className="mt-3 flex flex-wrap gap-6" data-testid="version-compare">
          <figure>
            {detail.data ? <RoomOutline outline={detail.data.outline} obstacles={detail.data.obstacles} label={`${roomName}, version ${compared}`} size={200} /> : <p role="status">Loading version {compared}…</p>}
            <figcaption className="mt-1 text-sm">Version {compared}</figcaption>
          </figure>
          <figure>
            <RoomOutline outline={current.outline} obstacles={current.obstacles} label={`${roomName}, version ${currentVersion} (current)`} size={200} />
            <figcaption className="mt-1 text-sm">Version {currentVersion} (current)</figcaption>
          </figure>
        </div>
      )}
      {message && (
        <p role={message.kind === "error" ? "alert" : "status"} className={message.kind === "error" ? "mt-2 text-sm text-alert-700" : "mt-2 text-sm text-ok-700"}>
          {message.text}
        </p>
      )}
    </details>
  );
}
