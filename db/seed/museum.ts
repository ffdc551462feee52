// The demo museum: an invented building in Berlin's time zone with three floors, thirteen rooms
// in metres (rectilinear halls, an L-shaped gallery, a U-shaped hall, a Z-shaped corridor, a
// non-orthogonal annex and lab), pillars, vitrines, plinths and partitions as obstacles, one
// current temporary exhibition, and twenty-five guards. All names are invented.
// Outlines run counter-clockwise, obstacles clockwise; no ring repeats its closing point.
import type { OpeningHours, RiskLevel } from "../schema";
import type { Point, Ring } from "../../lib/geometry/types";

export const SITE = {
  name: "Brackwater Museum of Design",
  time_zone: "Europe/Berlin",
  hourly_rate: 22,
  opening_hours: {
    weekly: {
      mon: null,
      tue: ["10:00", "18:00"],
      wed: ["10:00", "18:00"],
      thu: ["10:00", "21:00"],
      fri: ["10:00", "18:00"],
      sat: ["10:00", "18:00"],
      sun: ["11:00", "18:00"],
    },
    dates: {
      // Museum night: open late.
      "2026-12-05": ["10:00", "23:00"],
      "2026-12-24": null,
      "2026-12-25": null,
      "2026-12-31": ["10:00", "15:00"],
      "2027-01-01": null,
    },
  } satisfies OpeningHours as OpeningHours,
};

/** An axis-aligned room outline, counter-clockwise. */
function hall(x0: number, y0: number, x1: number, y1: number): Ring {
  return [[x0, y0], [x1, y0], [x1, y1], [x0, y1]];
}

/** An axis-aligned obstacle (vitrine, plinth, pillar, partition), clockwise. */
function block(x0: number, y0: number, x1: number, y1: number): Ring {
  return [[x0, y0], [x0, y1], [x1, y1], [x1, y0]];
}

/** A round column or vitrine as a regular octagon, clockwise, coordinates to the millimetre. */
function column(cx: number, cy: number, radius: number): Ring {
  const ring: Point[] = [];
  for (let k = 0; k < 8; k++) {
    const angle = (-k * Math.PI) / 4 + Math.PI / 8;
    ring.push([Math.round((cx + radius * Math.cos(angle)) * 1000) / 1000, Math.round((cy + radius * Math.sin(angle)) * 1000) / 1000]);
  }
  return ring;
}

export interface SeedRoom {
  name: string;
  outline: Ring;
  obstacles: Ring[];
}

export interface SeedFloor {
  name: string;
  level: number;
  rooms: SeedRoom[];
}

export const FLOORS: SeedFloor[] = [
  {
    name: "Lower level",
    level: -1,
    rooms: [
      {
        name: "Study Collection",
        outline: hall(0, 0, 20, 12),
        // Three rows of open shelving.
        obstacles: [block(3, 2.5, 17, 3.2), block(3, 5.5, 17, 6.2), block(3, 8.5, 17, 9.2)],
      },
      {
        name: "Design Lab",
        outline: [[0, 0], [12, 0], [15, 6], [8, 11], [-1, 7]],
        // A workbench set at an angle.
        obstacles: [[[4, 3], [4.5, 5], [8.5, 4], [8, 2]]],
      },
    ],
  },
  {
    name: "Ground floor",
    level: 0,
    rooms: [
      {
        name: "Entrance Hall",
        outline: hall(0, 0, 24, 14),
        obstacles: [
          block(6, 4, 6.8, 4.8),
          block(6, 9.2, 6.8, 10),
          block(17.2, 4, 18, 4.8),
          block(17.2, 9.2, 18, 10),
          // Ticket desk.
          block(10.5, 1.5, 13.5, 2.4),
        ],
      },
      {
        name: "Textile Gallery",
        outline: hall(0, 0, 18, 12),
        obstacles: [block(3, 3, 7, 4.2), block(11, 3, 15, 4.2), block(7, 7.5, 11, 8.7)],
      },
      {
        name: "Furniture Gallery",
        // L-shaped: a long hall with a wing to the north.
        outline: [[0, 0], [20, 0], [20, 8], [9, 8], [9, 18], [0, 18]],
        obstacles: [block(3, 3, 6, 5), block(13, 3, 16, 5), block(3, 11, 6, 14)],
      },
      {
        name: "Ceramics Hall",
        outline: hall(0, 0, 30, 10),
        // A row of round columns carrying the floor above.
        obstacles: [column(5, 5, 0.4), column(10, 5, 0.4), column(15, 5, 0.4), column(20, 5, 0.4), column(25, 5, 0.4)],
      },
      {
        name: "Garden Annex",
        // The irregular glass annex: no wall meets another at a right angle.
        outline: [[0, 0], [14, -2], [19, 5], [15.5, 7], [16, 13], [7, 15], [-2, 9]],
        obstacles: [
          column(6, 6, 1.2),
          // A sculpture plinth turned 45 degrees.
          [[10, 9], [9, 10], [10, 11], [11, 10]],
        ],
      },
    ],
  },
  {
    name: "First floor",
    level: 1,
    rooms: [
      {
        name: "Glass Gallery",
        outline: hall(0, 0, 16, 16),
        obstacles: [block(4, 4, 7, 5), block(9, 4, 12, 5), block(4, 11, 7, 12), block(9, 11, 12, 12), column(8, 8, 1)],
      },
      {
        name: "Jewellery Room",
        outline: hall(0, 0, 10, 8),
        obstacles: [block(2, 2, 4, 3), block(6, 5, 8, 6)],
      },
      {
        name: "Poster Corridor",
        // Z-shaped corridor, four metres wide, with one bench.
        outline: [[0, 0], [18, 0], [18, 10], [30, 10], [30, 14], [14, 14], [14, 4], [0, 4]],
        obstacles: [block(15.2, 6, 16.8, 8)],
      },
      {
        name: "Exhibition Hall East",
        outline: hall(0, 0, 22, 15),
        // Temporary partition walls and a plinth for the current exhibition.
        obstacles: [block(6, 3, 6.2, 11), block(12, 4, 12.2, 12), block(16, 8, 18, 10)],
      },
      {
        name: "Exhibition Hall West",
        // U-shaped around a stair core.
        outline: [[0, 0], [20, 0], [20, 14], [14, 14], [14, 5], [6, 5], [6, 14], [0, 14]],
        obstacles: [block(2, 8, 4, 10), block(16, 8, 18, 10), block(9, 1.5, 11, 3)],
      },
      {
        name: "Print Room",
        outline: hall(0, 0, 12, 9),
        obstacles: [block(4, 3, 8, 5)],
      },
    ],
  },
];

