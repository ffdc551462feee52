// The floor map of one floor as the page and the SVG export serve it: the floor's rooms with the
// approved posts of the exhibition running today at the site, drawn by lib/galleries/floor-map.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import { floorById } from "@/db/queries/galleries";
import { floorRoomsWithApprovedPosts } from "@/db/queries/post-plans";
import { siteById } from "@/db/queries/rosters";
import { formatDate, siteDate, siteFormat } from "@/lib/format";
import { floorMap, floorMapSvg, type FloorMap } from "./floor-map";

export interface FloorMapSheet {
  floor: { id: number; name: string; siteId: number };
  title: string;
  exhibition: string | null;
  map: FloorMap;
  /** The standalone file (sized in millimetres, for export and print). */
  svg: string;
  /** The same drawing sized to the page's width. */
  inlineSvg: string;
  /** A file name without extension, e.g. "brackwater-museum-ground-floor". */
  fileName: string;
}

/** Null when there is no such floor. `own` marks a guard's posts: post ids such as "R12-P2". */
export async function floorMapSheet(db: Kysely<Database>, floorId: number, own: string[] = []): Promise<FloorMapSheet | null> {
  const floor = await floorById(db, floorId);
  if (!floor) return null;
  const site = await siteById(db, floor.site_id);
  const format = siteFormat(site);
  const today = siteDate(format, new Date());
  const rooms = await floorRoomsWithApprovedPosts(db, floorId, today);
  const map = floorMap(
    rooms.map((r) => ({
      id: r.id,
      name: r.name,
      outline: r.outline,
      obstacles: r.obstacles ?? [],
      posts: r.posts,
      stale: r.stale,
      own: own.filter((id) => id.startsWith(`R${r.id}-P`)).map((id) => Number(id.slice(`R${r.id}-P`.length))),
    })),
  );
  const exhibition = rooms.find((r) => r.exhibition)?.exhibition ?? null;
  const title = `${site?.name ?? "Site"} · ${floor.name}`;
  const svg = floorMapSvg(map, { title, date: formatDate(format, today), exhibition });
  return {
    floor: { id: floor.id, name: floor.name, siteId: floor.site_id },
    title,
    exhibition,
    map,
    svg,
    inlineSvg: svg.replace(/ width="[^"]*mm" height="[^"]*mm"/, ' width="100%"'),
    fileName: title.replace(/[^\w\- ]+/g, "").replace(/\s+/g, "-").toLowerCase() || "floor",
  };
}
