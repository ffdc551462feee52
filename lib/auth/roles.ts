// The one place that knows which role may do what. Proxy, pages, route handlers and the
// navigation all ask here; nothing else compares role names.
import { ROLES, type Role } from "@/db/schema";

export type { Role };
// The role names themselves live with the users table (db/schema.ts), which checks them too.
export const ROLE_NAMES = ROLES;

export const PERMISSIONS = [
  "galleries:view",
  "rooms:edit",
  "exhibitions:view",
  "exhibitions:edit",
  "plans:approve",
  "staffing:view",
  "rosters:publish",
  "people:view",
  "people:edit",
  "shifts:own",
  "users:manage",
  "settings:manage",
  "mail:read",
  "mail:resend",
  "audit:read",
  "time-off:decide",
] as const;
export type Permission = (typeof PERMISSIONS)[number];

// README.md's table of people: curators shape rooms, operations plan and staff,
// guards see their own shifts, admins run users, sites and mail.
const GRANTS: Record<Role, readonly Permission[]> = {
  curator: ["galleries:view", "rooms:edit"],
  operations: [
    "galleries:view",
    "exhibitions:view",
    "exhibitions:edit",
    "plans:approve",
    "staffing:view",
    "rosters:publish",
    "people:view",
    "people:edit",
    "time-off:decide",
  ],
  guard: ["shifts:own"],
  // Admins also run the building's sites, floors and rooms alongside curators.
  admin: ["users:manage", "settings:manage", "mail:read", "mail:resend", "audit:read", "galleries:view", "rooms:edit"],
};

export function isRole(value: unknown): value is Role {
  return typeof value === "string" && (ROLE_NAMES as readonly string[]).includes(value);
}

export function can(role: Role | null | undefined, permission: Permission): boolean {
  return role != null && GRANTS[role].includes(permission);
}

export const ROLE_LABELS: Record<Role, string> = {
  admin: "Administrator",
  operations: "Operations",
  curator: "Curator",
  guard: "Guard",
};

export interface NavEntry {
  href: string;
  label: string;
  permission: Permission;
}

// Navigation per role follows from the permissions: an entry shows when the role may open it.
const NAV: readonly NavEntry[] = [
  { href: "/galleries", label: "Galleries", permission: "galleries:view" },
  { href: "/exhibitions", label: "Exhibitions", permission: "exhibitions:view" },
  { href: "/staffing", label: "Staffing", permission: "staffing:view" },
  { href: "/people", label: "People", permission: "people:view" },
  { href: "/my-shifts", label: "My shifts", permission: "shifts:own" },
  { href: "/settings", label: "Settings", permission: "settings:manage" },
  { href: "/users", label: "Users", permission: "users:manage" },
  { href: "/mail", label: "Mail", permission: "mail:read" },
  { href: "/audit", label: "Audit trail", permission: "audit:read" },
];

export function navigationFor(role: Role): NavEntry[] {
  return NAV.filter((entry) => can(role, entry.permission));
}

// Which permission a page path needs; the proxy and pages use the same table.
const PAGE_PERMISSIONS: ReadonlyArray<[prefix: string, permission: Permission]> = [
  ...NAV.map((entry): [string, Permission] => [entry.href, entry.permission]),
  // Pages reached from another page, not from the navigation.
  ["/my-floors", "shifts:own"],
];

/** The permission a page path needs, or null when any signed-in person may open it. */
export function permissionForPath(pathname: string): Permission | null {
  for (const [prefix, permission] of PAGE_PERMISSIONS) {
    if (pathname === prefix || pathname.startsWith(prefix + "/")) return permission;
  }
  return null;
}
