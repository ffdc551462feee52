// One drawing per floor for the morning briefing: every room laid out at one scale (rooms keep
// their own frames, so they are set side by side in reading order, not as the building stands),
// each with its approved posts numbered, what each post sees, and any floor no post sees. Pure:
// the page, the SVG export and the tests share it.
import { triangulate } from "../geometry/triangulate";
import { createSightlines } from "../geometry/visibility";
import { certifyCoverage, type CoverageCertificate } from "../geometry/coverage";
import type { Point, Ring } from "../geometry/types";

export interface MapRoomInput {
  id: number;
  name: string;
  outline: Ring;
  obstacles: Ring[];
  /** Approved posts for the current exhibition, or null when none is approved. */
  posts: Point[] | null;
  stale: boolean;
  /** Posts to mark as the reader's own (a guard's map), by their number in the room (1-based). */
  own?: number[];
}

export interface MapRoom extends MapRoomInput {
  /** Where the room's own (0, 0) sits on the sheet, metres. */
  offset: Point;
  bounds: { minX: number; minY: number; maxX: number; maxY: number };
  regions: Ring[];
  uncovered: CoverageCertificate["uncovered"];
  covered: number | null;
}

export interface FloorMap {
  rooms: MapRoom[];
  width: number;
  height: number;
}

const GAP = 4;

function boundsOf(ring: Ring) {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
  for (const [x, y] of ring) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  return { minX, minY, maxX, maxY };
}

/** Lays the rooms out in rows no wider than `rowWidth` metres and computes sight and cover. */
export function floorMap(rooms: MapRoomInput[], rowWidth = 90): FloorMap {
  const placed: MapRoom[] = [];
  let x = 0, y = 0, rowHeight = 0, width = 0;
  for (const room of rooms) {
    const b = boundsOf(room.outline);
    const w = b.maxX - b.minX, h = b.maxY - b.minY;
    if (x > 0 && x + w > rowWidth) {
      x = 0;
      y += rowHeight + GAP + 3;
      rowHeight = 0;
    }
    let regions: Ring[] = [];
    let uncovered: CoverageCertificate["uncovered"] = [];
    let covered: number | null = null;
    if (room.posts && room.posts.length > 0) {
      try {
        const sightlines = createSightlines(room, triangulate(room));
        regions = room.posts.flatMap((post) => {
          const answer = sightlines.regionOf(post);
          return answer.ok ? [answer.region] : [];
        });
        const certificate = certifyCoverage(room, regions.map((r) => [[r]]));
        uncovered = certificate.uncovered;
        covered = certificate.covered;
      } catch {
        covered = null;
      }
    }
    placed.push({ ...room, offset: [x - b.minX, y - b.minY + 3], bounds: b, regions, uncovered, covered });
    x += w + GAP;
    rowHeight = Math.max(rowHeight, h);
    width = Math.max(width, x - GAP);
  }
  // At least as wide as the title and legend need (about 70 m at their type size).
  return { rooms: placed, width: Math.max(width, 72), height: y + rowHeight + 3 };
}

