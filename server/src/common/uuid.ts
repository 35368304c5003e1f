const UUID_PATTERN = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** Whether `value` is a canonical UUID (any version), so it can be sent to a `uuid` column. */
export function isUuid(value: string): boolean {
  return UUID_PATTERN.test(value);
}
