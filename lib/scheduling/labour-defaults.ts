// The labour rules a site may set as its defaults (Settings), a subset of the engine's rules
// (scenario.ts rulesSchema), with the engine's own values. Defaults of this product: local law governs.
export const LABOUR_DEFAULT_KEYS = ["minRestHours", "maxShiftHours", "minShiftHours", "breakAfterHours", "breakMinutes"] as const;
export type LabourDefaults = Record<(typeof LABOUR_DEFAULT_KEYS)[number], number>;
export const ENGINE_LABOUR_DEFAULTS: LabourDefaults = { minRestHours: 11, maxShiftHours: 10, minShiftHours: 4, breakAfterHours: 6, breakMinutes: 60 };