const esc = (text: string) => text.replace(/&/g, "&amp;").replace(/</g, "&lt;").replace(/>/g, "&gt;").replace(/"/g, "&quot;");
const num = (v: number) => (Math.round(v * 100) / 100).toString();

export interface MapMeta {
  title: string;
  /** Already formatted in the site's format. */
  date: string;
  exhibition: string | null;
}

/**
 * The map as a standalone SVG document in metres (y up, as the rooms are drawn), with a legend,
 * the date, the exhibition and a scale bar. Colours are the product's own tokens.
 */
export function floorMapSvg(map: FloorMap, meta: MapMeta): string {
  const margin = 2;
  const legend = 12;
  const W = map.width + 2 * margin;
  const H = map.height + 2 * margin + legend;
  const flipY = (v: number) => map.height - v;
  const pts = (ring: Ring, [ox, oy]: Point) => ring.map(([px, py]) => `${num(px + ox)},${num(flipY(py + oy))}`).join(" ");
  const parts: string[] = [];
  parts.push(`<svg xmlns="http://www.w3.org/2000/svg" viewBox="${-margin} ${-margin - legend} ${num(W)} ${num(H)}" width="${num(W * 10)}mm" height="${num(H * 10)}mm" font-family="sans-serif" role="img" aria-label="${esc(meta.title)}">`);
  parts.push(`<title>${esc(meta.title)}</title>`);
  parts.push(`<rect x="${-margin}" y="${-margin - legend}" width="${num(W)}" height="${num(H)}" fill="#ffffff"/>`);
  parts.push(`<text x="0" y="${-legend + 1.5}" font-size="2.2" font-weight="bold" fill="#123b3a">${esc(meta.title)}</text>`);
  parts.push(`<text x="0" y="${-legend + 4.5}" font-size="1.4" fill="#44403c">${esc(meta.date)}${meta.exhibition ? ` · ${esc(meta.exhibition)}` : " · no current exhibition"}</text>`);
  // Legend: post, seen floor, unseen floor, and a 5 m scale bar.
  parts.push(`<g font-size="1.2" fill="#44403c" transform="translate(0 ${-legend + 7})">`);
  parts.push(`<circle cx="0.8" cy="0" r="0.7" fill="#123b3a"/><text x="2" y="0.4">post (numbered in its room)</text>`);
  parts.push(`<rect x="22" y="-0.7" width="1.4" height="1.4" fill="#c8a24a" fill-opacity="0.35"/><text x="24" y="0.4">seen by a post</text>`);
  parts.push(`<rect x="38" y="-0.7" width="1.4" height="1.4" fill="#b03a2e" fill-opacity="0.5"/><text x="40" y="0.4">seen by no post</text>`);
  parts.push(`<g transform="translate(55 0)"><rect x="0" y="-0.3" width="5" height="0.6" fill="#123b3a"/><text x="0" y="2">0</text><text x="4.2" y="2">5 m</text></g>`);
  parts.push(`</g>`);
  for (const room of map.rooms) {
    const o = room.offset;
    const cx = (room.bounds.minX + room.bounds.maxX) / 2 + o[0];
    parts.push(`<g data-room="${room.id}">`);
    parts.push(`<polygon points="${pts(room.outline, o)}" fill="#faf8f5" stroke="#123b3a" stroke-width="0.2"/>`);
    for (const region of room.regions) parts.push(`<polygon points="${pts(region, o)}" fill="#c8a24a" fill-opacity="0.18" stroke="none"/>`);
    for (const part of room.uncovered) for (const ring of part) parts.push(`<polygon points="${pts(ring, o)}" fill="#b03a2e" fill-opacity="0.5" stroke="none"/>`);
    for (const obstacle of room.obstacles) parts.push(`<polygon points="${pts(obstacle, o)}" fill="#d6d3d1" stroke="#44403c" stroke-width="0.12"/>`);
    (room.posts ?? []).forEach(([px, py], i) => {
      const own = room.own?.includes(i + 1);
      const x = num(px + o[0]), y = num(flipY(py + o[1]));
      parts.push(`<g data-post="${i + 1}"${own ? ' data-own="true"' : ""}><circle cx="${x}" cy="${y}" r="${own ? 0.9 : 0.7}" fill="${own ? "#c8a24a" : "#123b3a"}" stroke="#123b3a" stroke-width="0.15"/><text x="${x}" y="${num(flipY(py + o[1]) + 0.45)}" font-size="1.1" text-anchor="middle" fill="${own ? "#123b3a" : "#ffffff"}" font-weight="bold">${i + 1}</text></g>`);
    });
    const label = `${room.name}${room.posts ? ` · ${room.posts.length} post${room.posts.length === 1 ? "" : "s"}` : " · no approved plan"}${room.stale ? " · approval stale" : ""}`;
    parts.push(`<text x="${num(cx)}" y="${num(flipY(room.bounds.maxY + o[1]) - 0.8)}" font-size="1.3" text-anchor="middle" fill="${room.stale ? "#8f2c22" : "#123b3a"}">${esc(label)}</text>`);
    parts.push(`</g>`);
  }
  parts.push(`</svg>`);
  return parts.join("\n");
}
