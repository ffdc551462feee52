// Rooms from the files curators bring: GeoJSON (read by ./geojson), SVG (one <polygon>, or a <path>
// of straight M/L/H/V/Z commands) and CSV of vertices. Pure: the browser's upload and the tests run
// the same code. A file that cannot be read gives problems with the line (or row) to look at; a room
// that reads but has bad walls is left to validateRoom, which shows problems on the drawing.
import type { Point, Ring, Room } from "./types";
import { roomsFromGeoJson } from "./geojson";

export type RoomFileFormat = "geojson" | "svg" | "csv";

/** Why a file gave no room: a sentence naming the line or row, e.g. "row 7: y is not a number". */
export interface ImportProblem {
  message: string;
  /** 1-based line of the file, when the problem sits on one line. */
  line?: number;
}

export type RoomImport =
  | { ok: true; format: RoomFileFormat; room: Room; name?: string }
  | { ok: false; format: RoomFileFormat | null; problems: ImportProblem[] };

/** The format a file name or its first characters say: .geojson/.json, .svg, .csv/.txt. */
export function detectRoomFormat(fileName: string, text: string): RoomFileFormat | null {
  const lower = fileName.toLowerCase();
  if (/\.(geo)?json$/.test(lower)) return "geojson";
  if (lower.endsWith(".svg")) return "svg";
  if (/\.(csv|txt)$/.test(lower)) return "csv";
  const start = text.trimStart();
  if (start.startsWith("{")) return "geojson";
  if (start.startsWith("<")) return "svg";
  if (/^[\w".+-]/.test(start)) return "csv";
  return null;
}

/** Reads a room file; `fileName` picks the format (see detectRoomFormat). */
export function importRoomFile(fileName: string, text: string): RoomImport {
  const format = detectRoomFormat(fileName, text);
  if (format === "geojson") return roomFromGeoJsonText(text);
  if (format === "svg") return roomFromSvg(text);
  if (format === "csv") return roomFromCsv(text);
  return {
    ok: false,
    format: null,
    problems: [{ message: `cannot tell the format of ${fileName || "the file"}: use a .geojson, .svg or .csv file` }],
  };
}

function failed(format: RoomFileFormat, problems: ImportProblem[]): RoomImport {
  return { ok: false, format, problems };
}

/** The 1-based line holding character `offset` of `text`. */
function lineAt(text: string, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset && i < text.length; i++) if (text.charCodeAt(i) === 10) line++;
  return line;
}

// ── GeoJSON ──────────────────────────────────────────────────────────────────────────────────────

/** One room from GeoJSON text: the file must hold exactly one polygon. */
export function roomFromGeoJsonText(text: string): RoomImport {
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    // V8 says "... in JSON at position 123" (or "(line 4 column 2)" in newer versions).
    const offset = jsonErrorOffset(text);
    const line = offset === null ? undefined : lineAt(text, offset);
    return failed("geojson", [
      { message: `${line ? `line ${line}: ` : ""}the file is not valid JSON (${reason.replace(/^JSON\.parse: /, "")})`, ...(line ? { line } : {}) },
    ]);
  }
  const parsed = roomsFromGeoJson(value, "the file");
  if (parsed.errors.length > 0) return failed("geojson", parsed.errors.map((e) => ({ message: e.message })));
  if (parsed.rooms.length === 0) return failed("geojson", [{ message: "the file holds no Polygon: draw the room as one Polygon" }]);
  if (parsed.rooms.length > 1) {
    return failed("geojson", [
      { message: `the file holds ${parsed.rooms.length} polygons; upload one room at a time (one Polygon: outline, then obstacles)` },
    ]);
  }
  const [named] = parsed.rooms;
  const name = named.name.startsWith("the file #") ? undefined : named.name;
  return { ok: true, format: "geojson", room: stripClosingPoints(named.room), ...(name ? { name } : {}) };
}

/**
 * Where JSON text first goes wrong, by a small recursive-descent reader (RFC 8259 grammar), since
 * JSON.parse's messages do not always say where. Null when no offending character is found.
 */
