// The parts of the product the audit trail groups changes by (the part of an action before its dot).
export const AUDIT_AREAS = {
  site: "Sites",
  floor: "Floors",
  room: "Rooms",
  "post-plan": "Post plans",
  exhibition: "Exhibitions",
  roster: "Rosters",
  guard: "People",
  "time-off": "Time off",
  user: "Users and roles",
  settings: "Settings",
  mail: "Mail",
  calendar: "Calendar feeds",
} as const;
