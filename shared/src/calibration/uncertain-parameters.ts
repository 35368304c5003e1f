import type { Design } from '../designs/design.types';
import type { DriverStage } from '../designs/driver-stage.types';
import { DomainError } from '../errors';
import type { CalibrationParameterId, ChosenParameter, PriorRange } from './calibration.types';

/**
 * A parameter of a design that the bench can tell better than the drawing: how it maps onto the design
 * document (read, write), its unit, the search scale (log for quantities known to a factor, linear for
 * fractions) and the declared prior range for a design, or null where the design has no such part.
 */
export interface UncertainParameter {
  id: CalibrationParameterId;
  label: string;
  unit: string;
  /** Document path(s) the value is written to (several capacitors for a scale). */
  documentPath: string;
  scale: 'log' | 'linear';
  prior(design: Design): PriorRange | null;
  read(design: Design): number;
  write(design: Design, value: number): Design;
}

function driverOf(design: Design): DriverStage | null {
  return design.drive.kind === 'driver' ? design.drive.driver : null;
}

/**
 * The driver whose transformer is stated as numbers: a designed transformer (`transformerChoice: 'designed'`)
 * derives its coupling and winding resistances from its section, so those numbers are not the design's to fit.
 */
function givenTransformerDriver(design: Design): DriverStage | null {
  const driver = driverOf(design);
  return driver && driver.transformerChoice !== 'designed' ? driver : null;
}

function requireDriver(design: Design): DriverStage {
  const driver = driverOf(design);
  if (!driver) throw new DomainError('invalid_argument', 'The design has no driver stage', 'parameters');
  return driver;
}

/** A copy of the design with `edit` applied to the copy (the design is plain JSON). */
function edited(design: Design, edit: (copy: Design) => void): Design {
  const copy = JSON.parse(JSON.stringify(design)) as Design;
  edit(copy);
  return copy;
}

/** A range a factor below and above the nominal value (the nominal clamped to be positive). */
function around(nominal: number, below: number, above: number): PriorRange {
  return { min: nominal / below, max: nominal * above };
}

/** Read and write of one number of the driver's transformer (absent reads as 0). */
function transformerNumber(key: 'couplingCoefficient' | 'secondaryResistanceOhm' | 'secondaryCapacitanceF') {
  return {
    read: (design: Design) => requireDriver(design).transformer[key] ?? 0,
    write: (design: Design, value: number) =>
      edited(design, (copy) => {
        requireDriver(copy).transformer[key] = value;
      }),
  };
}

