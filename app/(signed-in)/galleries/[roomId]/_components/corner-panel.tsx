"use client";
// The selected corner in numbers: its coordinates and the lengths of its two walls, each of which
// can be typed instead of dragged (the next corner moves along the wall to give the length).
import { useEffect, useState } from "react";
import type { Point, Room } from "@/lib/geometry/types";
import { ringOf, type VertexRef } from "@/components/plan/room-edits";

const metres = (v: number) => (Math.round(v * 100) / 100).toFixed(2);
const length = (a: Point, b: Point) => Math.hypot(b[0] - a[0], b[1] - a[1]);

export function CornerPanel({ room, vertex, onMove, onInsertAfter }: { room: Room; vertex: VertexRef; onMove: (ref: VertexRef, to: Point) => void; onInsertAfter: (wall: VertexRef, at: Point) => void }) {
  const ring = ringOf(room, vertex.ring);
  const here = ring[vertex.index]!;
  const before = ring[(vertex.index - 1 + ring.length) % ring.length]!;
  const afterIndex = (vertex.index + 1) % ring.length;
  const after = ring[afterIndex]!;
  const [x, setX] = useState(metres(here[0]));
  const [y, setY] = useState(metres(here[1]));
  const [next, setNext] = useState(metres(length(here, after)));
  const [problem, setProblem] = useState<string | null>(null);
  useEffect(() => {
    setX(metres(here[0]));
    setY(metres(here[1]));
    setNext(metres(length(here, after)));
    setProblem(null);
  }, [here[0], here[1], after[0], after[1]]); // eslint-disable-line react-hooks/exhaustive-deps

  const read = (text: string) => Number(text.trim().replace(",", "."));
  function place(event: React.FormEvent) {
    event.preventDefault();
    const [nx, ny] = [read(x), read(y)];
    if (!Number.isFinite(nx) || !Number.isFinite(ny) || Math.abs(nx) > 10_000 || Math.abs(ny) > 10_000) {
      setProblem("give x and y in metres, e.g. 4.5");
      return;
    }
    onMove(vertex, [nx, ny]);
  }
  function stretch(event: React.FormEvent) {
    event.preventDefault();
    const wanted = read(next);
    const current = length(here, after);
    if (!Number.isFinite(wanted) || wanted < 0.05 || wanted > 10_000) {
      setProblem("give the wall's length in metres, at least 0.05");
      return;
    }
    if (current === 0) return;
    const k = wanted / current;
    onMove({ ring: vertex.ring, index: afterIndex }, [here[0] + (after[0] - here[0]) * k, here[1] + (after[1] - here[1]) * k]);
  }
  const name = vertex.ring === 0 ? `corner ${vertex.index + 1}` : `corner ${vertex.index + 1} of obstacle ${vertex.ring}`;
  return (
    <section aria-labelledby="corner-panel" className="card space-y-2 text-sm" data-testid="corner-panel">
      <h2 id="corner-panel" className="text-base">Selected {name}</h2>
      <p className="text-stone-700">
        Wall in: {metres(length(before, here))} m · wall out: {metres(length(here, after))} m
      </p>
      <form className="flex flex-wrap items-end gap-2" onSubmit={place} aria-label="Corner position">
        <label className="block">
          <span className="block font-semibold">x (m)</span>
          <input className="field-input mt-0 w-24" inputMode="decimal" value={x} onChange={(e) => setX(e.target.value)} />
        </label>
        <label className="block">
          <span className="block font-semibold">y (m)</span>
          <input className="field-input mt-0 w-24" inputMode="decimal" value={y} onChange={(e) => setY(e.target.value)} />
        </label>
        <button type="submit" className="button-quiet">Move corner</button>
      </form>
      <form className="flex flex-wrap items-end gap-2" onSubmit={stretch} aria-label="Length of the next wall">
        <label className="block">
          <span className="block font-semibold">Next wall length (m)</span>
          <input className="field-input mt-0 w-28" inputMode="decimal" value={next} onChange={(e) => setNext(e.target.value)} />
        </label>
        <button type="submit" className="button-quiet">Set length</button>
      </form>
      <button type="button" className="button-quiet" onClick={() => onInsertAfter(vertex, [(here[0] + after[0]) / 2, (here[1] + after[1]) / 2])}>
        Add a corner in the middle of the next wall
      </button>
      {problem && <p role="alert" className="text-alert-700">{problem}</p>}
    </section>
  );
}
