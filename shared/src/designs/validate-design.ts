import { DomainError } from '../errors';
import type { FieldIssue } from '../errors';
import { DESIGN_SCHEMA_VERSION } from './design.types';
import type { Design } from './design.types';

type Json = Record<string, unknown>;

/** Collects every problem of a document with its field path, instead of stopping at the first. */
class IssueCollector {
  readonly issues: FieldIssue[] = [];

  add(path: string, message: string): void {
    this.issues.push({ path, message });
  }

  object(value: unknown, path: string): Json | null {
    if (typeof value === 'object' && value !== null && !Array.isArray(value)) return value as Json;
    this.add(path, 'expected an object');
    return null;
  }

  number(
    parent: Json,
    key: string,
    path: string,
    rule: 'positive' | 'nonNegative' | 'any' | 'nonZero',
    optional = false,
  ): void {
    const value = parent[key];
    const at = `${path}.${key}`;
    if (value === undefined && optional) return;
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      this.add(at, 'expected a finite number in SI base units');
      return;
    }
    if (rule === 'positive' && !(value > 0)) this.add(at, 'must be greater than zero');
    if (rule === 'nonNegative' && value < 0) this.add(at, 'must not be negative');
    if (rule === 'nonZero' && value === 0) this.add(at, 'must not be zero');
  }

  fraction(parent: Json, key: string, path: string, openLow: boolean, openHigh: boolean): void {
    const value = parent[key];
    const at = `${path}.${key}`;
    if (typeof value !== 'number' || !Number.isFinite(value)) return this.add(at, 'expected a number between 0 and 1');
    const lowOk = openLow ? value > 0 : value >= 0;
    const highOk = openHigh ? value < 1 : value <= 1;
    if (!lowOk || !highOk) this.add(at, `must lie in ${openLow ? '(' : '['}0, 1${openHigh ? ')' : ']'}`);
  }

  string(parent: Json, key: string, path: string, optional = false): void {
    const value = parent[key];
    if (value === undefined && optional) return;
    if (typeof value !== 'string') this.add(`${path}.${key}`, 'expected text');
  }

  oneOf(parent: Json, key: string, path: string, allowed: readonly unknown[]): boolean {
    if (allowed.includes(parent[key])) return true;
    this.add(`${path}.${key}`, `expected one of ${allowed.map((a) => JSON.stringify(a)).join(', ')}`);
    return false;
  }

  integer(parent: Json, key: string, path: string, min: number): void {
    const value = parent[key];
    if (typeof value !== 'number' || !Number.isInteger(value) || value < min) {
      this.add(`${path}.${key}`, `expected an integer ≥ ${min}`);
    }
  }
}

function checkDrive(c: IssueCollector, value: unknown): void {
  const drive = c.object(value, 'drive');
  if (!drive) return;
  if (!c.oneOf(drive, 'kind', 'drive', ['sine', 'pulse', 'driver'])) return;
  if (drive.kind === 'driver') {
    const driver = c.object(drive.driver, 'drive.driver');
    if (!driver) return;
    for (const key of ['supply', 'transformer', 'transistor']) c.object(driver[key], `drive.driver.${key}`);
    c.number(driver, 'baseResistorOhm', 'drive.driver', 'positive');
    return;
  }
  c.number(drive, 'frequencyHz', 'drive', 'positive');
  c.number(drive, 'sourceResistanceOhm', 'drive', 'nonNegative');
  if (drive.kind === 'sine') {
    c.number(drive, 'peakV', 'drive', 'positive');
  } else {
    c.number(drive, 'forwardPeakV', 'drive', 'nonNegative');
    c.number(drive, 'flybackPeakV', 'drive', 'nonNegative');
    c.fraction(drive, 'dutyCycle', 'drive', true, true);
    const sum = Number(drive.forwardPeakV) + Number(drive.flybackPeakV);
    if (Number.isFinite(sum) && !(sum > 0))
      c.add('drive.flybackPeakV', 'forward and flyback peaks cannot both be zero');
  }
}

/** Capacitors a topology needs for a cell count (see MultiplierSpec for the order). */
export function capacitorCountFor(topology: string, cellCount: number): number {
  if (topology === 'full-wave') return 3 * cellCount;
  return cellCount;
}

