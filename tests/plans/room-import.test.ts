// Room files as curators bring them: GeoJSON (RFC 7946 structure), SVG (SVG 1.1 path data, section
// 8.3: M/L/H/V/Z, upper case absolute, lower case relative, extra pairs after M are linetos) and CSV
// of vertices. Each format: a good file, then files that must fail with the line to look at.
import { describe, expect, it } from "vitest";
import { detectRoomFormat, importRoomFile, ringsFromPathData, roomFromCsv, roomFromGeoJsonText, roomFromSvg } from "@/lib/geometry/room-import";
import { validateRoom } from "@/lib/geometry/room";
import { roomToFeature } from "@/lib/geometry/geojson";
import type { Room } from "@/lib/geometry/types";

// The seed's Print Room (12 × 9 m with a 4 × 2 m table), written by hand in each format below.
const PRINT_ROOM: Room = {
  outline: [[0, 0], [12, 0], [12, 9], [0, 9]],
  obstacles: [[[4, 3], [4, 5], [8, 5], [8, 3]]],
};

function ok(result: ReturnType<typeof importRoomFile>) {
  if (!result.ok) throw new Error("expected a room, got: " + result.problems.map((p) => p.message).join("; "));
  return result;
}
function problems(result: ReturnType<typeof importRoomFile>) {
  if (result.ok) throw new Error("expected problems, got a room");
  return result.problems;
}

describe("format detection", () => {
  it("goes by the file name, then by the first character", () => {
    expect(detectRoomFormat("hall.geojson", "")).toBe("geojson");
    expect(detectRoomFormat("hall.JSON", "")).toBe("geojson");
    expect(detectRoomFormat("hall.svg", "")).toBe("svg");
    expect(detectRoomFormat("hall.csv", "")).toBe("csv");
    expect(detectRoomFormat("", '  {"type":"Polygon"}')).toBe("geojson");
    expect(detectRoomFormat("", "<svg></svg>")).toBe("svg");
    expect(detectRoomFormat("", "0,0\n1,0")).toBe("csv");
    expect(problems(importRoomFile("plan.dwg", "\u0000\u0001"))[0].message).toMatch(/\.geojson, \.svg or \.csv/);
  });
});

describe("GeoJSON", () => {
  it("reads a Feature with a closed outline and an obstacle; drops the closing points", () => {
    const text = JSON.stringify(roomToFeature({ name: "Print Room", room: PRINT_ROOM }), null, 2);
    const result = ok(importRoomFile("print-room.geojson", text));
    expect(result.room).toEqual(PRINT_ROOM);
    expect(result.name).toBe("Print Room");
    expect(validateRoom(result.room)).toEqual([]);
  });

  it("reads a bare Polygon (RFC 7946, 3.1.6) without a name", () => {
    const result = ok(roomFromGeoJsonText(JSON.stringify({ type: "Polygon", coordinates: [[[0, 0], [4, 0], [4, 3], [0, 0]]] })));
    expect(result.room).toEqual({ outline: [[0, 0], [4, 0], [4, 3]], obstacles: [] });
    expect(result.name).toBeUndefined();
  });

  it("names the line of a JSON syntax error", () => {
    const text = '{\n  "type": "Polygon",\n  "coordinates": [[[0, 0], [4, 0],, [4, 3]]]\n}';
    const [problem] = problems(roomFromGeoJsonText(text));
    expect(problem.line).toBe(3);
    expect(problem.message).toMatch(/^line 3: the file is not valid JSON/);
  });

  it("refuses a LineString, and several rooms in one file", () => {
    expect(problems(roomFromGeoJsonText('{"type":"LineString","coordinates":[[0,0],[1,1]]}'))[0].message).toMatch(/LineString is not a room/);
    const two = { type: "MultiPolygon", coordinates: [[[[0, 0], [1, 0], [1, 1]]], [[[5, 5], [6, 5], [6, 6]]]] };
    expect(problems(roomFromGeoJsonText(JSON.stringify(two)))[0].message).toMatch(/2 polygons; upload one room at a time/);
  });
});

