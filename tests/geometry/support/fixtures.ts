// The hard-case rooms in tests/fixtures/rooms, each a GeoJSON Feature with its expected outcome
// (earcut's habit: every hard case is a named fixture with what it must give).
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { P } from "./oracle";

export const FIXTURE_FOLDER = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../fixtures/rooms");

export type Expected =
  | { valid: true; vertices: number; obstacles: number; triangles: number; bound: number; posts?: number }
  | { valid: false; code: string; message: string };

export interface RoomFixture {
  file: string;
  name: string;
  note: string;
  rings: P[][];
  expected: Expected;
}

export function roomFixtures(): RoomFixture[] {
  return readdirSync(FIXTURE_FOLDER)
    .filter((f) => f.endsWith(".json"))
    .sort()
    .map((file) => {
      const feature = JSON.parse(readFileSync(path.join(FIXTURE_FOLDER, file), "utf8"));
      return {
        file,
        name: feature.properties.name,
        note: feature.properties.note,
        rings: feature.geometry.coordinates,
        expected: feature.expected,
      };
    });
}
