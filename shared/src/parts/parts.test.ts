import { describe, expect, it } from 'vitest';
import { designExamples } from '../designs';
import { analyzeWithShelf } from './analyze-with-shelf';
import { bomCost } from './bom-cost';
import { csvCellNeedsQuotes, neutraliseCsvCell } from './csv-cell';
import { fillPartRatings, type ShelfPart } from './fill-part-ratings';
import { shelfForSizer } from './shelf-for-sizer';
import { normalizePart } from './validate-part';

const shelf: ShelfPart[] = [
  {
    code: 'NF-C472-3K',
    kind: 'capacitor',
    valueSi: 4.7e-9,
    tolerance: 0.05,
    ratedVoltageV: 3500,
    ratedCurrentA: null,
    ratedSurgeCurrentA: null,
    ratedPowerW: null,
    unitCost: 0.42,
  },
  {
    code: 'NF-D4K-50M',
    kind: 'diode',
    valueSi: null,
    tolerance: null,
    ratedVoltageV: 4500,
    ratedCurrentA: 0.04,
    ratedSurgeCurrentA: 8,
    ratedPowerW: null,
    unitCost: 0.3,
  },
  {
    code: 'NF-R82M-1K',
    kind: 'resistor',
    valueSi: 82e6,
    tolerance: 0.01,
    ratedVoltageV: 1200,
    ratedCurrentA: null,
    ratedSurgeCurrentA: null,
    ratedPowerW: 0.5,
    unitCost: 0.11,
  },
];

describe('normalizePart', () => {
  it('parses engineering text into SI numbers', () => {
    const { part, issues } = normalizePart({
      code: 'nf-c103-3k',
      kind: 'Capacitor',
      description: 'HV ceramic',
      valueSi: '10n',
      tolerance: '10%',
      ratedVoltageV: '3 kV',
      unitCost: '0.35',
      sizeMm: '10 x 5 x 7',
    });
    expect(issues).toEqual([]);
    expect(part).toMatchObject({
      code: 'NF-C103-3K',
      kind: 'capacitor',
      tolerance: 0.1,
      ratedVoltageV: 3000,
      unitCost: 0.35,
      sizeMm: '10x5x7',
    });
    // 10n = 1e-8 F; compared to 18 digits because the parser scales by a power of ten.
    expect(part?.valueSi).toBeCloseTo(1e-8, 18);
  });

  it('reports every bad field with its path', () => {
    const { part, issues } = normalizePart(
      { code: 'bad code', kind: 'capacitor', valueSi: '10 kA', unitCost: '-1', ratedPowerW: '1' },
      { pathPrefix: 'line 2, ' },
    );
    expect(part).toBeNull();
    expect(issues.map((issue) => issue.path)).toEqual([
      'line 2, code',
      'line 2, unitCost',
      'line 2, valueSi',
      'line 2, ratedVoltageV',
      'line 2, ratedPowerW',
    ]);
    expect(issues[2]?.message).toContain('unit A given where F is expected');
    expect(issues[3]?.message).toBe('ratedVoltageV is required for a capacitor');
    expect(issues[4]?.message).toBe('ratedPowerW does not apply to a capacitor; leave it empty');
  });

  it('refuses an unknown kind and an unknown field', () => {
    const { issues } = normalizePart({ code: 'NF-X1-1', kind: 'inductor', unitCost: 1, colour: 'red' });
    expect(issues.map((issue) => issue.message)).toEqual([
      'colour is not a part field that can be written here',
      "kind must be one of capacitor, diode, resistor, transistor, core, wire, tape (got 'inductor')",
    ]);
  });

  it('validates a patch against the stored part', () => {
    const base = normalizePart({
      code: 'NF-R82M-1K',
      kind: 'resistor',
      valueSi: '82M',
      ratedPowerW: '0.5',
      unitCost: 0.1,
    }).part;
    if (!base) throw new Error('base part should be valid');
    expect(normalizePart({ unitCost: 0.2 }, { partial: true, base }).part?.unitCost).toBe(0.2);
    expect(normalizePart({ kind: 'diode' }, { partial: true, base }).issues[0]?.path).toBe('kind');
    expect(normalizePart({ ratedPowerW: null }, { partial: true, base }).issues[0]?.message).toBe(
      'ratedPowerW is required for a resistor',
    );
  });
});

