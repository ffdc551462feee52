// The role matrix of the API: which permission each route handler method needs (lib/auth/roles.ts
// says which role holds it), or "public" for the few a person reaches without signing in. Every
// route file's every method has an entry; tests/integration/route-matrix.test.ts walks the routes
// found on disk, signed out and as each role, and fails on a missing entry or a handler that lets
// in a role the table keeps out (or keeps out one it lets in).
import type { Permission } from "./roles";

export type RouteAccess = Permission | "public";

export const ROUTE_MATRIX: Readonly<Record<string, RouteAccess>> = {
  // Sign-in, the set-password link, health and the personal calendar feed (its token is the key).
  "GET /api/auth/[...nextauth]": "public",
  "POST /api/auth/[...nextauth]": "public",
  "POST /api/auth/set-password": "public",
  "GET /api/health": "public",
  "GET /api/calendar/[token]": "public",
  "POST /api/calendar/reset": "shifts:own",
  "GET /api/me/shifts": "shifts:own",
  "GET /api/time-off": "shifts:own",
  "POST /api/time-off": "shifts:own",
  "PATCH /api/time-off/[id]": "time-off:decide",

  "GET /api/sites": "galleries:view",
  "POST /api/sites": "rooms:edit",
  "PUT /api/sites/order": "rooms:edit",
  "PATCH /api/sites/[siteId]": "rooms:edit",
  "DELETE /api/sites/[siteId]": "rooms:edit",
  "PUT /api/sites/[siteId]/floor-order": "rooms:edit",
  "GET /api/sites/[siteId]/settings": "settings:manage",
  "PUT /api/sites/[siteId]/settings": "settings:manage",
  "POST /api/floors": "rooms:edit",
  "PATCH /api/floors/[floorId]": "rooms:edit",
  "DELETE /api/floors/[floorId]": "rooms:edit",
  "PUT /api/floors/[floorId]/room-order": "rooms:edit",
  "POST /api/floors/[floorId]/rooms-import": "rooms:edit",
  "GET /api/floors/[floorId]/map": "galleries:view",
  "POST /api/rooms": "rooms:edit",
  "GET /api/rooms/[roomId]": "galleries:view",
  "PUT /api/rooms/[roomId]": "rooms:edit",
  "PATCH /api/rooms/[roomId]": "rooms:edit",
  "DELETE /api/rooms/[roomId]": "rooms:edit",
  "GET /api/rooms/[roomId]/versions": "galleries:view",
  "GET /api/rooms/[roomId]/versions/[version]": "galleries:view",
  "POST /api/rooms/[roomId]/versions/[version]/restore": "rooms:edit",
  "GET /api/rooms/[roomId]/post-plans": "galleries:view",
  "POST /api/rooms/[roomId]/post-plans": "plans:approve",
  "POST /api/post-plans/preview": "galleries:view",
  "GET /api/post-plans/[planId]": "galleries:view",
  "POST /api/post-plans/[planId]/approve": "plans:approve",

  "POST /api/exhibitions": "exhibitions:edit",
  "GET /api/exhibitions/[id]": "exhibitions:view",
  "PUT /api/exhibitions/[id]": "exhibitions:edit",

  "GET /api/rosters": "staffing:view",
  "POST /api/rosters/build": "rosters:publish",
  "GET /api/rosters/[id]": "staffing:view",
  "GET /api/rosters/[id]/csv": "staffing:view",
  "GET /api/rosters/[id]/review": "rosters:publish",
  "GET /api/rosters/[id]/reassign": "rosters:publish",
  "POST /api/rosters/[id]/reassign": "rosters:publish",
  "GET /api/rosters/[id]/adjust": "rosters:publish",
  "POST /api/rosters/[id]/adjust": "rosters:publish",
  "POST /api/rosters/[id]/publish": "rosters:publish",
  "GET /api/jobs/[id]": "staffing:view",
  "POST /api/guards": "people:edit",
  "POST /api/guards/import": "people:edit",
  "PUT /api/guards/[id]": "people:edit",

  "GET /api/users": "users:manage",
  "POST /api/users": "users:manage",
  "PATCH /api/users/[id]": "users:manage",
  "PUT /api/users/[id]/access": "users:manage",
  "POST /api/users/[id]/reset": "users:manage",
  "GET /api/mail": "mail:read",
  "GET /api/mail/[id]": "mail:read",
  "POST /api/mail/[id]/resend": "mail:resend",
  "GET /api/audit": "audit:read",
};