export function jsonErrorOffset(text: string): number | null {
  let i = 0;
  const space = () => {
    while (i < text.length && " \t\n\r".includes(text[i])) i++;
  };
  const fail = (): never => {
    throw i;
  };
  const value = (): void => {
    space();
    const c = text[i];
    if (c === "{") {
      i++;
      space();
      if (text[i] === "}") return void i++;
      for (;;) {
        space();
        if (text[i] !== '"') fail();
        string();
        space();
        if (text[i] !== ":") fail();
        i++;
        value();
        space();
        if (text[i] === ",") i++;
        else if (text[i] === "}") return void i++;
        else fail();
      }
    } else if (c === "[") {
      i++;
      space();
      if (text[i] === "]") return void i++;
      for (;;) {
        value();
        space();
        if (text[i] === ",") i++;
        else if (text[i] === "]") return void i++;
        else fail();
      }
    } else if (c === '"') string();
    else if (c !== undefined && /[-0-9]/.test(c)) {
      const match = /^-?(0|[1-9]\d*)(\.\d+)?([eE][-+]?\d+)?/.exec(text.slice(i));
      if (!match) fail();
      i += match![0].length;
    } else {
      for (const word of ["true", "false", "null"]) if (text.startsWith(word, i)) return void (i += word.length);
      fail();
    }
  };
  const string = () => {
    i++;
    while (i < text.length && text[i] !== '"') i += text[i] === "\\" ? 2 : 1;
    if (i >= text.length) fail();
    i++;
  };
  try {
    value();
    space();
    return i < text.length ? i : null;
  } catch (at) {
    return typeof at === "number" ? Math.min(at, text.length) : null;
  }
}

function stripClosingPoints(room: Room): Room {
  const strip = (ring: Ring): Ring => {
    const last = ring[ring.length - 1];
    return ring.length > 1 && last[0] === ring[0][0] && last[1] === ring[0][1] ? ring.slice(0, -1) : ring;
  };
  return { outline: strip(room.outline), obstacles: room.obstacles.map(strip) };
}

// ── SVG ──────────────────────────────────────────────────────────────────────────────────────────