describe('normalizePart: cores, wires and tapes', () => {
  const core = {
    code: 'NF-KP18-M1',
    kind: 'core',
    valueSi: '4µ',
    unitCost: 0.85,
    coreAreaM2: '43.3 mm²',
    corePathLengthM: '26 mm',
    coreVolumeM3: '1120 mm3',
    windowAreaM2: '15.8mm^2',
    bobbinBreadthM: '7.2 mm',
    bobbinHeightM: '2.2 mm',
    meanTurnLengthM: '37 mm',
    saturationFluxDensity25T: '490 mT',
    saturationFluxDensity100T: '0.39 T',
    steinmetzK: '2.5',
    steinmetzAlpha: 1.4,
    steinmetzBeta: 2.5,
  };

  it('reads areas, volumes, lengths and flux densities as datasheets write them, into SI', () => {
    const { part, issues } = normalizePart(core);
    expect(issues).toEqual([]);
    // Unit conversions (1 mm² = 1e-6 m², 1 mm³ = 1e-9 m³, 1 mT = 1e-3 T): SI definitions; 15 figures kept.
    expect(part).toMatchObject({
      coreAreaM2: 43.3e-6,
      corePathLengthM: 0.026,
      coreVolumeM3: 1.12e-6,
      windowAreaM2: 15.8e-6,
      saturationFluxDensity25T: 0.49,
      saturationFluxDensity100T: 0.39,
      steinmetzK: 2.5,
      copperDiameterM: null,
    });
  });

  it('requires every core field and names the missing ones', () => {
    const { issues } = normalizePart({ code: 'NF-KX-1', kind: 'core', valueSi: '2µ', unitCost: 1 });
    expect(issues.map((issue) => issue.path)).toContain('coreAreaM2');
    expect(issues.find((issue) => issue.path === 'steinmetzBeta')?.message).toBe(
      'steinmetzBeta is required for a core',
    );
    expect(issues).toHaveLength(12);
  });

  it('refuses a value outside the domain, a unit slip and a volume that is not Ae·le', () => {
    const slip = normalizePart({ ...core, coreAreaM2: '43.3' });
    expect(slip.issues).toEqual([{ path: 'coreAreaM2', message: 'coreAreaM2 must be from 0.1 mm² to 10,000 mm²' }]);
    const volume = normalizePart({ ...core, coreVolumeM3: '3000 mm³' });
    expect(volume.issues[0]?.path).toBe('coreVolumeM3');
    expect(volume.issues[0]?.message).toContain('Ve = Ae·le');
    const text = normalizePart({ ...core, bobbinHeightM: 'tall' });
    expect(text.issues[0]?.message).toContain('bobbinHeightM is not a valid quantity');
  });

  it('reads a wire and refuses enamel thinner than the copper and a fractional grade', () => {
    const wire = {
      code: 'NF-W010-G2',
      kind: 'wire',
      unitCost: 0.004,
      copperDiameterM: '0.1 mm',
      overallDiameterM: '0.125 mm',
      enamelGrade: 2,
      breakdownVoltageV: '1 kV',
    };
    expect(normalizePart(wire).part).toMatchObject({
      copperDiameterM: 1e-4,
      overallDiameterM: 1.25e-4,
      breakdownVoltageV: 1000,
    });
    const bad = normalizePart({ ...wire, overallDiameterM: '0.09 mm', enamelGrade: '1.5' });
    expect(bad.issues.map((issue) => issue.path)).toEqual(['enamelGrade', 'overallDiameterM']);
  });

  it('reads a tape strength in kV/mm and refuses core fields on a tape', () => {
    const tape = {
      code: 'NF-T025-PE',
      kind: 'tape',
      unitCost: 0.02,
      thicknessM: '25 µm',
      dielectricStrengthVPerM: '100 kV/mm',
    };
    // 100 kV/mm = 1e8 V/m, 25 µm = 2.5e-5 m: SI definitions.
    expect(normalizePart(tape).part).toMatchObject({ thicknessM: 2.5e-5, dielectricStrengthVPerM: 1e8 });
    expect(normalizePart({ ...tape, coreAreaM2: '10 mm²' }).issues).toEqual([
      { path: 'coreAreaM2', message: 'coreAreaM2 does not apply to a tape; leave it empty' },
    ]);
  });
});