const declared: readonly UncertainParameter[] = [
  {
    id: 'couplingCoefficient',
    label: 'Transformer coupling k',
    unit: '',
    documentPath: 'drive.driver.transformer.couplingCoefficient',
    scale: 'linear',
    // Wound ferrite transformers of this kind couple at 0.9–0.995 (common practice, no source).
    prior: (design) => (givenTransformerDriver(design) ? { min: 0.85, max: 0.999 } : null),
    ...transformerNumber('couplingCoefficient'),
  },
  {
    id: 'transistorGain',
    label: 'Transistor current gain hFE',
    unit: '',
    documentPath: 'drive.driver.transistor.forwardBeta',
    scale: 'log',
    // Small switching transistors spread over 20–500 between parts and with current (common practice, no source).
    prior: (design) => (driverOf(design) ? { min: 20, max: 500 } : null),
    read: (design) => requireDriver(design).transistor.forwardBeta,
    write: (design, value) =>
      edited(design, (copy) => {
        requireDriver(copy).transistor.forwardBeta = value;
      }),
  },
  {
    id: 'cellInternalResistance',
    label: 'Cell internal resistance',
    unit: 'Ω',
    documentPath: 'drive.driver.supply.internalResistanceOhm',
    scale: 'log',
    // Fresh to nearly empty alkaline cells, 0.1–0.3 Ω rising past 1 Ω (REFERENCES.md §6, from memory).
    prior: (design) => (driverOf(design)?.supply.kind === 'cells' ? { min: 0.02, max: 3 } : null),
    read: (design) => {
      const supply = requireDriver(design).supply;
      return supply.kind === 'cells' ? supply.internalResistanceOhm : 0;
    },
    write: (design, value) =>
      edited(design, (copy) => {
        const supply = requireDriver(copy).supply;
        if (supply.kind === 'cells') supply.internalResistanceOhm = value;
      }),
  },
  {
    id: 'secondaryResistance',
    label: 'Secondary winding resistance',
    unit: 'Ω',
    documentPath: 'drive.driver.transformer.secondaryResistanceOhm',
    scale: 'log',
    prior: (design) => {
      const driver = givenTransformerDriver(design);
      return driver ? around(Math.max(driver.transformer.secondaryResistanceOhm, 1), 5, 5) : null;
    },
    ...transformerNumber('secondaryResistanceOhm'),
  },
  {
    id: 'secondarySelfCapacitance',
    label: 'Secondary self-capacitance',
    unit: 'F',
    documentPath: 'drive.driver.transformer.secondaryCapacitanceF',
    scale: 'linear',
    // A layer-wound secondary of a small step-up transformer: a few pF to some tens of pF (common practice,
    // no source); the range reaches twice the design's own value when that is larger.
    prior: (design) => {
      const driver = givenTransformerDriver(design);
      return driver ? { min: 0, max: Math.max(100e-12, 2 * (driver.transformer.secondaryCapacitanceF ?? 0)) } : null;
    },
    ...transformerNumber('secondaryCapacitanceF'),
  },
  {
    id: 'driveSourceResistance',
    label: 'Drive source resistance',
    unit: 'Ω',
    documentPath: 'drive.sourceResistanceOhm',
    scale: 'log',
    prior: (design) =>
      design.drive.kind === 'driver' ? null : around(Math.max(design.drive.sourceResistanceOhm, 1), 5, 5),
    read: (design) => (design.drive.kind === 'driver' ? 0 : design.drive.sourceResistanceOhm),
    write: (design, value) =>
      edited(design, (copy) => {
        if (copy.drive.kind !== 'driver') copy.drive.sourceResistanceOhm = value;
      }),
  },
  {
    id: 'diodeSaturationCurrent',
    label: 'Diode saturation current IS',
    unit: 'A',
    documentPath: 'multiplier.diode.saturationCurrentA',
    scale: 'log',
    prior: (design) => around(design.multiplier.diode.saturationCurrentA, 100, 100),
    read: (design) => design.multiplier.diode.saturationCurrentA,
    write: (design, value) =>
      edited(design, (copy) => {
        copy.multiplier.diode.saturationCurrentA = value;
      }),
  },
  {
    id: 'diodeSeriesResistance',
    label: 'Diode series resistance RS',
    unit: 'Ω',
    documentPath: 'multiplier.diode.seriesResistanceOhm',
    scale: 'log',
    prior: (design) => around(Math.max(design.multiplier.diode.seriesResistanceOhm, 1), 10, 10),
    read: (design) => design.multiplier.diode.seriesResistanceOhm,
    write: (design, value) =>
      edited(design, (copy) => {
        copy.multiplier.diode.seriesResistanceOhm = value;
      }),
  },
  {
    id: 'ladderStrayCapacitance',
    label: 'Ladder stray capacitance per node',
    unit: 'F',
    documentPath: 'multiplier.strayCapacitanceF',
    scale: 'linear',
    // A few pF per node for a compact ladder, more when potted (common practice, no source).
    prior: () => ({ min: 0, max: 20e-12 }),
    read: (design) => design.multiplier.strayCapacitanceF ?? 0,
    write: (design, value) =>
      edited(design, (copy) => {
        copy.multiplier.strayCapacitanceF = value;
      }),
  },
  {
    id: 'capacitanceScale',
    label: 'Ladder capacitance, share of nominal',
    unit: '',
    documentPath: 'multiplier.capacitors[*].valueF',
    scale: 'linear',
    // High-voltage ceramics lose a large share of their capacitance under DC bias (common practice, no source).
    prior: () => ({ min: 0.3, max: 1.3 }),
    read: () => 1,
    write: (design, value) =>
      edited(design, (copy) => {
        for (const capacitor of copy.multiplier.capacitors) capacitor.valueF *= value;
      }),
  },
  {
    id: 'bleederResistance',
    label: 'Bleeder resistor value',
    unit: 'Ω',
    documentPath: 'outputNetwork.bleeder.valueOhm',
    scale: 'log',
    // High-value resistors fall with applied voltage (voltage coefficient) and drift (common practice, no source).
    prior: (design) => {
      const bleeder = design.outputNetwork.bleeder;
      return bleeder ? around(bleeder.valueOhm, 2, 1.5) : null;
    },
    read: (design) => design.outputNetwork.bleeder?.valueOhm ?? 0,
    write: (design, value) =>
      edited(design, (copy) => {
        if (copy.outputNetwork.bleeder) copy.outputNetwork.bleeder.valueOhm = value;
      }),
  },
];

