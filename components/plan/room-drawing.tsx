"use client";
// The room drawn to scale in metres (north up): floor, obstacles, the guaranteed plan's triangles
// and colours, posts with their sight, unseen parts, pinned posts, forbidden zones and any problem
// at its place. In edit modes it turns pointer gestures into room edits.
import { useRef, useState } from "react";
import type { Point, Ring, Room } from "@/lib/geometry/types";
import type { RoomProblem } from "@/lib/geometry/room";
import { formatPoint } from "@/lib/geometry/room";
import type { PlanTriangle } from "./plan-messages";
import { moveVertex, nearestWall, insertVertex, type VertexRef } from "./room-edits";

export type DrawingMode = "view" | "edit" | "obstacle" | "freeform" | "partition" | "pin" | "forbid";

/** The three colours of the 3-colouring (ink, brass, stone): posts take one of them. */
export const COLOUR_FILLS = ["#2f706c", "#c0963a", "#8f7d67"] as const;
export const COLOUR_NAMES = ["teal", "brass", "stone"] as const;

export interface RoomDrawingProps {
  room: Room;
  mode: DrawingMode;
  triangles?: PlanTriangle[];
  guaranteed?: { posts: Point[]; colour: number } | null;
  sight?: { posts: Point[]; regions: Ring[][][]; uncovered: Ring[][] } | null;
  problems?: RoomProblem[];
  pinned?: Point[];
  forbidden?: Ring[];
  selectedVertex?: VertexRef | null;
  selectedObstacle?: number | null;
  show: { triangles: boolean; guaranteed: boolean; sight: boolean };
  onRoomChange?: (room: Room, commit: boolean) => void;
  onSelectVertex?: (vertex: VertexRef | null) => void;
  onSelectObstacle?: (obstacle: number | null) => void;
  onRectangle?: (a: Point, b: Point) => void;
  /** A partition wall drawn as a line (mode "partition"). */
  onLine?: (a: Point, b: Point) => void;
  /** An obstacle of any shape, clicked corner by corner and closed by a double-click (mode "freeform"). */
  onPolygon?: (corners: Point[]) => void;
  onPin?: (p: Point) => void;
  onUnpin?: (index: number) => void;
  onRemoveForbidden?: (index: number) => void;
  /** Corners dragged or added land on this grid, in metres (0.1 by default). */
  snapStep?: number;
  /** 1 = the whole room; 2 = twice as close. */
  zoom?: number;
  /** Where the view's centre sits, in metres from the room's centre. */
  pan?: Point;
}

function path(ring: Ring): string {
  return ring.map(([x, y], i) => `${i === 0 ? "M" : "L"}${x} ${-y}`).join(" ") + " Z";
}

function regionPath(polygons: Ring[][]): string {
  return polygons.map((polygon) => polygon.map(path).join(" ")).join(" ");
}

