/**
 * The discharge rules known by name (safety/discharge.ts gives each its voltage, time and source). Plain data,
 * so a screen can list them without loading the design schema.
 */
export const NAMED_DISCHARGE_RULES = ['50V-1min', '50V-5min', '60V-5s'] as const;
