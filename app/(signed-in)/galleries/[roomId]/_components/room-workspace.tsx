"use client";
// The room page's working area: the drawing with the live guaranteed plan (Web Worker) and the
// fewest plan (server preview), the figures and staffing cost, the curator's editing tools and
// save, and for operations the post-plan conditions, proposals and approval.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useEffect, useMemo, useRef, useState } from "react";
import { ApiRequestError, apiFetch } from "@/lib/api/client";
import type { RoomProblem } from "@/lib/geometry/room";
import type { Point, Ring, Room } from "@/lib/geometry/types";
import { importRoomFile } from "@/lib/geometry/room-import";
import type { RoomDetail, RoomExhibition } from "@/db/queries/rooms";
import type { PostPlanView } from "@/db/queries/post-plans";
import { RoomDrawing, COLOUR_NAMES, type DrawingMode } from "@/components/plan/room-drawing";
import { usePlanWorker } from "@/components/plan/use-plan-worker";
import { addPartition, addRectangleObstacle, deleteVertex, insertVertex, moveVertex, rectangle, removeObstacle, ringOf, type VertexRef } from "@/components/plan/room-edits";
import type { FewestPreview, RoomWalls } from "@/lib/api/plan-input";
import { PlanFigures } from "./plan-figures";
import { StaffingPanel } from "./staffing-panel";
import { CostOfChange } from "./cost-of-change";
import { CornerPanel } from "./corner-panel";
import { RoomOutline } from "@/components/room-outline";
import { TypedShape } from "./typed-shape";
import { useEditHistory } from "@/components/plan/use-edit-history";
import { PostPlansPanel } from "./post-plans-panel";
import { RoomVersions } from "./room-versions";

export interface RoomData {
  room: RoomDetail;
  plans: PostPlanView[];
}

interface Props {
  initial: RoomData;
  canEdit: boolean;
  canApprove: boolean;
  /** The exhibition the page plans for (running today, else the next), if the room is in one. */
  exhibitionId: number | null;
  /** Shown beside the plan, above the figures (the page passes the plan cautions). */
  cautions?: React.ReactNode;
}

/** How long the room must stay still before the fewest plan is asked for. */
const PREVIEW_DELAY_MS = 700;
/** Solver seconds the preview may spend while the curator waits. */
const PREVIEW_SECONDS = 2;