export function RoomDrawing(props: RoomDrawingProps) {
  const { room, mode, show } = props;
  const svg = useRef<SVGSVGElement>(null);
  const [drag, setDrag] = useState<VertexRef | null>(null);
  const [rubber, setRubber] = useState<{ from: Point; to: Point } | null>(null);
  const [sketch, setSketch] = useState<Point[]>([]);

  const all = [room.outline, ...room.obstacles].flat();
  const xs = all.map((p) => p[0]);
  const ys = all.map((p) => p[1]);
  const minX = xs.length ? Math.min(...xs) : 0;
  const maxX = xs.length ? Math.max(...xs) : 10;
  const minY = ys.length ? Math.min(...ys) : 0;
  const maxY = ys.length ? Math.max(...ys) : 10;
  const size = Math.max(maxX - minX, maxY - minY, 1);
  const pad = size * 0.08;
  // Marks scale with the room so a 4 m kiosk and a 60 m hall read alike.
  const unit = size / 60;

  /** The pointer's position in room metres (y up). */
  function metres(event: { clientX: number; clientY: number }): Point {
    const element = svg.current;
    const matrix = element?.getScreenCTM();
    if (!element || !matrix) return [0, 0];
    const point = element.createSVGPoint();
    point.x = event.clientX;
    point.y = event.clientY;
    const local = point.matrixTransform(matrix.inverse());
    return [local.x, -local.y];
  }

  const editing = mode === "edit";
  const snapStep = props.snapStep ?? 0.1;
  /** The pointer on the snapping grid. */
  function snapped(event: { clientX: number; clientY: number }): Point {
    const [x, y] = metres(event);
    if (!(snapStep > 0)) return [x, y];
    return [Math.round(x / snapStep) * snapStep, Math.round(y / snapStep) * snapStep];
  }
  // A metre grid (2 or 5 m on large rooms) and a scale bar of a round length.
  const gridStep = size > 80 ? 5 : size > 30 ? 2 : 1;
  const gridLines: { x1: number; y1: number; x2: number; y2: number }[] = [];
  for (let gx = Math.ceil((minX - pad) / gridStep) * gridStep; gx <= maxX + pad; gx += gridStep) gridLines.push({ x1: gx, y1: -(maxY + pad), x2: gx, y2: -(minY - pad) });
  for (let gy = Math.ceil((minY - pad) / gridStep) * gridStep; gy <= maxY + pad; gy += gridStep) gridLines.push({ x1: minX - pad, y1: -gy, x2: maxX + pad, y2: -gy });
  const barLength = [1, 2, 5, 10, 20, 50, 100].find((l) => l >= size / 6) ?? 100;
  // Zoom and pan move the window onto the room; the room's own numbers never change.
  const zoom = Math.min(20, Math.max(1, props.zoom ?? 1));
  const [panX, panY] = props.pan ?? [0, 0];
  const viewW = (maxX - minX + 2 * pad) / zoom;
  const viewH = (maxY - minY + 2 * pad) / zoom;
  const centreX = (minX + maxX) / 2 + panX;
  const centreY = -((minY + maxY) / 2 + panY);
  const viewBox = `${centreX - viewW / 2} ${centreY - viewH / 2} ${viewW} ${viewH}`;

  function onPointerDown(event: React.PointerEvent<SVGSVGElement>) {
    if (mode === "obstacle" || mode === "forbid" || mode === "partition") {
      const p = mode === "partition" ? snapped(event) : metres(event);
      setRubber({ from: p, to: p });
      (event.target as Element).setPointerCapture?.(event.pointerId);
    } else if (mode === "freeform") {
      setSketch((points) => [...points, snapped(event)]);
    } else if (mode === "pin") {
      props.onPin?.(metres(event));
    } else if (editing && event.target === svg.current) {
      props.onSelectVertex?.(null);
      props.onSelectObstacle?.(null);
    }
  }

  function onPointerMove(event: React.PointerEvent<SVGSVGElement>) {
    if (drag) props.onRoomChange?.(moveVertex(room, drag, snapped(event)), false);
    else if (rubber) setRubber({ from: rubber.from, to: mode === "partition" ? snapped(event) : metres(event) });
  }

  function onPointerUp(event: React.PointerEvent<SVGSVGElement>) {
    if (drag) {
      props.onRoomChange?.(moveVertex(room, drag, snapped(event)), true);
      setDrag(null);
    } else if (rubber && mode === "partition") {
      props.onLine?.(rubber.from, snapped(event));
      setRubber(null);
    } else if (rubber) {
      props.onRectangle?.(rubber.from, metres(event));
      setRubber(null);
    }
  }

  function onDoubleClick(event: React.MouseEvent<SVGSVGElement>) {
    if (mode === "freeform") {
      // The double-click's own two clicks added the last corner twice: keep it once.
      const corners = sketch.filter((p, i) => i === 0 || p[0] !== sketch[i - 1]![0] || p[1] !== sketch[i - 1]![1]);
      if (corners.length >= 3) props.onPolygon?.(corners);
      setSketch([]);
      return;
    }
    if (!editing) return;
    const p = snapped(event);
    const hit = nearestWall(room, p, unit * 1.5);
    if (hit) props.onRoomChange?.(insertVertex(room, hit.wall, hit.at), true);
  }

  const rings = [room.outline, ...room.obstacles];
  return (
    <svg
      ref={svg}
      data-testid="room-drawing"
      role="application"
      aria-label={`Drawing of the room, ${(maxX - minX).toFixed(1)} by ${(maxY - minY).toFixed(1)} metres`}
      viewBox={viewBox}
      className={`h-[28rem] w-full touch-none select-none rounded-card border border-stone-200 bg-stone-100 ${mode === "view" ? "" : "cursor-crosshair"}`}
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onDoubleClick={onDoubleClick}
    >
      <defs>
        <pattern id="unseen-hatch" width={unit} height={unit} patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
          <rect width={unit} height={unit} fill="#fbeeec" />
          <line x1="0" y1="0" x2="0" y2={unit} stroke="#b03a2e" strokeWidth={unit * 0.5} />
        </pattern>
      </defs>

      <g data-testid="drawing-grid" aria-hidden="true">
        {gridLines.map((l, i) => (
          <line key={i} {...l} stroke="#d6d3d1" strokeWidth={unit * 0.08} />
        ))}
      </g>
      <g data-testid="scale-bar" aria-hidden="true" transform={`translate(${minX - pad * 0.6} ${-(minY - pad * 0.45)})`}>
        <rect x={0} y={-unit * 0.25} width={barLength} height={unit * 0.5} fill="#123b3a" />
        <text x={0} y={-unit * 0.6} fontSize={unit * 1.4} fill="#123b3a">
          {barLength} m
        </text>
      </g>

      {/* Floor: outline filled, obstacles cut out. */}
      <path d={rings.map(path).join(" ")} fillRule="evenodd" fill="#ffffff" stroke="none" />

      {show.triangles &&
        props.triangles?.map((t, i) => (
          <path key={i} d={path(t.corners)} fill="none" stroke="#a9cdc9" strokeWidth={unit * 0.08} />
        ))}

      {show.sight &&
        props.sight?.regions.map((region, i) => (
          <path key={i} d={regionPath(region)} fillRule="evenodd" fill="#77aea9" fillOpacity={0.22} stroke="#4b8c87" strokeOpacity={0.5} strokeWidth={unit * 0.06} />
        ))}

      {show.sight &&
        props.sight?.uncovered.map((polygon, i) => (
          <path key={i} data-testid="unseen-area" d={polygon.map(path).join(" ")} fillRule="evenodd" fill="url(#unseen-hatch)" stroke="#b03a2e" strokeWidth={unit * 0.12}>
            <title>Nobody sees this part of the floor</title>
          </path>
        ))}

      {props.forbidden?.map((zone, i) => (
        <path
          key={i}
          data-testid="forbidden-zone"
          d={path(zone)}
          fill="#f0c3bc"
          fillOpacity={0.55}
          stroke="#8f2c22"
          strokeDasharray={`${unit * 0.6} ${unit * 0.4}`}
          strokeWidth={unit * 0.12}
          onClick={() => mode === "forbid" && props.onRemoveForbidden?.(i)}
        >
          <title>Forbidden zone {i + 1}: no post may stand here (exits, evacuation routes){mode === "forbid" ? "; click to remove" : ""}</title>
        </path>
      ))}

      {/* Walls on top of the shading; obstacles selectable in edit mode. */}
      {rings.map((ring, r) => (
        <path
          key={r}
          data-obstacle={r > 0 ? r : undefined}
          d={path(ring)}
          fill={r > 0 ? (props.selectedObstacle === r ? "#e2c27a" : "#d3c6b2") : "none"}
          stroke={r > 0 && props.selectedObstacle === r ? "#7d5f1c" : "#113836"}
          strokeWidth={unit * (r === 0 ? 0.3 : 0.2)}
          strokeLinejoin="round"
          className={editing && r > 0 ? "cursor-pointer" : undefined}
          onPointerDown={(event) => {
            if (editing && r > 0) {
              event.stopPropagation();
              props.onSelectObstacle?.(r);
              props.onSelectVertex?.(null);
            }
          }}
        >
          <title>{r === 0 ? "Outline" : `Obstacle ${r}`}</title>
        </path>
      ))}

      {show.guaranteed &&
        props.guaranteed?.posts.map(([x, y], i) => (
          <rect
            key={i}
            data-testid="guaranteed-post"
            x={x - unit * 0.7}
            y={-y - unit * 0.7}
            width={unit * 1.4}
            height={unit * 1.4}
            fill={COLOUR_FILLS[props.guaranteed!.colour]}
            stroke="#ffffff"
            strokeWidth={unit * 0.15}
          >
            <title>Guaranteed post {i + 1} at {formatPoint([x, y])}</title>
          </rect>
        ))}

      {show.triangles &&
        props.triangles?.flatMap((t, i) =>
          t.corners.map(([x, y], k) => <circle key={`${i}-${k}`} cx={x} cy={-y} r={unit * 0.35} fill={COLOUR_FILLS[t.colours[k]]} />),
        )}

      {show.sight &&
        props.sight?.posts.map(([x, y], i) => (
          <g key={i} data-testid="fewest-post">
            <circle cx={x} cy={-y} r={unit * 0.9} fill="#113836" stroke="#ffffff" strokeWidth={unit * 0.2} />
            <text x={x} y={-y + unit * 0.35} textAnchor="middle" fontSize={unit * 1.1} fill="#ffffff" fontWeight="bold">
              {i + 1}
            </text>
            <title>Post {i + 1} at {formatPoint([x, y])}</title>
          </g>
        ))}

      {props.pinned?.map(([x, y], i) => (
        <g
          key={i}
          data-testid="pinned-post"
          onPointerDown={(event) => {
            if (mode === "pin") {
              event.stopPropagation();
              props.onUnpin?.(i);
            }
          }}
        >
          <path d={`M${x} ${-y} l${-unit} ${-unit * 2} h${unit * 2} Z`} fill="#7d5f1c" stroke="#ffffff" strokeWidth={unit * 0.15} />
          <title>Pinned post {i + 1} at {formatPoint([x, y])}{mode === "pin" ? "; click to unpin" : ""}</title>
        </g>
      ))}

      {editing &&
        rings.flatMap((ring, r) =>
          ring.map(([x, y], i) => {
            const selected = props.selectedVertex?.ring === r && props.selectedVertex.index === i;
            return (
              <circle
                key={`${r}-${i}`}
                data-vertex={`${r}-${i}`}
                aria-label={`vertex ${i + 1} of ${r === 0 ? "the outline" : `obstacle ${r}`} at ${formatPoint([x, y])}`}
                cx={x}
                cy={-y}
                r={unit * (selected ? 0.9 : 0.7)}
                fill={selected ? "#e0a526" : "#ffffff"}
                stroke="#113836"
                strokeWidth={unit * 0.2}
                className="cursor-move"
                // Corners are reachable by Tab; Enter or Space selects one, the arrow keys then move it.
                tabIndex={0}
                role="button"
                aria-pressed={selected}
                onKeyDown={(event) => {
                  if (event.key === "Enter" || event.key === " ") {
                    event.preventDefault();
                    props.onSelectVertex?.({ ring: r, index: i });
                    props.onSelectObstacle?.(null);
                  }
                }}
                onPointerDown={(event) => {
                  event.stopPropagation();
                  svg.current?.setPointerCapture?.(event.pointerId);
                  setDrag({ ring: r, index: i });
                  props.onSelectVertex?.({ ring: r, index: i });
                  props.onSelectObstacle?.(null);
                }}
              />
            );
          }),
        )}

      {drag && (() => {
        // Wall lengths while a corner moves: the wall in and the wall out, in metres.
        const ring = drag.ring === 0 ? room.outline : room.obstacles[drag.ring - 1];
        const here = ring?.[drag.index];
        if (!ring || !here) return null;
        const before = ring[(drag.index - 1 + ring.length) % ring.length]!;
        const after = ring[(drag.index + 1) % ring.length]!;
        const len = (a: Point, b: Point) => Math.hypot(b[0] - a[0], b[1] - a[1]).toFixed(2);
        return (
          <text data-testid="drag-lengths" x={here[0] + unit * 1.2} y={-here[1] - unit * 1.2} fontSize={unit * 1.6} fill="#113836" stroke="#ffffff" strokeWidth={unit * 0.3} paintOrder="stroke">
            {len(before, here)} m · {len(here, after)} m
          </text>
        );
      })()}
      {mode === "freeform" && sketch.length > 0 && (
        <polyline data-testid="sketch" points={sketch.map(([x, y]) => `${x},${-y}`).join(" ")} fill="none" stroke="#113836" strokeWidth={unit * 0.25} strokeDasharray={`${unit * 0.5} ${unit * 0.5}`} />
      )}
      {rubber && mode === "partition" && (
        <line x1={rubber.from[0]} y1={-rubber.from[1]} x2={rubber.to[0]} y2={-rubber.to[1]} stroke="#113836" strokeWidth={unit * 0.4} strokeDasharray={`${unit * 0.5} ${unit * 0.5}`} />
      )}
      {rubber && mode !== "partition" && (
        <path
          d={path([rubber.from, [rubber.to[0], rubber.from[1]], rubber.to, [rubber.from[0], rubber.to[1]]])}
          fill={mode === "forbid" ? "#f0c3bc" : "#d3c6b2"}
          fillOpacity={0.6}
          stroke="#113836"
          strokeDasharray={`${unit * 0.5} ${unit * 0.5}`}
          strokeWidth={unit * 0.15}
        />
      )}

      {props.problems?.map((problem, i) =>
        problem.at ? (
          <g key={i} data-testid="problem-marker">
            <circle cx={problem.at[0]} cy={-problem.at[1]} r={unit * 1.4} fill="none" stroke="#b03a2e" strokeWidth={unit * 0.35} />
            <text
              x={problem.at[0] + unit * 1.8}
              y={-problem.at[1] - unit * 1.2}
              fontSize={unit * 1.5}
              fill="#8f2c22"
              stroke="#ffffff"
              strokeWidth={unit * 0.3}
              paintOrder="stroke"
              fontWeight="bold"
            >
              {problem.message}
            </text>
          </g>
        ) : null,
      )}
    </svg>
  );
}
