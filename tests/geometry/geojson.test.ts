// GeoJSON rooms (lib/geometry/geojson.ts). Source: the GeoJSON structure of RFC 7946 (Feature,
// FeatureCollection, Polygon, MultiPolygon; ring 0 the exterior, further rings holes), read here as
// planar metres per scripts/README.md.
import { describe, expect, it } from "vitest";
import { roomsFromGeoJson, roomToFeature } from "@/lib/geometry/geojson";

const square = [[0, 0], [4, 0], [4, 4], [0, 4], [0, 0]];
const pillar = [[1, 1], [1, 2], [2, 2], [2, 1], [1, 1]];

describe("roomsFromGeoJson", () => {
  it("reads a FeatureCollection with names, obstacles and sight ranges", () => {
    const parsed = roomsFromGeoJson(
      {
        type: "FeatureCollection",
        features: [
          { type: "Feature", properties: { name: "east-gallery", sightRange: 12 }, geometry: { type: "Polygon", coordinates: [square, pillar] } },
          { type: "Feature", properties: {}, geometry: { type: "Polygon", coordinates: [square] } },
        ],
      },
      "floor1.geojson",
    );
    expect(parsed.errors).toEqual([]);
    expect(parsed.rooms.map((r) => r.name)).toEqual(["east-gallery", "floor1.geojson #1"]);
    expect(parsed.rooms[0].sightRange).toBe(12);
    expect(parsed.rooms[0].room.obstacles).toHaveLength(1);
    expect(parsed.rooms[1].sightRange).toBeUndefined();
  });

  it("splits a MultiPolygon into numbered rooms and accepts bare geometries", () => {
    const multi = roomsFromGeoJson({ type: "Feature", properties: { name: "hall" }, geometry: { type: "MultiPolygon", coordinates: [[square], [square, pillar]] } }, "f");
    expect(multi.rooms.map((r) => r.name)).toEqual(["hall #1", "hall #2"]);
    const bare = roomsFromGeoJson({ type: "Polygon", coordinates: [square] }, "plan.json");
    expect(bare.rooms[0].name).toBe("plan.json #1");
  });

  it("reports input that is not a room, naming it", () => {
    expect(roomsFromGeoJson({ type: "Point", coordinates: [0, 0] }, "x").errors[0]).toMatchObject({ code: "not-a-polygon" });
    expect(roomsFromGeoJson([1, 2], "x").errors[0]).toMatchObject({ code: "bad-geojson" });
    expect(roomsFromGeoJson({ type: "Polygon", coordinates: [[[0, 0], 5]] }, "x").errors[0].message).toContain("position 2 of ring 1");
    const badRange = roomsFromGeoJson({ type: "Feature", properties: { name: "a", sightRange: -3 }, geometry: { type: "Polygon", coordinates: [square] } }, "x");
    expect(badRange.errors[0]).toMatchObject({ room: "a", code: "bad-sight-range" });
  });

  it("round-trips through roomToFeature", () => {
    const room = roomsFromGeoJson({ type: "Polygon", coordinates: [square, pillar] }, "r").rooms[0];
    const again = roomsFromGeoJson(roomToFeature(room), "r").rooms[0];
    expect(again.room.outline).toEqual(room.room.outline.concat([room.room.outline[0]]));
  });
});
