/**
 * The discharge rules known by name (safety/discharge.ts gives each its voltage, time and source). Plain data,
 * so a screen can list them without loading the design schema.
 */
export const NAMED_DISCHARGE_RULES = ['50V-1min', '50V-5min', '60V-5s'] as const;

/** How each named rule reads on a screen or a sheet: "to 60 V within 5 s". */
export const DISCHARGE_RULE_LABELS: Record<(typeof NAMED_DISCHARGE_RULES)[number], string> = {
  '50V-1min': 'to 50 V within 1 min',
  '50V-5min': 'to 50 V within 5 min',
  '60V-5s': 'to 60 V within 5 s',
};
