import type { MethodInfo } from '../methods';

export const HIPOT_METHOD: MethodInfo = {
  methodId: 'insulation.hipot-2u-plus-1000',
  summary: 'Hipot test voltage 2·U + 1000 V, U the peak working voltage across the secondary-to-primary insulation.',
  assumptions: [
    'basic insulation',
    'U taken as the larger of the forward and flyback secondary peaks (one end of the secondary at ground)',
  ],
  source: 'common practice, no source',
};

/** Hipot test voltage (V) to ask for across insulation of peak working voltage `workingPeakV`: 2·U + 1000 V. */
export function hipotTestVoltageV(workingPeakV: number): number {
  return 2 * Math.abs(workingPeakV) + 1000;
}