describe('neutraliseCsvCell', () => {
  it.each([
    ['=SUM(A1)', "'=SUM(A1)"],
    ['+1', "'+1"],
    ['-1', "'-1"],
    ['@cmd', "'@cmd"],
    ['\tx', "'\tx"],
    ['\rx', "'\rx"],
    // Leading spaces and full-width signs (U+FF1D ＝, U+FF0B ＋, U+FF20 ＠) are formula starts too.
    ['  =1+1', "'  =1+1"],
    ['\uFF1DSUM(A1)', "'\uFF1DSUM(A1)"],
    ['\uFF0B1', "'\uFF0B1"],
    ['\uFF20cmd', "'\uFF20cmd"],
    // A formula start after a separator that a ;-locale spreadsheet splits on is defused in place.
    ['x;=cmd|x', "x;'=cmd|x"],
    ['x; =1', "x; '=1"],
    ['a,b;c', 'a,b;c'],
    ['10 nF, -20 %', '10 nF, -20 %'],
    ['HV ceramic', 'HV ceramic'],
    [0.5, '0.5'],
    [null, ''],
  ] as const)('%j becomes %j', (input, output) => {
    expect(neutraliseCsvCell(input)).toBe(output);
  });
});

describe('csvCellNeedsQuotes', () => {
  it('quotes cells holding ; or a tab, and no others', () => {
    expect(csvCellNeedsQuotes("x;'=cmd")).toBe(true);
    expect(csvCellNeedsQuotes('a\tb')).toBe(true);
    expect(csvCellNeedsQuotes('plain')).toBe(false);
    expect(csvCellNeedsQuotes(3)).toBe(false);
  });
});

describe('fillPartRatings', () => {
  it('takes the shelf ratings for the referenced codes and leaves the input alone', () => {
    const design = designExamples.surfaceChargeTester;
    const { design: filled, issues } = fillPartRatings(design, shelf);
    expect(issues).toEqual([]);
    expect(filled.multiplier.capacitors.every((c) => c.ratedVoltageV === 3500 && c.tolerance === 0.05)).toBe(true);
    expect(filled.multiplier.capacitors[0]?.valueF).toBe(4.7e-9);
    expect(filled.multiplier.diode).toMatchObject({
      ratedPivV: 4500,
      ratedAverageCurrentA: 0.04,
      ratedSurgeCurrentA: 8,
    });
    expect(filled.outputNetwork.bleeder).toMatchObject({ ratedPowerW: 0.5, limitingVoltageV: 1200, valueOhm: 82e6 });
    expect(design.multiplier.capacitors[0]?.ratedVoltageV).toBe(3000);
  });

  it('reports unknown codes and parts of the wrong kind', () => {
    const design = designExamples.detectorBias;
    const wrongKind: ShelfPart[] = [{ ...shelf[1], code: 'NF-C103-1K' } as ShelfPart];
    const { issues } = fillPartRatings(design, wrongKind);
    expect(issues).toContainEqual({
      path: 'multiplier.capacitors[1].partCode',
      message: 'NF-C103-1K is a diode, not a capacitor',
    });
    expect(issues).toContainEqual({
      path: 'multiplier.capacitors[0].partCode',
      message: 'no part NF-C223-630 on the Parts shelf',
    });
  });
});