function checkMultiplier(c: IssueCollector, value: unknown): void {
  const m = c.object(value, 'multiplier');
  if (!m) return;
  const topologyOk = c.oneOf(m, 'topology', 'multiplier', ['half-wave', 'full-wave', 'bridge-doubler']);
  c.integer(m, 'cellCount', 'multiplier', 1);
  const cellCount = m.cellCount;
  if (m.topology === 'bridge-doubler' && cellCount !== 2)
    c.add('multiplier.cellCount', 'a bridge doubler has exactly 2 cells');
  if (!Array.isArray(m.capacitors)) {
    c.add('multiplier.capacitors', 'expected a list of capacitors from the source upward');
  } else {
    if (topologyOk && typeof cellCount === 'number' && Number.isInteger(cellCount) && cellCount >= 1) {
      const expected = capacitorCountFor(String(m.topology), cellCount);
      if (m.capacitors.length !== expected) {
        c.add(
          'multiplier.capacitors',
          `${String(m.topology)} with ${cellCount} cells needs ${expected} capacitors, got ${m.capacitors.length}`,
        );
      }
    }
    m.capacitors.forEach((item, i) => {
      const path = `multiplier.capacitors[${i}]`;
      const cap = c.object(item, path);
      if (!cap) return;
      c.number(cap, 'valueF', path, 'positive');
      c.fraction(cap, 'tolerance', path, false, true);
      c.number(cap, 'ratedVoltageV', path, 'positive');
      c.string(cap, 'partCode', path, true);
    });
  }
  const diode = c.object(m.diode, 'multiplier.diode');
  if (diode) {
    const path = 'multiplier.diode';
    c.number(diode, 'saturationCurrentA', path, 'positive');
    c.number(diode, 'emissionCoefficient', path, 'positive');
    c.number(diode, 'seriesResistanceOhm', path, 'nonNegative');
    c.number(diode, 'ratedPivV', path, 'positive');
    c.number(diode, 'ratedAverageCurrentA', path, 'positive');
    c.number(diode, 'ratedSurgeCurrentA', path, 'positive');
    c.number(diode, 'junctionCapacitanceF', path, 'nonNegative', true);
    c.string(diode, 'partCode', path, true);
  }
  c.number(m, 'strayCapacitanceF', 'multiplier', 'nonNegative', true);
}

function checkOutputNetwork(c: IssueCollector, value: unknown): void {
  const net = c.object(value, 'outputNetwork');
  if (!net) return;
  c.number(net, 'seriesOutputResistanceOhm', 'outputNetwork', 'nonNegative');
  if (net.bleeder === null) return;
  const b = c.object(net.bleeder, 'outputNetwork.bleeder');
  if (!b) return;
  c.integer(b, 'count', 'outputNetwork.bleeder', 1);
  c.number(b, 'valueOhm', 'outputNetwork.bleeder', 'positive');
  c.number(b, 'ratedPowerW', 'outputNetwork.bleeder', 'positive');
  c.number(b, 'limitingVoltageV', 'outputNetwork.bleeder', 'positive');
  c.string(b, 'partCode', 'outputNetwork.bleeder', true);
}

function checkLoad(c: IssueCollector, value: unknown): void {
  const load = c.object(value, 'load');
  if (!load || !c.oneOf(load, 'kind', 'load', ['current', 'resistance'])) return;
  if (load.kind === 'current') c.number(load, 'currentA', 'load', 'nonNegative');
  else c.number(load, 'resistanceOhm', 'load', 'positive');
}

function checkTargets(c: IssueCollector, value: unknown): void {
  const t = c.object(value, 'targets');
  if (!t) return;
  c.number(t, 'outputV', 'targets', 'nonZero');
  c.number(t, 'rippleMaxV', 'targets', 'positive');
  c.number(t, 'loadCurrentA', 'targets', 'nonNegative');
  c.number(t, 'safeVoltageV', 'targets', 'positive');
  const rule = t.dischargeRule;
  if (typeof rule === 'object' && rule !== null) {
    const custom = rule as Json;
    c.number(custom, 'voltageV', 'targets.dischargeRule', 'positive');
    c.number(custom, 'timeS', 'targets.dischargeRule', 'positive');
  } else {
    c.oneOf(t, 'dischargeRule', 'targets', ['50V-1min', '50V-5min', '60V-5s']);
  }
  const s = c.object(t.spacing, 'targets.spacing');
  if (!s) return;
  c.oneOf(s, 'pollutionDegree', 'targets.spacing', [1, 2, 3]);
  c.oneOf(s, 'materialGroup', 'targets.spacing', ['I', 'II', 'IIIa', 'IIIb']);
  if (typeof s.pcb !== 'boolean') c.add('targets.spacing.pcb', 'expected true or false');
  c.number(s, 'altitudeM', 'targets.spacing', 'nonNegative', true);
  c.number(s, 'providedCreepageMm', 'targets.spacing', 'positive', true);
}

/**
 * Validates an untrusted design document (parsed JSON) and returns it typed. Reports every problem
 * found, each with its field path (e.g. `multiplier.capacitors[3].valueF`), in one
 * DomainError('invalid_design'); a document of another schemaVersion gives `unsupported_version`.
 */
export function validateDesign(input: unknown): Design {
  const c = new IssueCollector();
  const doc = c.object(input, '(document)');
  if (!doc) throw new DomainError('invalid_design', 'a design document must be a JSON object', '(document)', c.issues);
  if (doc.schemaVersion !== DESIGN_SCHEMA_VERSION) {
    throw new DomainError('unsupported_version', `schemaVersion must be ${DESIGN_SCHEMA_VERSION}`, 'schemaVersion');
  }
  c.string(doc, 'name', '(document)');
  c.string(doc, 'notes', '(document)');
  // Top-level fields are reported without the "(document)." prefix.
  for (const issue of c.issues) issue.path = issue.path.replace('(document).', '');
  checkDrive(c, doc.drive);
  checkMultiplier(c, doc.multiplier);
  checkOutputNetwork(c, doc.outputNetwork);
  checkLoad(c, doc.load);
  checkTargets(c, doc.targets);
  if (c.issues.length > 0) {
    const first = c.issues[0];
    const summary = c.issues.map((i) => `${i.path}: ${i.message}`).join('; ');
    throw new DomainError('invalid_design', `design is not valid: ${summary}`, first?.path ?? null, c.issues);
  }
  return doc as unknown as Design;
}
