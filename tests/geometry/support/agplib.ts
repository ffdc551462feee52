// The public AGPLIB benchmark polygons (AGPLIB, Univ. of Campinas; see tests/fixtures/agplib/
// SOURCE.md), read as rooms.
import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import type { P, PlainRoom } from "./oracle";

export const AGPLIB_FOLDER = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../fixtures/agplib");

export interface BenchmarkPolygon {
  file: string;
  name: string;
  /** Rings exactly as in the file (ring 0 outline, others holes), closing point included. */
  rings: P[][];
}

export function agplibPolygons(): BenchmarkPolygon[] {
  return readdirSync(AGPLIB_FOLDER)
    .filter((f) => f.endsWith(".geojson"))
    .sort()
    .map((file) => {
      const feature = JSON.parse(readFileSync(path.join(AGPLIB_FOLDER, file), "utf8"));
      return { file, name: feature.properties?.name ?? file, rings: feature.geometry.coordinates as P[][] };
    });
}

export function asRoom(rings: P[][]): PlainRoom {
  return { outline: rings[0], obstacles: rings.slice(1) };
}