describe("SVG", () => {
  // y is negated: SVG's y axis points down (SVG 1.1, 7.3 "the initial coordinate system"), the room's up.
  const flip = (room: Room): Room => ({
    outline: room.outline.map(([x, y]) => [x, y === 0 ? 0 : -y]),
    obstacles: room.obstacles.map((ring) => ring.map(([x, y]) => [x, y === 0 ? 0 : -y])),
  });

  it("reads one <path> whose first sub-path is the outline and the next an obstacle", () => {
    const svg = `<?xml version="1.0"?>
<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 12 9">
  <path d="M0 0 H12 V9 H0 Z M4 3 L4 5 L8 5 L8 3 Z" fill="none"/>
</svg>`;
    const result = ok(importRoomFile("print-room.svg", svg));
    expect(result.room).toEqual(flip(PRINT_ROOM));
    expect(validateRoom(result.room)).toEqual([]);
  });

  it("reads relative commands and implicit linetos after a moveto", () => {
    // m 0 0 12 0 = moveto (0,0) then lineto (12,0): SVG 1.1, 8.3.2.
    expect(ringsFromPathData("m0,0 12,0 v9 h-12 z")).toEqual([[[0, 0], [12, 0], [12, -9], [0, -9]]]);
    // A closing point repeated before Z is one corner, and packed numbers ("4-3") split at the sign.
    expect(ringsFromPathData("M0 0L4-3L8 0L0 0Z")).toEqual([[[0, 0], [4, 3], [8, 0]]]);
  });

  it("reads <polygon> elements in document order: the first is the outline", () => {
    const svg = `<svg xmlns="http://www.w3.org/2000/svg">
  <polygon points="0,0 12,0 12,9 0,9"/>
  <polygon points="4,3 4,5 8,5 8,3" />
</svg>`;
    expect(ok(roomFromSvg(svg)).room).toEqual(flip(PRINT_ROOM));
  });

  it("refuses curves with the line they are on", () => {
    const svg = `<svg xmlns="http://www.w3.org/2000/svg">
  <polygon points="0,0 12,0 12,9 0,9"/>
  <path d="M4 3 C4 5 8 5 8 3 Z"/>
</svg>`;
    const [problem] = problems(roomFromSvg(svg));
    expect(problem.line).toBe(3);
    expect(problem.message).toMatch(/^line 3: path command C \(a curve\) is not supported/);
  });

  it("refuses odd point lists, transforms and a drawing with no ring", () => {
    expect(problems(roomFromSvg('<svg>\n<polygon points="0,0 12,0 12"/></svg>'))[0].message).toMatch(/^line 2: .*5 numbers; they must come in x,y pairs/);
    expect(problems(roomFromSvg('<svg><path transform="scale(2)" d="M0 0 H1 V1 Z"/></svg>'))[0].message).toMatch(/transform/);
    expect(problems(roomFromSvg("<svg><text>hall</text></svg>"))[0].message).toMatch(/no <polygon> or <path>/);
    expect(ringsFromPathData("L1 1")).toMatch(/must start with M/);
  });
});

describe("CSV", () => {
  it("reads ring,x,y rows with a header and comments", () => {
    const csv = "# Print Room\nring,x,y\n0,0,0\n0,12,0\n0,12,9\n0,0,9\n1,4,3\n1,4,5\n1,8,5\n1,8,3\n";
    const result = ok(importRoomFile("print-room.csv", csv));
    expect(result.room).toEqual(PRINT_ROOM);
  });

  it("reads x,y rows as a lone outline, with semicolons and CRLF", () => {
    expect(ok(roomFromCsv("0;0\r\n4;0\r\n4;3\r\n")).room).toEqual({ outline: [[0, 0], [4, 0], [4, 3]], obstacles: [] });
  });

  it('says "row 7: y is not a number" and names every bad row', () => {
    const csv = "ring,x,y\n0,0,0\n0,12,0\n0,12,9\n0,0,9\n1,4,3\n1,4,abc\n1,8,\n";
    const found = problems(roomFromCsv(csv));
    expect(found.map((p) => p.message)).toEqual(['row 7: y is not a number ("abc")', "row 8: y is not a number (empty)"]);
    expect(found.map((p) => p.line)).toEqual([7, 8]);
  });

  it("refuses rows of the wrong width, fractional rings, a missing outline and gaps in ring numbers", () => {
    expect(problems(roomFromCsv("0,0,0\n0,1,0\n0,1\n"))[0].message).toBe("row 3: expected 3 values (ring,x,y), found 2");
    expect(problems(roomFromCsv("0.5,0,0\n"))[0].message).toMatch(/^row 1: ring must be a whole number/);
    expect(problems(roomFromCsv("1,0,0\n1,1,0\n1,1,1\n"))[0].message).toMatch(/no row has ring 0/);
    expect(problems(roomFromCsv("0,0,0\n0,9,0\n0,9,9\n2,1,1\n2,2,1\n2,2,2\n"))[0].message).toMatch(/ring 1 is missing but ring 2 is there/);
    expect(problems(roomFromCsv("\n# nothing\n"))[0].message).toMatch(/no vertex rows/);
  });

  it("leaves wall problems to validateRoom, which reports them at their place", () => {
    // A bow tie: the file reads fine, the room does not validate (walls 1-2 and 3-4 cross at (2, 2)).
    const result = ok(roomFromCsv("0,0\n4,4\n4,0\n0,4\n"));
    const [problem] = validateRoom(result.room);
    expect(problem.code).toBe("self-intersection");
    expect(problem.at).toEqual([2, 2]);
  });
});
