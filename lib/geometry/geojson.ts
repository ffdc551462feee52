// Rooms from GeoJSON (RFC 7946 structure, read as planar metres in the building's own frame, not
// longitude/latitude): Feature, FeatureCollection, Polygon, MultiPolygon or GeometryCollection.
// Each polygon is one room: ring 0 the outline, further rings obstacles; ring orientation and the
// repeated closing point are accepted either way (normaliseRoom settles both).
import type { Point, Ring, Room } from "./types";

/** A room as a file names it, with its own sight range when the file gives one. */
export interface NamedRoom {
  name: string;
  room: Room;
  /** Metres a guard can watch well, from the Feature's `sightRange` property. */
  sightRange?: number;
}

/** Input that is not a room at all (as opposed to a room with bad walls, see validateRoom). */
export interface GeoJsonProblem {
  room: string;
  code: string;
  message: string;
}

export interface ParsedRooms {
  rooms: NamedRoom[];
  errors: GeoJsonProblem[];
}

type Json = Record<string, unknown>;
const isObject = (v: unknown): v is Json => typeof v === "object" && v !== null && !Array.isArray(v);

/**
 * Read every room in a parsed GeoJSON value. `source` names rooms that have no `name` property:
 * "east.geojson #2" for the second polygon of the file. A MultiPolygon named "hall" gives rooms
 * "hall #1", "hall #2", ...
 */
export function roomsFromGeoJson(value: unknown, source: string): ParsedRooms {
  const out: ParsedRooms = { rooms: [], errors: [] };
  let counter = 0;
  const fallbackName = () => `${source} #${++counter}`;

  const addPolygon = (coordinates: unknown, name: string, sightRange: number | undefined) => {
    const rings = readRings(coordinates);
    if (typeof rings === "string") {
      out.errors.push({ room: name, code: "bad-geojson", message: `${name}: ${rings}` });
      return;
    }
    if (rings.length === 0) {
      out.errors.push({ room: name, code: "too-few-points", message: `${name}: the polygon has no outline ring` });
      return;
    }
    out.rooms.push({ name, room: { outline: rings[0], obstacles: rings.slice(1) }, ...(sightRange !== undefined ? { sightRange } : {}) });
  };

  const addGeometry = (geometry: unknown, name: string | undefined, sightRange: number | undefined) => {
    if (!isObject(geometry)) {
      const label = name ?? fallbackName();
      out.errors.push({ room: label, code: "bad-geojson", message: `${label}: the feature has no geometry` });
      return;
    }
    switch (geometry.type) {
      case "Polygon":
        addPolygon(geometry.coordinates, name ?? fallbackName(), sightRange);
        return;
      case "MultiPolygon": {
        const polygons = geometry.coordinates;
        const label = name ?? fallbackName();
        if (!Array.isArray(polygons)) {
          out.errors.push({ room: label, code: "bad-geojson", message: `${label}: MultiPolygon coordinates must be an array of polygons` });
          return;
        }
        if (polygons.length === 1) addPolygon(polygons[0], label, sightRange);
        else polygons.forEach((polygon, i) => addPolygon(polygon, `${label} #${i + 1}`, sightRange));
        return;
      }
      case "GeometryCollection": {
        const parts = geometry.geometries;
        if (Array.isArray(parts)) for (const part of parts) addGeometry(part, undefined, sightRange);
        return;
      }
      default: {
        const label = name ?? fallbackName();
        out.errors.push({
          room: label,
          code: "not-a-polygon",
          message: `${label}: a ${String(geometry.type)} is not a room; draw rooms as Polygon or MultiPolygon`,
        });
      }
    }
  };

  const addFeature = (feature: Json) => {
    const properties = isObject(feature.properties) ? feature.properties : {};
    const name = typeof properties.name === "string" && properties.name.trim() !== "" ? properties.name : undefined;
    let sightRange: number | undefined;
    if (properties.sightRange !== undefined && properties.sightRange !== null) {
      const range = Number(properties.sightRange);
      if (!(Number.isFinite(range) && range > 0)) {
        const label = name ?? fallbackName();
        out.errors.push({ room: label, code: "bad-sight-range", message: `${label}: sightRange must be a positive number of metres` });
        return;
      }
      sightRange = range;
    }
    addGeometry(feature.geometry, name, sightRange);
  };

  if (!isObject(value)) {
    out.errors.push({ room: source, code: "bad-geojson", message: `${source}: expected a GeoJSON object` });
  } else if (value.type === "FeatureCollection") {
    const features = Array.isArray(value.features) ? value.features : [];
    for (const feature of features) {
      if (isObject(feature)) addFeature(feature);
      else out.errors.push({ room: fallbackName(), code: "bad-geojson", message: `${source}: a feature that is not an object` });
    }
  } else if (value.type === "Feature") {
    addFeature(value);
  } else if (typeof value.type === "string") {
    addGeometry(value, undefined, undefined);
  } else {
    out.errors.push({ room: source, code: "bad-geojson", message: `${source}: not GeoJSON (no "type")` });
  }
  return out;
}

/** Rings as arrays of [x, y]; extra positions (z) are ignored. A string says what is wrong. */
function readRings(coordinates: unknown): Ring[] | string {
  if (!Array.isArray(coordinates)) return "Polygon coordinates must be an array of rings";
  const rings: Ring[] = [];
  for (let r = 0; r < coordinates.length; r++) {
    const ring = coordinates[r];
    if (!Array.isArray(ring)) return `ring ${r + 1} is not an array of positions`;
    const points: Point[] = [];
    for (let i = 0; i < ring.length; i++) {
      const p = ring[i];
      if (!Array.isArray(p) || p.length < 2) return `position ${i + 1} of ring ${r + 1} is not [x, y]`;
      // Non-numbers become NaN so validateRoom reports them with their vertex number.
      points.push([typeof p[0] === "number" ? p[0] : NaN, typeof p[1] === "number" ? p[1] : NaN]);
    }
    rings.push(points);
  }
  return rings;
}

/** A room as a GeoJSON Feature (outline and obstacles closed), e.g. for fixtures and exports. */
export function roomToFeature(named: NamedRoom): Json {
  const close = (ring: Ring) => (ring.length > 0 ? [...ring, ring[0]] : ring);
  return {
    type: "Feature",
    properties: { name: named.name, ...(named.sightRange !== undefined ? { sightRange: named.sightRange } : {}) },
    geometry: { type: "Polygon", coordinates: [close(named.room.outline), ...named.room.obstacles.map(close)] },
  };
}
