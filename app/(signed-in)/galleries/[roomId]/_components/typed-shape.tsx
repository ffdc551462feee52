"use client";
// The keyboard way to add what is otherwise drawn: an obstacle of any shape by its corners, or a
// partition wall by its two ends and thickness, typed as "x, y" pairs in metres.
import { useState } from "react";
import type { Point } from "@/lib/geometry/types";

/** "1, 2; 3.5, 2; 3.5, 4" or one pair per line → points; a message when a pair does not read. */
export function readPoints(text: string): Point[] | string {
  const pairs = text.split(/[;\n]+/).map((p) => p.trim()).filter(Boolean);
  const points: Point[] = [];
  for (const pair of pairs) {
    const numbers = pair.split(/[\s,]+/).filter(Boolean).map(Number);
    if (numbers.length !== 2 || numbers.some((n) => !Number.isFinite(n) || Math.abs(n) > 10_000)) return `“${pair}” is not a point: write x, y in metres`;
    points.push([numbers[0]!, numbers[1]!]);
  }
  return points;
}

export function TypedShape({ kind, onObstacle, onPartition }: { kind: "obstacle" | "partition"; onObstacle: (corners: Point[]) => string | null; onPartition: (a: Point, b: Point) => string | null }) {
  const [text, setText] = useState("");
  const [problem, setProblem] = useState<string | null>(null);
  function submit(event: React.FormEvent) {
    event.preventDefault();
    const points = readPoints(text);
    if (typeof points === "string") return setProblem(points);
    if (kind === "obstacle" && points.length < 3) return setProblem("an obstacle needs at least 3 corners");
    if (kind === "partition" && points.length !== 2) return setProblem("a partition needs its two ends");
    const refused = kind === "obstacle" ? onObstacle(points) : onPartition(points[0]!, points[1]!);
    setProblem(refused);
    if (!refused) setText("");
  }
  const label = kind === "obstacle" ? "Obstacle corners (x, y; x, y; …)" : "Partition ends (x, y; x, y)";
  return (
    <form className="flex flex-wrap items-end gap-2 text-sm" onSubmit={submit} aria-label={kind === "obstacle" ? "Type an obstacle" : "Type a partition"}>
      <label className="block min-w-[14rem] flex-1">
        <span className="block font-semibold">{label}</span>
        <input className="field-input mt-0" value={text} onChange={(e) => setText(e.target.value)} placeholder={kind === "obstacle" ? "2, 2; 4, 2; 3, 4" : "1, 5; 8, 5"} />
      </label>
      <button type="submit" className="button-quiet">{kind === "obstacle" ? "Add obstacle" : "Add partition"}</button>
      {problem && <p role="alert" className="w-full text-alert-700">{problem}</p>}
    </form>
  );
}
