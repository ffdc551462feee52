// Rooms for the sightlines tests: AGPLIB polygons (AGPLIB, Univ. of Campinas; see its SOURCE.md).
import { readFileSync } from "node:fs";
import { prepareRoom } from "@/lib/geometry/room";
import type { Point, Room } from "@/lib/geometry/types";

const AGPLIB = "tests/fixtures/agplib/";

/** A normalised AGPLIB room by file name (without .geojson). */
export function agplibRoom(name: string): Room {
  const feature = JSON.parse(readFileSync(`${AGPLIB}${name}.geojson`, "utf8"));
  const rings = feature.geometry.coordinates as Point[][];
  const prepared = prepareRoom({ outline: rings[0], obstacles: rings.slice(1) });
  if (!prepared.ok) throw new Error(`${name}: ${prepared.problems[0].message}`);
  return prepared.room;
}


/** A normalised room from outline and obstacles; throws the validation message when invalid. */
export function prepared(room: Room): Room {
  const answer = prepareRoom(room);
  if (!answer.ok) throw new Error(answer.problems[0].message);
  return answer.room;
}
