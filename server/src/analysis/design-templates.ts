import type { DesignTemplate } from '@ladderwright/shared/api';
import { designExamples, type Design, type DiodePart } from '@ladderwright/shared/designs';

/** The demo designs of the Northfold scenario offered as starting points, keyed by a stable id. */
export const DESIGN_TEMPLATES: readonly DesignTemplate[] = Object.entries(designExamples).map(([id, document]) => ({
  id,
  name: document.name,
  summary: document.notes,
  document,
}));

/** The detector-bias demo diode without its part code: a small fast HV diode, a neutral first choice. */
function blankDiode(): DiodePart {
  const { partCode: _partCode, ...diode } = designExamples.detectorBias.multiplier.diode;
  return diode;
}

/**
 * Revision 1 of a design created "blank": a plain doubler on a sine secondary with round values, valid
 * and analysable, for the engineer to overwrite. Values are illustrative (common practice, no source).
 */
export function blankDocument(name: string): Design {
  const capacitor = { valueF: 10e-9, tolerance: 0.1, ratedVoltageV: 1000 };
  return {
    schemaVersion: 1,
    name,
    notes: '',
    drive: { kind: 'sine', peakV: 300, frequencyHz: 20e3, sourceResistanceOhm: 100 },
    multiplier: {
      topology: 'half-wave',
      cellCount: 2,
      capacitors: [{ ...capacitor }, { ...capacitor }],
      diode: blankDiode(),
    },
    outputNetwork: {
      bleeder: { count: 1, valueOhm: 100e6, ratedPowerW: 0.25, limitingVoltageV: 1000 },
      seriesOutputResistanceOhm: 0,
    },
    load: { kind: 'current', currentA: 10e-6 },
    targets: {
      outputV: 550,
      rippleMaxV: 5,
      loadCurrentA: 10e-6,
      safeVoltageV: 50,
      dischargeRule: '60V-5s',
      spacing: { pollutionDegree: 2, materialGroup: 'IIIa', pcb: true },
    },
  };
}