/** Every uncertain parameter the engine declares, in a stable order. */
export const uncertainParameters: readonly UncertainParameter[] = declared;

/** The declared parameter of an id; throws a DomainError naming `field` for an unknown id. */
export function uncertainParameter(id: string, field = 'parameters'): UncertainParameter {
  const found = declared.find((parameter) => parameter.id === id);
  if (!found) throw new DomainError('invalid_argument', `'${id}' is not a parameter the engine can fit`, field);
  return found;
}

/** The parameters that apply to a design, each with its declared prior range and the design's value. */
export function applicableParameters(design: Design): {
  id: CalibrationParameterId;
  label: string;
  unit: string;
  documentPath: string;
  prior: PriorRange;
  value: number;
}[] {
  return declared.flatMap((parameter) => {
    const prior = parameter.prior(design);
    if (!prior) return [];
    const { id, label, unit, documentPath } = parameter;
    return [{ id, label, unit, documentPath, prior, value: parameter.read(design) }];
  });
}

/**
 * Checks a choice of parameters for a design: each applies to it, none twice, and each prior range lies
 * within the declared one with min < max. Returns the parameters with their ranges; throws a DomainError
 * naming `parameters[i]` otherwise.
 */
export function checkChosenParameters(design: Design, chosen: readonly ChosenParameter[]): ChosenParameter[] {
  if (chosen.length === 0)
    throw new DomainError('invalid_argument', 'Choose at least one parameter to fit', 'parameters');
  const seen = new Set<string>();
  return chosen.map((choice, i) => {
    const field = `parameters[${i}]`;
    const parameter = uncertainParameter(choice.id, `${field}.id`);
    const declaredPrior = parameter.prior(design);
    if (!declaredPrior) {
      throw new DomainError('invalid_argument', `${parameter.label} does not apply to this design`, `${field}.id`);
    }
    if (seen.has(choice.id))
      throw new DomainError('invalid_argument', `${parameter.label} is chosen twice`, `${field}.id`);
    seen.add(choice.id);
    const { min, max } = choice.prior;
    const slack = 1e-9 * Math.max(Math.abs(declaredPrior.max), Math.abs(declaredPrior.min));
    if (!(Number.isFinite(min) && Number.isFinite(max) && min < max)) {
      throw new DomainError('invalid_argument', 'the prior range needs min below max', `${field}.prior`);
    }
    if (min < declaredPrior.min - slack || max > declaredPrior.max + slack) {
      throw new DomainError(
        'invalid_argument',
        `the prior range of ${parameter.label} must lie within ${declaredPrior.min} to ${declaredPrior.max} ${parameter.unit}`.trim(),
        `${field}.prior`,
      );
    }
    if (parameter.scale === 'log' && !(min > 0)) {
      throw new DomainError(
        'invalid_argument',
        `the prior range of ${parameter.label} must be positive`,
        `${field}.prior`,
      );
    }
    return { id: parameter.id, prior: { min, max } };
  });
}

/** The design with every chosen parameter set to its value (in the order given). */
export function applyParameterValues(
  design: Design,
  ids: readonly CalibrationParameterId[],
  values: readonly number[],
): Design {
  return ids.reduce((current, id, i) => uncertainParameter(id).write(current, values[i] as number), design);
}
