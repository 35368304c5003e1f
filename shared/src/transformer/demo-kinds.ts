import type { CoreKind, TapeKind, TransformerSection, WireKind } from './transformer.types';

/**
 * Demo core, wire and tape kinds of the invented Northfold Instruments scenario (NAMING.md): plausible
 * figures for small ferrite E cores and fine enamelled wire, invented, with no vendor material or part names.
 * Grade A is a power ferrite, grade B a high-permeability ferrite with lower saturation and higher loss.
 */
const powerFerrite = {
  saturationFluxDensity25T: 0.49,
  saturationFluxDensity100T: 0.39,
  steinmetzK: 1.26,
  steinmetzAlpha: 1.5,
  steinmetzBeta: 2.6,
};
const highPermeabilityFerrite = {
  saturationFluxDensity25T: 0.42,
  saturationFluxDensity100T: 0.32,
  steinmetzK: 3.0,
  steinmetzAlpha: 1.4,
  steinmetzBeta: 2.5,
};
const mm = 1e-3;
const mm2 = 1e-6;
const mm3 = 1e-9;
const uH = 1e-6;

/** One E20 core shape with its bobbin, made in both ferrite grades. */
const e20Shape = {
  effectiveAreaM2: 32 * mm2,
  pathLengthM: 42.8 * mm,
  volumeM3: 1340 * mm3,
  windowAreaM2: 48 * mm2,
  bobbinBreadthM: 11 * mm,
  bobbinHeightM: 4 * mm,
  meanTurnLengthM: 38 * mm,
};

export const demoCoreKinds: readonly CoreKind[] = [
  {
    code: 'Core E13 ferrite grade A',
    effectiveAreaM2: 12.4 * mm2,
    pathLengthM: 29.7 * mm,
    volumeM3: 369 * mm3,
    windowAreaM2: 20 * mm2,
    bobbinBreadthM: 7.5 * mm,
    bobbinHeightM: 2.2 * mm,
    meanTurnLengthM: 25 * mm,
    ungappedAlHPerTurn2: 0.8 * uH,
    ...powerFerrite,
  },
  {
    code: 'Core E16 ferrite grade A',
    effectiveAreaM2: 20.1 * mm2,
    pathLengthM: 37.6 * mm,
    volumeM3: 750 * mm3,
    windowAreaM2: 35 * mm2,
    bobbinBreadthM: 9.6 * mm,
    bobbinHeightM: 3.0 * mm,
    meanTurnLengthM: 33 * mm,
    ungappedAlHPerTurn2: 1.1 * uH,
    ...powerFerrite,
  },
  {
    code: 'Core E20 ferrite grade A',
    ...e20Shape,
    ungappedAlHPerTurn2: 1.6 * uH,
    ...powerFerrite,
  },
  {
    code: 'Core E20 ferrite grade B',
    ...e20Shape,
    ungappedAlHPerTurn2: 4.5 * uH,
    ...highPermeabilityFerrite,
  },
  {
    code: 'Core E25 ferrite grade A',
    effectiveAreaM2: 52.5 * mm2,
    pathLengthM: 57.5 * mm,
    volumeM3: 3020 * mm3,
    windowAreaM2: 87 * mm2,
    bobbinBreadthM: 15 * mm,
    bobbinHeightM: 5.5 * mm,
    meanTurnLengthM: 50 * mm,
    ungappedAlHPerTurn2: 1.9 * uH,
    ...powerFerrite,
  },
];

export const demoWireKinds: readonly WireKind[] = [
  {
    code: 'Wire 0.08 mm grade 2',
    copperDiameterM: 0.08 * mm,
    overallDiameterM: 0.099 * mm,
    grade: 2,
    breakdownVoltageV: 800,
  },
  {
    code: 'Wire 0.10 mm grade 2',
    copperDiameterM: 0.1 * mm,
    overallDiameterM: 0.121 * mm,
    grade: 2,
    breakdownVoltageV: 1000,
  },
  {
    code: 'Wire 0.20 mm grade 2',
    copperDiameterM: 0.2 * mm,
    overallDiameterM: 0.23 * mm,
    grade: 2,
    breakdownVoltageV: 1700,
  },
  {
    code: 'Wire 0.30 mm grade 2',
    copperDiameterM: 0.3 * mm,
    overallDiameterM: 0.337 * mm,
    grade: 2,
    breakdownVoltageV: 2300,
  },
  {
    code: 'Wire 0.40 mm grade 2',
    copperDiameterM: 0.4 * mm,
    overallDiameterM: 0.445 * mm,
    grade: 2,
    breakdownVoltageV: 2700,
  },
  {
    code: 'Wire 0.05 mm grade 2',
    copperDiameterM: 0.05 * mm,
    overallDiameterM: 0.064 * mm,
    grade: 2,
    breakdownVoltageV: 600,
  },
];

export const demoTapeKinds: readonly TapeKind[] = [
  { code: 'Tape polyester 25 um', thicknessM: 25e-6, dielectricStrengthVPerM: 1e8 },
  { code: 'Tape polyester 50 um', thicknessM: 50e-6, dielectricStrengthVPerM: 1e8 },
];

const kind = <T extends { code: string }>(kinds: readonly T[], code: string): T => {
  const found = kinds.find((k) => k.code === code);
  if (!found) throw new Error(`demo kind ${code} missing`);
  return found;
};

/**
 * A transformer for the demo handheld surface-charge tester (driverExamples.surfaceChargeTester): its 1 mH
 * and 1 : 0.4 : 60 turns ratios as 40, 16 and 2400 turns on the power-ferrite E25 core, whose gap for 1 mH
 * (about 0.08 mm) can be made; the secondary outermost in layers separated by one wrap of tape.
 */
export const demoTransformerSection: TransformerSection = {
  core: kind(demoCoreKinds, 'Core E25 ferrite grade A'),
  gap: { kind: 'primary-inductance', primaryInductanceH: 1e-3 },
  windings: [
    {
      role: 'primary',
      name: 'primary',
      turns: 40,
      wire: kind(demoWireKinds, 'Wire 0.20 mm grade 2'),
      startPin: 1,
      endPin: 2,
    },
    {
      role: 'feedback',
      name: 'feedback',
      turns: 16,
      wire: kind(demoWireKinds, 'Wire 0.10 mm grade 2'),
      startPin: 3,
      endPin: 4,
    },
    {
      role: 'secondary',
      name: 'secondary',
      turns: 2400,
      wire: kind(demoWireKinds, 'Wire 0.05 mm grade 2'),
      layerTapeWraps: 1,
      startPin: 6,
      endPin: 8,
    },
  ],
  layerTape: kind(demoTapeKinds, 'Tape polyester 25 um'),
  windingTape: kind(demoTapeKinds, 'Tape polyester 50 um'),
  windingTapeWraps: 3,
  endMarginM: 3.5 * mm,
  inductanceTolerance: 0.1,
};