/** Numbers in SVG attribute syntax: "1.5", "-2", ".5", "1e3", packed like "1-2" or "0.5.5". */
const SVG_NUMBER = /[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/g;

/**
 * Rings from an SVG drawing: every <polygon points> and every sub-path of every <path d> in
 * document order; the first ring is the outline, the others obstacles. SVG's y axis points down,
 * the room's up, so y is negated: the room looks as it did in the drawing program.
 */
export function roomFromSvg(text: string): RoomImport {
  const problems: ImportProblem[] = [];
  const rings: Ring[] = [];
  const element = /<(polygon|path|polyline|rect|circle|ellipse|line)\b([^>]*)>/gi;
  let sawSvg = /<svg\b/i.test(text);
  for (let match = element.exec(text); match; match = element.exec(text)) {
    const tag = match[1].toLowerCase();
    const attributes = match[2];
    const line = lineAt(text, match.index);
    if (/\btransform\s*=/.test(attributes)) {
      problems.push({ line, message: `line ${line}: the <${tag}> has a transform; apply transforms in the drawing program first (e.g. "flatten" or "ungroup")` });
      continue;
    }
    if (tag === "polygon") {
      const points = attribute(attributes, "points");
      if (points === null) {
        problems.push({ line, message: `line ${line}: the <polygon> has no points attribute` });
        continue;
      }
      const numbers = points.match(SVG_NUMBER)?.map(Number) ?? [];
      if (numbers.length % 2 !== 0) {
        problems.push({ line, message: `line ${line}: the <polygon> points hold ${numbers.length} numbers; they must come in x,y pairs` });
        continue;
      }
      const ring: Ring = [];
      for (let i = 0; i < numbers.length; i += 2) ring.push([numbers[i], flipY(numbers[i + 1])]);
      rings.push(ring);
    } else if (tag === "path") {
      const d = attribute(attributes, "d");
      if (d === null) {
        problems.push({ line, message: `line ${line}: the <path> has no d attribute` });
        continue;
      }
      const read = ringsFromPathData(d);
      if (typeof read === "string") problems.push({ line, message: `line ${line}: ${read}` });
      else rings.push(...read);
    } else if (tag === "rect") {
      // A rectangle is a common way to draw a plinth; read it as four corners.
      const [x, y, w, h] = ["x", "y", "width", "height"].map((name) => Number(attribute(attributes, name) ?? (name === "x" || name === "y" ? "0" : "NaN")));
      if (![x, y, w, h].every(Number.isFinite) || w <= 0 || h <= 0) {
        problems.push({ line, message: `line ${line}: the <rect> needs numeric x, y and positive width and height (in metres, no units)` });
        continue;
      }
      rings.push([[x, flipY(y)], [x + w, flipY(y)], [x + w, flipY(y + h)], [x, flipY(y + h)]]);
    } else {
      problems.push({ line, message: `line ${line}: a <${tag}> is not a room ring; draw walls as <polygon> or <path> with straight lines` });
    }
    sawSvg = true;
  }
  if (problems.length > 0) return failed("svg", problems);
  if (!sawSvg) return failed("svg", [{ message: "the file is not an SVG drawing (no <svg> element)" }]);
  if (rings.length === 0) return failed("svg", [{ message: "the drawing has no <polygon> or <path>: draw the outline as one, obstacles as further ones" }]);
  return { ok: true, format: "svg", room: { outline: rings[0], obstacles: rings.slice(1) } };
}

// -0 would print as "-0"; a room at y = 0 stays at 0.
const flipY = (y: number) => (y === 0 ? 0 : -y);

/** An attribute's value (single or double quotes), or null when absent. */
function attribute(attributes: string, name: string): string | null {
  const match = new RegExp(`(?:^|\\s)${name}\\s*=\\s*(?:"([^"]*)"|'([^']*)')`).exec(attributes);
  return match ? (match[1] ?? match[2]) : null;
}

/**
 * Sub-paths of SVG path data with straight commands only (M, L, H, V, Z, upper case absolute,
 * lower case relative); each sub-path is one ring. A string says what cannot be read.
 */
export function ringsFromPathData(d: string): Ring[] | string {
  const tokens = d.match(/[a-zA-Z]|[-+]?(?:\d+\.?\d*|\.\d+)(?:[eE][-+]?\d+)?/g) ?? [];
  const rings: Ring[] = [];
  let ring: Point[] | null = null;
  let x = 0;
  let y = 0;
  let startX = 0;
  let startY = 0;
  let command = "";
  let i = 0;
  const number = (): number | null => {
    const token = tokens[i];
    if (token === undefined || /[a-zA-Z]/.test(token)) return null;
    i++;
    return Number(token);
  };
  const close = () => {
    if (ring && ring.length > 0) {
      const last = ring[ring.length - 1];
      const first = ring[0];
      if (ring.length > 1 && last[0] === first[0] && last[1] === first[1]) ring.pop();
      rings.push(ring.map(([px, py]) => [px, flipY(py)]));
    }
    ring = null;
  };
  while (i < tokens.length) {
    const token = tokens[i];
    if (/[a-zA-Z]/.test(token)) {
      command = token;
      i++;
      if (!/[MLHVZmlhvz]/.test(command)) {
        const kind = /[CcSsQqTt]/.test(command) ? "a curve" : /[Aa]/.test(command) ? "an arc" : "unknown";
        return `path command ${command} (${kind}) is not supported: room walls are straight, so use M, L, H, V and Z (convert curves to line segments)`;
      }
      if (command === "Z" || command === "z") {
        close();
        x = startX;
        y = startY;
        continue;
      }
    } else if (command === "" || command === "Z" || command === "z") {
      return `path data must start with M (moveto), found "${token}"`;
    }
    const relative = command === command.toLowerCase();
    const upper = command.toUpperCase();
    if (upper === "M" || upper === "L") {
      const nx = number();
      const ny = number();
      if (nx === null || ny === null) return `the ${command} command needs an x,y pair`;
      x = relative ? x + nx : nx;
      y = relative ? y + ny : ny;
      if (upper === "M") {
        close();
        ring = [];
        startX = x;
        startY = y;
        // Further pairs after a moveto are linetos (SVG 1.1, 8.3.2).
        command = relative ? "l" : "L";
      }
    } else if (upper === "H") {
      const nx = number();
      if (nx === null) return `the ${command} command needs an x value`;
      x = relative ? x + nx : nx;
    } else {
      const ny = number();
      if (ny === null) return `the ${command} command needs a y value`;
      y = relative ? y + ny : ny;
    }
    if (!ring) return `path data must start with M (moveto)`;
    const current: Point[] = ring;
    const last = current[current.length - 1];
    if (!last || last[0] !== x || last[1] !== y) current.push([x, y]);
  }
  close();
  return rings;
}

// ── CSV ──────────────────────────────────────────────────────────────────────────────────────────

/**
 * Vertices as CSV: `ring,x,y` rows (ring 0 is the outline, 1, 2, ... obstacles) or `x,y` rows for
 * a lone outline. A header row naming the columns is allowed; blank lines and lines starting with
 * # are skipped; commas, semicolons or tabs separate the values. Rows are numbered as the file's
 * lines, counted from 1, so "row 7" is the seventh line in a text editor.
 */
export function roomFromCsv(text: string): RoomImport {
  const lines = text.split(/\r\n|\n|\r/);
  const problems: ImportProblem[] = [];
  const rings = new Map<number, Point[]>();
  let columns: 2 | 3 | null = null;
  let columnNames = ["x", "y"];
  let sawHeader = false;
  for (let index = 0; index < lines.length; index++) {
    const row = index + 1;
    const trimmed = lines[index].trim();
    if (trimmed === "" || trimmed.startsWith("#")) continue;
    const cells = trimmed.split(/[,;\t]/).map((cell) => cell.trim().replace(/^"(.*)"$/, "$1"));
    if (columns === null && !sawHeader && cells.some((cell) => cell !== "" && !Number.isFinite(Number(cell)))) {
      const names = cells.map((cell) => cell.toLowerCase());
      if ((names.length === 2 && names[0] === "x" && names[1] === "y") || (names.length === 3 && names[1] === "x" && names[2] === "y")) {
        sawHeader = true;
        columns = names.length as 2 | 3;
        columnNames = names.length === 3 ? ["ring", "x", "y"] : ["x", "y"];
        continue;
      }
    }
    if (columns === null) {
      if (cells.length !== 2 && cells.length !== 3) {
        problems.push({ line: row, message: `row ${row}: expected 2 values (x,y) or 3 (ring,x,y), found ${cells.length}` });
        break;
      }
      columns = cells.length as 2 | 3;
      columnNames = columns === 3 ? ["ring", "x", "y"] : ["x", "y"];
    }
    if (cells.length !== columns) {
      problems.push({ line: row, message: `row ${row}: expected ${columns} values (${columnNames.join(",")}), found ${cells.length}` });
      continue;
    }
    const values = cells.map(Number);
    let bad = false;
    cells.forEach((cell, k) => {
      if (cell === "" || !Number.isFinite(values[k])) {
        problems.push({ line: row, message: `row ${row}: ${columnNames[k]} is not a number (${cell === "" ? "empty" : JSON.stringify(cell)})` });
        bad = true;
      }
    });
    if (bad) continue;
    const ring = columns === 3 ? values[0] : 0;
    if (!Number.isInteger(ring) || ring < 0) {
      problems.push({ line: row, message: `row ${row}: ring must be a whole number from 0 (0 is the outline, 1, 2, ... obstacles), found ${cells[0]}` });
      continue;
    }
    const point: Point = columns === 3 ? [values[1], values[2]] : [values[0], values[1]];
    const points = rings.get(ring);
    if (points) points.push(point);
    else rings.set(ring, [point]);
  }
  if (problems.length > 0) return failed("csv", problems);
  if (rings.size === 0) return failed("csv", [{ message: "the file has no vertex rows: one `x,y` (or `ring,x,y`) row per corner" }]);
  const outline = rings.get(0);
  if (!outline) return failed("csv", [{ message: "no row has ring 0: ring 0 is the outline, 1, 2, ... are obstacles" }]);
  const numbers = [...rings.keys()].sort((a, b) => a - b);
  const missing = numbers.findIndex((n, k) => n !== k);
  if (missing !== -1) {
    return failed("csv", [{ message: `ring ${missing} is missing but ring ${numbers[missing]} is there: number obstacles 1, 2, 3 ... without gaps` }]);
  }
  return { ok: true, format: "csv", room: stripClosingPoints({ outline, obstacles: numbers.slice(1).map((n) => rings.get(n)!) }) };
}