export function RoomWorkspace({ initial, canEdit, canApprove, exhibitionId, cautions }: Props) {
  const queryClient = useQueryClient();
  const router = useRouter();
  const queryKey = ["room", initial.room.id];
  const { data } = useQuery({
    queryKey,
    queryFn: () => apiFetch<RoomData>(`/api/rooms/${initial.room.id}`),
    initialData: initial,
  });
  const detail = data.room;

  // The walls being edited; null = showing the saved room.
  const [draft, setDraft] = useState<Room | null>(null);
  const [baseVersion, setBaseVersion] = useState(detail.version);
  const room: Room = draft ?? { outline: detail.outline, obstacles: detail.obstacles };
  const history = useEditHistory();
  const roomSpan = Math.max(1, ...[room.outline.map((p) => p[0]), room.outline.map((p) => p[1])].map((v) => Math.max(...v) - Math.min(...v)));
  // The room as the last committed edit left it: a drag's moves are not steps of their own.
  const committed = useRef<Room>(room);
  if (draft === null) committed.current = room;
  const [mode, setMode] = useState<DrawingMode>("view");
  const [selectedVertex, setSelectedVertex] = useState<VertexRef | null>(null);
  const [selectedObstacle, setSelectedObstacle] = useState<number | null>(null);
  const [notice, setNotice] = useState<{ kind: "ok" | "error"; text: string } | null>(null);
  const [serverProblems, setServerProblems] = useState<RoomProblem[]>([]);
  const [importProblems, setImportProblems] = useState<string[]>([]);
  const [saving, setSaving] = useState(false);
  // Someone saved the room while these walls were being edited: their walls, to compare with ours.
  const [conflict, setConflict] = useState<{ version: number; outline: Ring; obstacles: Ring[] } | null>(null);
  const [show, setShow] = useState({ triangles: true, guaranteed: true, sight: true });
  const [snapStep, setSnapStep] = useState(0.1);
  const [zoom, setZoom] = useState(1);
  const [pan, setPan] = useState<Point>([0, 0]);
  const [partitionThickness, setPartitionThickness] = useState("0.2");

  // Post-plan conditions (operations).
  const exhibition: RoomExhibition | null = detail.exhibitions.find((e) => e.id === exhibitionId) ?? null;
  const [sightRange, setSightRange] = useState<number | null>(exhibition?.sight_range ?? null);
  const [doubleCover, setDoubleCover] = useState<boolean>(exhibition?.double_cover ?? false);
  const [pinned, setPinned] = useState<Point[]>([]);
  const [forbidden, setForbidden] = useState<Ring[]>([]);

  // The fewest plan from the server, remembered with the room and conditions it was computed for.
  const previewKey = JSON.stringify({ room, sightRange, doubleCover, pinned, forbidden });
  const [fewest, setFewest] = useState<{ key: string; plan: FewestPreview } | null>(null);
  const [fewestState, setFewestState] = useState<"idle" | "computing" | "unavailable" | "failed" | "stopped">("idle");
  const [fewestMessage, setFewestMessage] = useState<string | null>(null);
  const fewestCurrent = fewest && fewest.key === previewKey ? fewest.plan : null;
  // The plan rosters staff now: the latest approved one for the page's exhibition.
  const approvedPlan = exhibition
    ? data.plans
        .filter((p) => p.exhibition_id === exhibition.id && p.status === "approved")
        .sort((a, b) => (b.approved_at ?? "").localeCompare(a.approved_at ?? "") || b.id - a.id)[0] ?? null
    : null;
  // A stored plan chosen from the list is drawn instead of the live one until the walls change.
  const [shownPlan, setShownPlan] = useState<PostPlanView | null>(null);

  const { answer, working, failure } = usePlanWorker({
    room,
    sightRange: shownPlan ? shownPlan.options.sightRange : sightRange,
    doubleCover: shownPlan ? shownPlan.options.doubleCover : doubleCover,
    shownPosts: shownPlan ? shownPlan.posts : fewestCurrent ? fewestCurrent.posts : null,
  });
  const sightOf = shownPlan ? `plan ${shownPlan.id}` : fewestCurrent ? "the fewest plan" : "the guaranteed plan";
  const liveProblems = answer && !answer.ok ? answer.problems : [];
  const valid = answer?.ok === true;

  useEffect(() => {
    if (!answer || !answer.ok) return;
    const controller = new AbortController();
    const timer = setTimeout(async () => {
      setFewestState("computing");
      try {
        // The preview takes a GeoJSON Polygon (ring 0 the outline, then obstacles) and answers the
        // `posts` command's room JSON (scripts/README.md) with its `fewest` field.
        const response = await apiFetch<{ room?: { fewest?: FewestPreview; stoppedBecause?: string } }>("/api/post-plans/preview", {
          body: {
            room: { type: "Polygon", coordinates: [room.outline, ...room.obstacles] },
            ...(sightRange ? { sightRange } : {}),
            pinned,
            forbidden,
            doubleCover,
            timeLimit: PREVIEW_SECONDS,
          },
          signal: controller.signal,
        });
        const plan = response.room?.fewest;
        const stopped = response.room?.stoppedBecause;
        if (!plan && (stopped === "deadline" || stopped === "memory-limit")) {
          // The server's planner ended the job before the fewest plan: the guaranteed plan stands.
          setFewest(null);
          setFewestState("stopped");
          setFewestMessage(stopped === "deadline" ? "the server's time limit" : "the server's memory limit");
          return;
        }
        if (!plan || !Array.isArray(plan.posts)) throw new Error("the preview answered without a fewest plan");
        setFewest({ key: previewKey, plan });
        setFewestState("idle");
        setFewestMessage(null);
      } catch (error) {
        if (controller.signal.aborted) return;
        if (error instanceof ApiRequestError && (error.status === 404 || error.status === 405)) setFewestState("unavailable");
        else {
          setFewestState("failed");
          setFewestMessage(error instanceof Error ? error.message : String(error));
        }
      }
    }, PREVIEW_DELAY_MS);
    return () => {
      clearTimeout(timer);
      controller.abort();
    };
    // The preview depends on the room and conditions only (previewKey says both).
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [previewKey, valid]);

  function change(next: Room, commit = true) {
    if (commit) {
      history.record(committed.current);
      committed.current = next;
    }
    setDraft(next);
    setShownPlan(null);
    setNotice(null);
    setServerProblems([]);
    if (commit) setImportProblems([]);
  }

  function deleteSelected() {
    if (selectedVertex) {
      const next = deleteVertex(room, selectedVertex);
      if (typeof next === "string") setNotice({ kind: "error", text: `Cannot delete that vertex: ${next}.` });
      else {
        change(next);
        setSelectedVertex(null);
      }
    } else if (selectedObstacle) {
      change(removeObstacle(room, selectedObstacle));
      setSelectedObstacle(null);
    }
  }

  function travel(direction: "undo" | "redo") {
    const to = direction === "undo" ? history.undo(committed.current) : history.redo(committed.current);
    if (!to) return;
    committed.current = to;
    setDraft(to);
    setSelectedVertex(null);
    setSelectedObstacle(null);
    setShownPlan(null);
  }

  useEffect(() => {
    if (!canEdit) return;
    const onKey = (event: KeyboardEvent) => {
      const target = event.target as HTMLElement | null;
      if (target && ["INPUT", "TEXTAREA", "SELECT"].includes(target.tagName)) return;
      // Ctrl-Z / Ctrl-Shift-Z (Cmd on a Mac), and Ctrl-Y: undo and redo of wall edits.
      if ((event.ctrlKey || event.metaKey) && (event.key === "z" || event.key === "Z" || event.key === "y")) {
        event.preventDefault();
        travel(event.key === "y" || event.shiftKey ? "redo" : "undo");
        return;
      }
      if (mode !== "edit") return;
      if ((event.key === "Delete" || event.key === "Backspace") && (selectedVertex || selectedObstacle)) {
        event.preventDefault();
        deleteSelected();
      }
      const step = event.shiftKey ? 1 : 0.1;
      const moves: Record<string, Point> = { ArrowLeft: [-step, 0], ArrowRight: [step, 0], ArrowUp: [0, step], ArrowDown: [0, -step] };
      if (selectedVertex && moves[event.key]) {
        event.preventDefault();
        const p = ringOf(room, selectedVertex.ring)[selectedVertex.index];
        change(moveVertex(room, selectedVertex, [p[0] + moves[event.key][0], p[1] + moves[event.key][1]]));
      }
    };
    window.addEventListener("keydown", onKey);
    return () => window.removeEventListener("keydown", onKey);
  });

  async function save() {
    setSaving(true);
    setNotice(null);
    setServerProblems([]);
    try {
      const body: RoomWalls = { outline: room.outline, obstacles: room.obstacles, version: baseVersion };
      const saved = await apiFetch<{ room: RoomDetail }>(`/api/rooms/${detail.id}`, { method: "PUT", body });
      queryClient.setQueryData<RoomData>(queryKey, (old) => (old ? { ...old, room: saved.room } : old));
      setBaseVersion(saved.room.version);
      setDraft(null);
      setNotice({ kind: "ok", text: `Saved: the room is now at version ${saved.room.version}.` });
      // The page heading (server-rendered) shows the version too.
      router.refresh();
    } catch (error) {
      if (error instanceof ApiRequestError) {
        if (error.status === 422 && Array.isArray(error.details.problems)) setServerProblems(error.details.problems as RoomProblem[]);
        if (error.status === 409) {
          const fresh = await apiFetch<RoomData>(`/api/rooms/${detail.id}`).catch(() => null);
          if (fresh) setConflict({ version: fresh.room.version, outline: fresh.room.outline, obstacles: fresh.room.obstacles });
        }
        setNotice({ kind: "error", text: error.message });
      } else setNotice({ kind: "error", text: "The room could not be saved: the server did not answer. Try again." });
    } finally {
      setSaving(false);
    }
  }

  async function reload() {
    const fresh = await queryClient.fetchQuery({ queryKey, queryFn: () => apiFetch<RoomData>(`/api/rooms/${detail.id}`), staleTime: 0 });
    setBaseVersion(fresh.room.version);
    setDraft(null);
    history.clear();
    setConflict(null);
    setNotice(null);
    setServerProblems([]);
  }

  async function upload(file: File) {
    const text = await file.text();
    const result = importRoomFile(file.name, text);
    if (!result.ok) {
      setImportProblems(result.problems.map((p) => p.message));
      return;
    }
    change(result.room);
    setMode("edit");
    setNotice({ kind: "ok", text: `Read ${file.name} (${result.format.toUpperCase()}): ${result.room.outline.length} outline corners, ${result.room.obstacles.length} obstacle${result.room.obstacles.length === 1 ? "" : "s"}. Check the drawing, then save.` });
  }

  const problems = [...liveProblems, ...serverProblems];
  const dirty = draft !== null;
  const stale = detail.version !== baseVersion;

  const modes = useMemo(() => {
    const list: { mode: DrawingMode; label: string; hint: string }[] = [{ mode: "view", label: "View", hint: "Look at the plan." }];
    if (canEdit) {
      list.push({ mode: "edit", label: "Edit walls", hint: "Drag a corner to move it; double-click a wall to add a corner; select a corner or obstacle and press Delete (or the button) to remove it; arrow keys nudge the selected corner by 10 cm." });
      list.push({ mode: "obstacle", label: "Add obstacle", hint: "Drag a rectangle on the floor: a plinth or vitrine." });
      list.push({ mode: "freeform", label: "Draw obstacle", hint: "Click the corners of a vitrine, plinth or pillar one by one; double-click to close it. Or type its corners below." });
      list.push({ mode: "partition", label: "Add partition", hint: "Drag a line where a partition wall stands; it becomes an obstacle of the thickness set beside the tools." });
    }
    if (canApprove) {
      list.push({ mode: "pin", label: "Pin posts", hint: "Click the floor to pin a post where a guard must stand; click a pin to remove it." });
      list.push({ mode: "forbid", label: "Forbid zone", hint: "Drag a rectangle where no post may stand: keep exits and evacuation routes clear. Click a zone to remove it." });
    }
    return list;
  }, [canEdit, canApprove]);

  return (
    <div className="grid gap-6 lg:grid-cols-[minmax(0,1fr)_20rem]">
      <div className="space-y-3">
        <div className="flex flex-wrap items-center gap-2" role="toolbar" aria-label="Drawing tools">
          {modes.map((m) => (
            <button
              key={m.mode}
              type="button"
              className={mode === m.mode ? "button" : "button-quiet"}
              aria-pressed={mode === m.mode}
              onClick={() => setMode(m.mode)}
            >
              {m.label}
            </button>
          ))}
          {canEdit && (
            <>
              <button type="button" className="button-quiet" disabled={!history.canUndo} onClick={() => travel("undo")} aria-keyshortcuts="Control+Z">
                Undo
              </button>
              <button type="button" className="button-quiet" disabled={!history.canRedo} onClick={() => travel("redo")} aria-keyshortcuts="Control+Shift+Z">
                Redo
              </button>
            </>
          )}
          {canEdit && mode === "partition" && (
            <label className="inline-flex items-center gap-1 text-sm">
              Thickness (m)
              <input className="field-input mt-0 w-20" inputMode="decimal" value={partitionThickness} onChange={(e) => setPartitionThickness(e.target.value)} />
            </label>
          )}
          {canEdit && (mode === "edit" || mode === "partition") && (
            <label className="inline-flex items-center gap-1 text-sm">
              Snap to
              <select className="field-input mt-0 w-auto" value={snapStep} onChange={(e) => setSnapStep(Number(e.target.value))}>
                <option value={0.01}>1 cm</option>
                <option value={0.1}>10 cm</option>
                <option value={0.5}>50 cm</option>
                <option value={1}>1 m</option>
              </select>
            </label>
          )}
          {canEdit && mode === "edit" && (
            <button type="button" className="button-quiet" disabled={!selectedVertex && !selectedObstacle} onClick={deleteSelected}>
              {selectedObstacle ? "Remove obstacle" : "Delete vertex"}
            </button>
          )}
        </div>
        <p className="text-sm text-stone-700">{modes.find((m) => m.mode === mode)?.hint}</p>
        {shownPlan && (
          <p className="flex flex-wrap items-center gap-3 rounded-md bg-brass-100 p-2 text-sm" role="status">
            Showing stored plan {shownPlan.id} ({shownPlan.status}, {shownPlan.posts.length} posts) with its sight range, pins and zones.
            <button type="button" className="underline" onClick={() => setShownPlan(null)}>
              Back to the live plan
            </button>
          </p>
        )}

        <RoomDrawing
          room={room}
          mode={mode}
          triangles={answer?.ok ? answer.triangles : undefined}
          guaranteed={answer?.ok ? answer.guaranteed : null}
          // Sight shading and unseen parts: of the fewest plan once known, else of the guaranteed posts.
          sight={answer?.ok ? { ...answer.sight, posts: shownPlan || fewestCurrent ? answer.sight.posts : [] } : null}
          problems={problems}
          pinned={shownPlan ? shownPlan.options.pinned : pinned}
          forbidden={shownPlan ? shownPlan.options.forbidden : forbidden}
          selectedVertex={selectedVertex}
          selectedObstacle={selectedObstacle}
          show={show}
          snapStep={snapStep}
          zoom={zoom}
          pan={pan}
          onRoomChange={(next, commit) => change(next, commit)}
          onSelectVertex={setSelectedVertex}
          onSelectObstacle={setSelectedObstacle}
          onRectangle={(a, b) => {
            if (mode === "obstacle") {
              const next = addRectangleObstacle(room, a, b);
              if (typeof next === "string") setNotice({ kind: "error", text: `No obstacle added: ${next}.` });
              else change(next);
            } else if (mode === "forbid") {
              const zone = rectangle(a, b);
              if (Math.abs(zone[2][0] - zone[0][0]) >= 0.05 && Math.abs(zone[2][1] - zone[0][1]) >= 0.05) setForbidden([...forbidden, zone]);
            }
          }}
          onPolygon={(corners) => change({ outline: room.outline, obstacles: [...room.obstacles, corners] })}
          onLine={(a, b) => {
            const next = addPartition(room, a, b, Number(partitionThickness.replace(",", ".")));
            if (typeof next === "string") setNotice({ kind: "error", text: `No partition added: ${next}.` });
            else change(next);
          }}
          onPin={(p) => setPinned([...pinned, [Math.round(p[0] * 100) / 100, Math.round(p[1] * 100) / 100]])}
          onUnpin={(i) => setPinned(pinned.filter((_, k) => k !== i))}
          onRemoveForbidden={(i) => setForbidden(forbidden.filter((_, k) => k !== i))}
        />

        {canEdit && mode === "edit" && selectedVertex && ringOf(room, selectedVertex.ring)[selectedVertex.index] && (
          <CornerPanel
            room={room}
            vertex={selectedVertex}
            onMove={(ref, to) => change(moveVertex(room, ref, to))}
            onInsertAfter={(wall, at) => {
              change(insertVertex(room, wall, at));
              setSelectedVertex({ ring: wall.ring, index: wall.index + 1 });
            }}
          />
        )}

        <div className="flex flex-wrap items-center gap-2 text-sm" role="toolbar" aria-label="Zoom and pan">
          <button type="button" className="button-quiet" onClick={() => setZoom((z) => Math.min(20, z * 1.5))}>Zoom in</button>
          <button type="button" className="button-quiet" disabled={zoom <= 1} onClick={() => setZoom((z) => Math.max(1, z / 1.5))}>Zoom out</button>
          {(
            [
              ["←", "Pan left", [-1, 0]],
              ["→", "Pan right", [1, 0]],
              ["↑", "Pan up", [0, 1]],
              ["↓", "Pan down", [0, -1]],
            ] as const
          ).map(([glyph, label, [dx, dy]]) => (
            <button key={label} type="button" className="button-quiet" aria-label={label} disabled={zoom <= 1} onClick={() => setPan(([x, y]) => [x + (dx * roomSpan) / (4 * zoom), y + (dy * roomSpan) / (4 * zoom)])}>
              {glyph}
            </button>
          ))}
          <button type="button" className="button-quiet" disabled={zoom === 1 && pan[0] === 0 && pan[1] === 0} onClick={() => { setZoom(1); setPan([0, 0]); }}>Whole room</button>
          <span className="text-stone-700">{zoom === 1 ? "whole room" : `${Math.round(zoom * 100)} %`}</span>
        </div>
        {canEdit && (mode === "obstacle" || mode === "freeform" || mode === "partition") && (
          <TypedShape
            kind={mode === "partition" ? "partition" : "obstacle"}
            onObstacle={(corners) => {
              const next: Room = { outline: room.outline, obstacles: [...room.obstacles, corners.map((p) => [Math.round(p[0] * 100) / 100, Math.round(p[1] * 100) / 100] as Point)] };
              change(next);
              return null;
            }}
            onPartition={(a, b) => {
              const next = addPartition(room, a, b, Number(partitionThickness.replace(",", ".")));
              if (typeof next === "string") return next;
              change(next);
              return null;
            }}
          />
        )}

        <fieldset className="flex flex-wrap gap-4 text-sm">
          <legend className="sr-only">Layers</legend>
          {(
            [
              ["triangles", "Triangulation and colours"],
              ["guaranteed", "Guaranteed posts (squares)"],
              ["sight", "Sight and unseen floor"],
            ] as const
          ).map(([key, label]) => (
            <label key={key} className="inline-flex items-center gap-2">
              <input type="checkbox" checked={show[key]} onChange={(e) => setShow({ ...show, [key]: e.target.checked })} />
              {label}
            </label>
          ))}
        </fieldset>

        <div aria-live="polite" className="space-y-2">
          {working && <p className="text-sm text-stone-700">Re-planning in the browser…</p>}
          {failure && <p className="rounded-md bg-alert-50 p-3 text-sm text-alert-700">The live plan failed: {failure}</p>}
          {problems.length > 0 && (
            <div className="rounded-md border border-alert-200 bg-alert-50 p-3 text-sm text-alert-700" data-testid="room-problems">
              <p className="font-semibold">This room cannot be planned yet:</p>
              <ul className="list-disc pl-5">
                {problems.map((p, i) => (
                  <li key={i}>{p.message}</li>
                ))}
              </ul>
            </div>
          )}
          {importProblems.length > 0 && (
            <div className="rounded-md border border-alert-200 bg-alert-50 p-3 text-sm text-alert-700" data-testid="import-problems">
              <p className="font-semibold">The file could not be read:</p>
              <ul className="list-disc pl-5">
                {importProblems.map((p, i) => (
                  <li key={i}>{p}</li>
                ))}
              </ul>
            </div>
          )}
          {notice && (
            <p role={notice.kind === "error" ? "alert" : "status"} className={notice.kind === "error" ? "rounded-md bg-alert-50 p-3 text-sm text-alert-700" : "rounded-md bg-ok-50 p-3 text-sm text-ok-700"}>
              {notice.text}
            </p>
          )}
        </div>

        {conflict && (
          <section className="card space-y-2 border-l-4 border-alert-600" aria-labelledby="save-conflict" data-testid="save-conflict">
            <h2 id="save-conflict" className="text-base">Someone else saved version {conflict.version} meanwhile</h2>
            <p className="text-sm text-stone-700">Nothing of yours was saved. Compare the two, then reload theirs (your changes are dropped) or keep editing and copy your change onto theirs.</p>
            <div className="flex flex-wrap gap-4">
              <figure>
                <RoomOutline outline={room.outline} obstacles={room.obstacles} label={`${detail.name}, your unsaved walls`} size={200} />
                <figcaption className="text-sm">Your unsaved walls</figcaption>
              </figure>
              <figure>
                <RoomOutline outline={conflict.outline} obstacles={conflict.obstacles} label={`${detail.name}, version ${conflict.version}`} size={200} />
                <figcaption className="text-sm">Version {conflict.version}, saved meanwhile</figcaption>
              </figure>
            </div>
            <div className="flex flex-wrap gap-2">
              <button type="button" className="button" onClick={() => void reload()}>Reload version {conflict.version}</button>
              <button type="button" className="button-quiet" onClick={() => setConflict(null)}>Keep editing</button>
            </div>
          </section>
        )}

        {canEdit && (
          <div className="card flex flex-wrap items-end gap-3">
            <button type="button" className="button" disabled={!dirty || saving || problems.length > 0} onClick={save}>
              {saving ? "Saving…" : "Save room"}
            </button>
            <button type="button" className="button-quiet" disabled={!dirty && !stale} onClick={reload}>
              {dirty ? "Discard changes" : "Reload"}
            </button>
            <label className="text-sm">
              <span className="field-label">Upload a room file</span>
              <input
                type="file"
                accept=".geojson,.json,.svg,.csv,.txt"
                className="mt-1 block text-sm"
                onChange={(e) => {
                  const file = e.target.files?.[0];
                  if (file) void upload(file);
                  e.target.value = "";
                }}
              />
              <span className="mt-1 block text-xs text-stone-700">GeoJSON Polygon, SVG &lt;polygon&gt;/&lt;path&gt; (straight lines), or CSV rows ring,x,y or x,y — in metres.</span>
            </label>
            <p className="text-sm text-stone-700">
              Version {baseVersion}
              {dirty ? " · unsaved changes" : ""}
            </p>
          </div>
        )}

        <RoomVersions
          roomId={detail.id}
          roomName={detail.name}
          currentVersion={detail.version}
          current={{ outline: detail.outline, obstacles: detail.obstacles }}
          canEdit={canEdit}
          dirty={dirty}
          onRestored={() => {
            void reload();
            router.refresh();
          }}
        />
      </div>

      <aside className="space-y-4" aria-label="Plan figures">
        {cautions}
        <PlanFigures answer={answer} sightOf={sightOf} fewest={fewestCurrent} fewestState={fewestState} fewestMessage={fewestMessage} colourName={answer?.ok ? COLOUR_NAMES[answer.guaranteed.colour] : null} />
        <StaffingPanel site={detail.site} guaranteedPosts={answer?.ok ? answer.guaranteed.posts.length : null} fewestPosts={fewestCurrent ? fewestCurrent.posts.length : null} />
        {exhibition && (
          <CostOfChange
            site={detail.site}
            roomName={detail.name}
            roomVersion={detail.version}
            exhibitionName={exhibition.name}
            approved={approvedPlan ? { id: approvedPlan.id, posts: approvedPlan.posts.length, roomVersion: approvedPlan.room_version } : null}
            livePosts={fewestCurrent ? fewestCurrent.posts.length : answer?.ok ? answer.guaranteed.posts.length : null}
            liveKind={fewestCurrent ? "fewest plan" : "guaranteed plan"}
          />
        )}
        {canApprove && exhibition && (
          <PostPlansPanel
            roomId={detail.id}
            roomVersion={detail.version}
            dirty={dirty}
            exhibition={exhibition}
            plans={data.plans.filter((p) => p.exhibition_id === exhibition.id)}
            sightRange={sightRange}
            doubleCover={doubleCover}
            pinned={pinned}
            forbidden={forbidden}
            shownPlanId={shownPlan?.id ?? null}
            onShow={(plan) => setShownPlan(plan)}
            onSightRange={setSightRange}
            onDoubleCover={setDoubleCover}
            onClearConditions={() => {
              setPinned([]);
              setForbidden([]);
            }}
            onChanged={() => {
              void queryClient.invalidateQueries({ queryKey });
              router.refresh();
            }}
          />
        )}
        {canApprove && !exhibition && <p className="card text-sm">This room is in no current or coming exhibition, so there is no post plan to approve for it.</p>}
      </aside>
    </div>
  );
}
