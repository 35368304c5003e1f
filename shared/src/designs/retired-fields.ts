type Json = Record<string, unknown>;

const isObject = (value: unknown): value is Json =>
  typeof value === 'object' && value !== null && !Array.isArray(value);

/**
 * A design document written before a field was retired, with that field taken out, so that a file exported
 * then reads as the stored revisions do after their migration: an RCD clamp's stated `clampVoltageV`
 * (migration 0016-rcd-clamp-level; the clamp's level follows from its resistor and capacitor, which the
 * simulated circuit always used). Anything else comes back as given; the input is never changed.
 */
export function withoutRetiredFields(input: unknown): unknown {
  if (!isObject(input) || !isObject(input.drive) || !isObject(input.drive.driver)) return input;
  const clamp = input.drive.driver.clamp;
  if (!isObject(clamp) || clamp.kind !== 'rcd' || !('clampVoltageV' in clamp)) return input;
  const { clampVoltageV: _retired, ...rest } = clamp;
  return { ...input, drive: { ...input.drive, driver: { ...input.drive.driver, clamp: rest } } };
}