export interface SeedExhibitionRoom {
  room: string;
  risk_level: RiskLevel;
  sight_range: number | null;
  double_cover: boolean;
}

const DAY_MS = 86_400_000;

/**
 * The demo exhibition's dates around the day the museum is seeded: it opened on the Monday seven
 * weeks before and runs to the Sunday twenty-six weeks after, so a freshly seeded demo always has a
 * current exhibition with months ahead to plan and roster (fixed dates would run out).
 */
export function exhibitionDates(seededOn: Date = new Date()): { starts_on: string; ends_on: string } {
  const day = Date.UTC(seededOn.getUTCFullYear(), seededOn.getUTCMonth(), seededOn.getUTCDate());
  const monday = day - ((new Date(day).getUTCDay() + 6) % 7) * DAY_MS;
  const iso = (ms: number) => new Date(ms).toISOString().slice(0, 10);
  return { starts_on: iso(monday - 7 * 7 * DAY_MS), ends_on: iso(monday + (26 * 7 + 6) * DAY_MS) };
}

export const EXHIBITION = {
  name: "Woven Futures: Textiles and the Machine",
  ...exhibitionDates(),
  rooms: [
    { room: "Exhibition Hall East", risk_level: "high", sight_range: 15, double_cover: false },
    { room: "Exhibition Hall West", risk_level: "standard", sight_range: 12, double_cover: false },
    { room: "Textile Gallery", risk_level: "high", sight_range: null, double_cover: true },
    { room: "Poster Corridor", risk_level: "standard", sight_range: null, double_cover: false },
  ] satisfies SeedExhibitionRoom[] as SeedExhibitionRoom[],
};

export const SKILLS = ["high-value", "first-aid", "evening", "multilingual"] as const;

export interface SeedGuard {
  name: string;
  email: string;
  contract_hours: number;
  max_hours: number;
  skills: string[];
}

function guard(name: string, contract_hours: number, skills: string[], email?: string): SeedGuard {
  const address =
    email ??
    `${name
      .normalize("NFD")
      .replace(/[\u0300-\u036f]/g, "")
      .replace(/ø/g, "o")
      .replace(/ı/g, "i")
      .toLowerCase()
      .replace(/[^a-z]+/g, ".")}@example.org`;
  return { name, email: address, contract_hours, max_hours: 48, skills };
}

export const GUARDS: SeedGuard[] = [
  guard("Mara Lindqvist", 40, ["high-value", "first-aid"], "guard@example.org"),
  guard("Jonas Okafor", 40, ["evening", "multilingual"]),
  guard("Elif Aydın", 40, ["first-aid"]),
  guard("Tomasz Wierzbicki", 40, ["high-value", "evening"]),
  guard("Greta Holm", 40, ["multilingual"]),
  guard("Samuel Achterberg", 40, ["first-aid", "evening"]),
  guard("Nadia Benali", 40, ["high-value", "multilingual"]),
  guard("Lukas Brandt", 40, []),
  guard("Ines Carvalho", 40, ["evening"]),
  guard("Felix Hagedorn", 40, ["high-value"]),
  guard("Amira Haddad", 32, ["first-aid", "multilingual"]),
  guard("Oskar Reinholt", 32, ["evening"]),
  guard("Yuki Tanabe", 32, ["multilingual"]),
  guard("Paulina Nowak", 32, ["high-value", "first-aid"]),
  guard("Dario Russo", 32, []),
  guard("Hanna Vogt", 32, ["evening", "first-aid"]),
  guard("Kofi Mensah", 24, ["multilingual", "high-value"]),
  guard("Leonie Kraus", 24, ["first-aid"]),
  guard("Mateo Fernández", 24, ["evening"]),
  guard("Sofia Petrova", 24, ["high-value"]),
  guard("Bastian Ulrich", 24, []),
  guard("Clara Eichhorn", 20, ["evening"]),
  guard("Emre Kaya", 20, ["multilingual", "evening"]),
  guard("Lina Sørensen", 20, ["first-aid"]),
  guard("Ruben de Wit", 20, ["evening", "high-value"]),
];
