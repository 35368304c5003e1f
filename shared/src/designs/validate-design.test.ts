import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import Ajv2020 from 'ajv/dist/2020';
import { describe, expect, it } from 'vitest';
import { DomainError } from '../errors';
import { designDocumentSchema } from './design.schema';
import { designExamples } from './design-examples';
import { validateDesign } from './validate-design';

const fixtureDir = join(__dirname, '../../test/fixtures/designs');
const readJson = (path: string): unknown => JSON.parse(readFileSync(path, 'utf8'));
const okFixtures = readdirSync(join(fixtureDir, 'ok')).map((f) => ({
  name: f,
  doc: readJson(join(fixtureDir, 'ok', f)),
}));
const notOkFixtures = readdirSync(join(fixtureDir, 'not-ok')).map((f) => ({
  name: f,
  ...(readJson(join(fixtureDir, 'not-ok', f)) as { expectedCode: string; expectedPaths: string[]; design: unknown }),
}));

// The published schema read by Ajv, a general-purpose JSON Schema validator, in its draft 2020-12 mode.
const ajv = new Ajv2020({ allErrors: true, strict: true });
const publishedSchemaAccepts = ajv.compile(designDocumentSchema);

describe('validateDesign', () => {
  it.each(Object.entries(designExamples))(
    'accepts the demo design %s, and so does the published schema',
    (_, design) => {
      expect(validateDesign(structuredClone(design))).toEqual(design);
      expect(publishedSchemaAccepts(design)).toBe(true);
    },
  );

  it.each(okFixtures)('accepts ok fixture $name, and so does the published schema', ({ doc }) => {
    expect(() => validateDesign(doc)).not.toThrow();
    expect(publishedSchemaAccepts(doc)).toBe(true);
  });

  it.each(notOkFixtures)(
    'refuses not-ok fixture $name with its field paths',
    ({ design, expectedCode, expectedPaths }) => {
      let caught: unknown;
      try {
        validateDesign(design);
      } catch (error) {
        caught = error;
      }
      expect(caught).toBeInstanceOf(DomainError);
      const error = caught as DomainError;
      expect(error.code).toBe(expectedCode);
      expect(error.issues.map((i) => i.path).sort()).toEqual([...expectedPaths].sort());
      for (const issue of error.issues) expect(issue.message.length).toBeGreaterThan(8);
    },
  );

  // Cross-field rules (capacitor count per topology and cell count) are beyond a schema.
  const crossFieldOnly = ['capacitor-count-mismatch.json', 'bridge-with-three-cells.json'];
  it.each(notOkFixtures.filter((f) => f.expectedCode === 'invalid_design' && !crossFieldOnly.includes(f.name)))(
    'the published schema also refuses $name',
    ({ design }) => {
      expect(publishedSchemaAccepts(design)).toBe(false);
    },
  );

  it('refuses a document that is not an object', () => {
    expect(() => validateDesign([1, 2])).toThrow(DomainError);
  });

  const sineExample = (): Record<string, unknown> =>
    structuredClone(Object.values(designExamples).find((d) => d.drive.kind === 'sine')) as unknown as Record<
      string,
      unknown
    >;
  const issuesOf = (doc: unknown): { path: string; message: string }[] => {
    try {
      validateDesign(doc);
    } catch (error) {
      return (error as DomainError).issues;
    }
    return [];
  };

  it('names an unknown key in its issue', () => {
    const doc = sineExample();
    doc.__proto__colour = 'red';
    expect(issuesOf(doc)).toEqual([{ path: '__proto__colour', message: expect.stringContaining('unknown key') }]);
  });

  it('refuses a document nested 10,000 deep at the depth limit, without walking it all', () => {
    const doc = sineExample();
    let inner: Record<string, unknown> = {};
    doc.notes = inner;
    for (let i = 0; i < 10_000; i++) inner = inner.a = {} as Record<string, unknown>;
    const [issue] = issuesOf(doc);
    expect(issue?.message).toContain('nests deeper than');
  });

  it('lists at most 100 issues and counts the rest', () => {
    const doc = sineExample();
    const multiplier = doc.multiplier as { cellCount: number; capacitors: unknown[] };
    multiplier.cellCount = 400;
    multiplier.capacitors = Array.from({ length: 400 }, () => ({ valueF: -1, tolerance: 0.1, ratedVoltageV: 1 }));
    const issues = issuesOf(doc);
    expect(issues).toHaveLength(101);
    expect(issues[100]).toEqual({ path: '(document)', message: 'and 300 more problems not listed' });
  });

  it('says the bounds of a fraction and the domain limit of a count', () => {
    const doc = sineExample();
    (doc.multiplier as { capacitors: { tolerance: number }[] }).capacitors[0]!.tolerance = 1;
    (doc.multiplier as { cellCount: number }).cellCount = 401;
    expect(issuesOf(doc)).toEqual([
      { path: 'multiplier.cellCount', message: 'must not exceed 400 (a limit of the domain)' },
      { path: 'multiplier.capacitors[0].tolerance', message: 'must lie in [0, 1)' },
    ]);
  });
});
