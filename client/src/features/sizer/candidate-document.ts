import type { Design } from '@ladderwright/shared/designs';
import type { SizerCandidate, SizerRequest } from '@ladderwright/shared/sizing';

/** A design document (schema 1) for one Sizer candidate: its ladder, diode and bleeder, the request's drive and targets. */
export function candidateDocument(candidate: SizerCandidate, request: SizerRequest, name: string): Design {
  const { costEach: _diodeCost, ...diode } = candidate.diode;
  const bleeder = candidate.bleeder;
  return {
    schemaVersion: 1,
    name,
    notes: `From the Sizer: rank ${candidate.rank}, ${candidate.topology}, ${candidate.cellCount} cells, ${candidate.grading} capacitors.`,
    drive: request.drive,
    multiplier: {
      topology: candidate.topology,
      cellCount: candidate.cellCount,
      capacitors: candidate.capacitorsF.map((valueF, i) => {
        const partCode = candidate.capacitorPartCodes[i];
        return {
          valueF,
          tolerance: 0.1,
          ratedVoltageV: candidate.capacitorRatedV[i] ?? 1000,
          ...(partCode ? { partCode } : {}),
        };
      }),
      diode,
    },
    outputNetwork: {
      bleeder: bleeder
        ? {
            count: bleeder.count,
            valueOhm: bleeder.resistor.valueOhm,
            ratedPowerW: bleeder.resistor.ratedPowerW,
            limitingVoltageV: bleeder.resistor.limitingVoltageV,
            ...(bleeder.resistor.partCode ? { partCode: bleeder.resistor.partCode } : {}),
          }
        : null,
      seriesOutputResistanceOhm: 0,
    },
    load: { kind: 'current', currentA: request.loadCurrentA },
    targets: {
      outputV: request.targetOutputV,
      rippleMaxV: request.rippleMaxV,
      loadCurrentA: request.loadCurrentA,
      safeVoltageV: request.safeVoltageV ?? 50,
      dischargeRule: request.dischargeRule ?? '50V-1min',
      spacing: { pollutionDegree: 2, materialGroup: 'IIIa', pcb: true },
    },
  };
}
