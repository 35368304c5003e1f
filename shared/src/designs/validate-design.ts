import { Value } from '@sinclair/typebox/value';
import { DomainError, capIssues, jsonLimitIssue } from '../errors';
import type { FieldIssue } from '../errors';
import { designLimits } from './design-limits';
import { DESIGN_SCHEMA_VERSION, designSchema } from './design.schema';
import type { Design } from './design.types';
import { schemaIssues } from './schema-issues';
import { capacitorCountFor } from './capacitor-count';

type Json = Record<string, unknown>;
const objectAt = (value: unknown): Json =>
  typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Json) : {};

/**
 * Rules across fields that the schema cannot state. Run on any document (the schema's issues are
 * reported beside them), so each rule first checks the types it relies on.
 */
function crossFieldIssues(doc: Json): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const drive = objectAt(doc.drive);
  const m = objectAt(doc.multiplier);
  const { forwardPeakV, flybackPeakV } = drive;
  if (drive.kind === 'pulse' && typeof forwardPeakV === 'number' && typeof flybackPeakV === 'number') {
    if (!(forwardPeakV + flybackPeakV > 0)) {
      issues.push({ path: 'drive.flybackPeakV', message: 'forward and flyback peaks cannot both be zero' });
    }
  }
  const { topology, cellCount, capacitors } = m;
  if (topology === 'bridge-doubler' && cellCount !== 2) {
    issues.push({ path: 'multiplier.cellCount', message: 'a bridge doubler has exactly 2 cells' });
  }
  if (typeof topology === 'string' && Number.isInteger(cellCount) && Array.isArray(capacitors)) {
    const expected = capacitorCountFor(topology, cellCount as number);
    const counted = (cellCount as number) >= 1 && (cellCount as number) <= designLimits.maxCellCount;
    if (counted && capacitors.length !== expected) {
      issues.push({
        path: 'multiplier.capacitors',
        message: `${topology} with ${String(cellCount)} cells needs ${expected} capacitors, got ${capacitors.length}`,
      });
    }
  }
  if (drive.kind === 'driver') issues.push(...transformerSectionIssues(objectAt(drive.driver)));
  if (objectAt(doc.targets).outputV === 0) issues.push({ path: 'targets.outputV', message: 'must not be zero' });
  return issues;
}

/** A designed transformer needs its section; the section has each winding once, distinct pins, wire within its enamel. */
function transformerSectionIssues(driver: Json): FieldIssue[] {
  const issues: FieldIssue[] = [];
  const base = 'drive.driver';
  if (driver.transformerChoice === 'designed' && driver.transformerDesign === undefined) {
    issues.push({
      path: `${base}.transformerDesign`,
      message: "a 'designed' transformer needs its transformer section",
    });
  }
  const windings = objectAt(driver.transformerDesign).windings;
  if (!Array.isArray(windings)) return issues;
  const roles = new Set<unknown>();
  const pins = new Set<unknown>();
  windings.forEach((item, i) => {
    const winding = objectAt(item);
    const path = `${base}.transformerDesign.windings[${i}]`;
    if (roles.has(winding.role))
      issues.push({ path: `${path}.role`, message: `${String(winding.role)} appears twice` });
    roles.add(winding.role);
    for (const key of ['startPin', 'endPin'] as const) {
      const pin = winding[key];
      if (typeof pin !== 'number') continue;
      if (pins.has(pin)) issues.push({ path: `${path}.${key}`, message: `pin ${pin} is used twice` });
      pins.add(pin);
    }
    const wire = objectAt(winding.wire);
    if (typeof wire.copperDiameterM === 'number' && typeof wire.overallDiameterM === 'number') {
      if (wire.overallDiameterM < wire.copperDiameterM)
        issues.push({ path: `${path}.wire.overallDiameterM`, message: 'must be at least the copper diameter' });
    }
  });
  return issues;
}

function refuse(issues: FieldIssue[]): never {
  const listed = capIssues(issues, '(document)');
  const summary = listed.map((i) => `${i.path}: ${i.message}`).join('; ');
  throw new DomainError('invalid_design', `design is not valid: ${summary}`, listed[0]?.path ?? null, listed);
}

/**
 * Validates an untrusted design document (parsed JSON) against its definition (design.schema.ts) and
 * returns it typed. Reports every problem found, each with its field path (e.g.
 * `multiplier.capacitors[3].valueF`), in one DomainError('invalid_design'); unknown keys are refused by
 * name; a document of another schemaVersion gives `unsupported_version`. Size and nesting are checked
 * first, so a hostile document costs no more than the limits allow.
 */
export function validateDesign(input: unknown): Design {
  if (typeof input !== 'object' || input === null || Array.isArray(input)) {
    const issue = { path: '(document)', message: 'a design document must be a JSON object' };
    throw new DomainError('invalid_design', issue.message, issue.path, [issue]);
  }
  const shape = jsonLimitIssue(input, {
    maxDepth: designLimits.maxDepth,
    maxBytes: designLimits.maxDocumentBytes,
    checkText: false,
  });
  if (shape) refuse([shape]);
  if ((input as { schemaVersion?: unknown }).schemaVersion !== DESIGN_SCHEMA_VERSION) {
    throw new DomainError('unsupported_version', `schemaVersion must be ${DESIGN_SCHEMA_VERSION}`, 'schemaVersion');
  }
  const issues = Value.Check(designSchema, input) ? [] : schemaIssues(designSchema, input);
  for (const issue of crossFieldIssues(input as Json)) {
    if (!issues.some((i) => i.path === issue.path)) issues.push(issue);
  }
  if (issues.length > 0) refuse(issues);
  return input as Design;
}