describe('bomCost', () => {
  it('prices the ladder of the surface-charge tester by hand', () => {
    // 4 capacitors × 0.42 + 4 diodes (half-wave: one per capacitor) × 0.30 + 5 bleeder resistors × 0.11
    // = 1.68 + 1.20 + 0.55 = 3.43 (worked by hand).
    const bom = bomCost(designExamples.surfaceChargeTester, shelf);
    expect(bom.lines).toEqual([
      { code: 'NF-C472-3K', kind: 'capacitor', quantity: 4, unitCost: 0.42, lineCost: 1.68 },
      { code: 'NF-D4K-50M', kind: 'diode', quantity: 4, unitCost: 0.3, lineCost: expect.closeTo(1.2, 12) },
      { code: 'NF-R82M-1K', kind: 'resistor', quantity: 5, unitCost: 0.11, lineCost: 0.55 },
    ]);
    expect(bom.totalCost).toBeCloseTo(3.43, 9);
    expect(bom.unpriced).toEqual([]);
  });

  it('lists positions whose code is missing from the shelf', () => {
    const bom = bomCost(designExamples.precipitatorCell, shelf);
    // Full-wave, 2 stages: 6 capacitors priced at 0.42 (same code), 8 diodes (4 per stage) and 4 bleeder resistors unpriced.
    expect(bom.totalCost).toBeCloseTo(6 * 0.42, 9);
    expect(bom.unpriced).toEqual([
      { position: 'diodes', quantity: 8, code: 'NF-D3K-50M' },
      { position: 'bleeder', quantity: 4, code: 'NF-R47M-HV' },
    ]);
  });
});

describe('shelfForSizer', () => {
  it("gives the Sizer's parts list with shelf ratings on the given diode model", () => {
    const model = { saturationCurrentA: 1e-9, emissionCoefficient: 8, seriesResistanceOhm: 40 };
    expect(shelfForSizer(shelf, model)).toEqual({
      capacitors: [{ valueF: 4.7e-9, ratedVoltageV: 3500, costEach: 0.42, partCode: 'NF-C472-3K' }],
      diodes: [
        {
          ...model,
          ratedPivV: 4500,
          ratedAverageCurrentA: 0.04,
          ratedSurgeCurrentA: 8,
          costEach: 0.3,
          partCode: 'NF-D4K-50M',
        },
      ],
      resistors: [{ valueOhm: 82e6, ratedPowerW: 0.5, limitingVoltageV: 1200, costEach: 0.11, partCode: 'NF-R82M-1K' }],
    });
  });
});

describe('analyzeWithShelf', () => {
  it('checks capacitor voltage against the rating the shelf holds for the code', () => {
    const design = designExamples.surfaceChargeTester;
    const lowRated = shelf.map((part) => (part.code === 'NF-C472-3K' ? { ...part, ratedVoltageV: 500 } : part));
    const report = analyzeWithShelf(design, lowRated);
    expect(report.partIssues).toEqual([]);
    // The document says 3 kV; the shelf says 500 V, below C1's ~1.6 kV peak, so C1 fails; the limit shown is
    // the derated figure, 500 V × 0.8 (DERATING.capacitorVoltage).
    expect(report.checks.find((check) => check.id === 'cap-voltage-c1')).toMatchObject({ verdict: 'fail', limit: 400 });
  });

  it('reports unknown codes as part issues and checks those positions on the document ratings', () => {
    const design = designExamples.surfaceChargeTester;
    const report = analyzeWithShelf(design, []);
    expect(report.partIssues).toContainEqual({
      path: 'multiplier.capacitors[0].partCode',
      message: 'no part NF-C472-3K on the Parts shelf',
    });
    expect(report.checks.find((check) => check.id === 'cap-voltage-c1')?.limit).toBe(3000 * 0.8);
  });
});
