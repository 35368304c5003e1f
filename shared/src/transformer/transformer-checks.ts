import type { SpacingEnvironment } from '../designs/design.types';
import { resultFieldLabel } from '../designs/field-labels';
import type { CheckVerdict } from '../safety/check.types';
import { CREEPAGE_METHOD_TEXT, creepageColumn, requiredCreepageMm } from '../safety/creepage';
import { lowerLimitVerdict } from '../safety/hazard-limits';
import type { WindingResult } from './transformer.types';
import { MIN_MANUFACTURABLE_GAP_M, gapManufacturable } from './gap';
import { WINDOW_UTILIZATION_LIMIT } from './winding-layout';

/** Upper-limit verdict: pass at ≤ passFraction·limit, marginal up to the limit, fail past it. */
function upperLimit(
  fields: Omit<CheckVerdict, 'verdict' | 'marginPct' | 'value'> & { value: number },
  passFraction: number,
): CheckVerdict {
  const verdict =
    fields.value <= passFraction * fields.limit ? 'pass' : fields.value <= fields.limit ? 'marginal' : 'fail';
  return { ...fields, verdict, marginPct: ((fields.limit - fields.value) / fields.limit) * 100 };
}

/**
 * A check's subject naming what it checks, from the shared result labels, so that two checks of one part read
 * apart: "core, peak flux density", "core, gap length".
 */
function subjectOf(part: string, resultKey: string): string {
  const label = resultFieldLabel(`transformer.${resultKey}`).label;
  return `${part}, ${label.charAt(0).toLowerCase()}${label.slice(1)}`;
}

/** Flux, temperature and window figures of the section, as the checks read them. */
export interface TransformerCheckFigures {
  peakFluxDensityT: number;
  saturationFluxDensityT: number;
  temperatureRiseC: number;
  ambientTemperatureC: number;
  windowFill: number;
  buildFill: number;
  windings: readonly WindingResult[];
  hipotTestVoltageV: number;
  windingInsulationV: number;
  secondaryWorkingVoltageV: number;
  flangeCreepageM: number;
  /** Length of the air gap (m), 0 for an ungapped pair. */
  gapM: number;
  /** A target primary inductance the gap was to reach (from a target AL or inductance), and what it reaches. */
  inductanceTarget?: { targetH: number; reachedH: number };
}

/** Core temperature the saturation figure is judged at and the rise is held below (°C). */
export const CORE_TEMPERATURE_LIMIT_C = 100;

/**
 * Checks of the designed transformer: core saturation margin at 100 °C, core temperature rise, window fill
 * and bobbin build, a gap long enough to be made, layer-to-layer insulation of each layered winding, winding-to-winding insulation against
 * the hipot voltage, and creepage along the bobbin flange (IEC 60664-1 Table F.4 from the working voltage).
 */
export function transformerChecks(figures: TransformerCheckFigures, spacing: SpacingEnvironment): CheckVerdict[] {
  const checks: CheckVerdict[] = [
    upperLimit(
      {
        id: 'transformer.core-saturation',
        subject: subjectOf('core', 'peakFluxDensityT'),
        rule: 'peak flux density ≤ Bsat of the material at 100 °C; pass at ≤ 80 % (common practice, no source)',
        value: figures.peakFluxDensityT,
        limit: figures.saturationFluxDensityT,
        unit: 'T',
      },
      0.8,
    ),
    upperLimit(
      {
        id: 'transformer.temperature-rise',
        subject: subjectOf('core', 'temperatureRiseC'),
        rule: `temperature rise ≤ ${CORE_TEMPERATURE_LIMIT_C} °C − ambient ${figures.ambientTemperatureC} °C (the temperature the saturation margin is judged at), McLyman's surface-area rule; pass at ≤ 80 % (common practice, no source)`,
        value: figures.temperatureRiseC,
        limit: Math.max(1e-9, CORE_TEMPERATURE_LIMIT_C - figures.ambientTemperatureC),
        unit: '°C',
      },
      0.8,
    ),
    upperLimit(
      {
        id: 'transformer.window-fill',
        subject: subjectOf('windings', 'windowFill'),
        rule: `copper area ≤ ${WINDOW_UTILIZATION_LIMIT * 100} % of the window (window utilization Ku, McLyman, Transformer and Inductor Design Handbook, 3rd ed., ch. 4); pass at ≤ 90 % of it`,
        value: figures.windowFill * 100,
        limit: WINDOW_UTILIZATION_LIMIT * 100,
        unit: '%',
      },
      0.9,
    ),
    upperLimit(
      {
        id: 'transformer.bobbin-build',
        subject: subjectOf('windings', 'buildFill'),
        rule: 'build of windings and tapes ≤ the bobbin height; pass at ≤ 90 % (room for winding tolerance, common practice, no source)',
        value: figures.buildFill * 100,
        limit: 100,
        unit: '%',
      },
      0.9,
    ),
  ];
  if (figures.gapM > 0) {
    const limitMm = MIN_MANUFACTURABLE_GAP_M * 1000;
    checks.push({
      id: 'transformer.gap-length',
      subject: subjectOf('core', 'gap.gapM'),
      rule: `air gap ≥ ${limitMm} mm, the shortest gap ground or spaced to a tolerance; more primary turns or a core of lower AL lengthen it (Power Integrations AN-18, Transformer Gapping)`,
      verdict: gapManufacturable(figures.gapM) ? 'pass' : 'fail',
      marginPct: ((figures.gapM * 1000 - limitMm) / limitMm) * 100,
      value: figures.gapM * 1000,
      limit: limitMm,
      unit: 'mm',
    });
  }
  if (figures.inductanceTarget) {
    const { targetH, reachedH } = figures.inductanceTarget;
    // Within 1 % of the target (the gap is found by bisection; an ungapped core holds no more than its own AL).
    const limitH = 0.99 * targetH;
    checks.push({
      id: 'transformer.inductance-target',
      subject: subjectOf('core', 'primaryInductanceH'),
      rule: 'primary inductance within 1 % of the target the gap is set for; an ungapped core gives no more than AL·N² (more turns or a core of higher AL)',
      verdict: reachedH >= limitH ? 'pass' : 'fail',
      marginPct: ((reachedH - limitH) / limitH) * 100,
      value: reachedH,
      limit: limitH,
      unit: 'H',
    });
  }
  for (const winding of figures.windings) {
    if (winding.layers < 2) continue;
    checks.push(
      upperLimit(
        {
          id: `transformer.layer-insulation.${winding.role}`,
          subject: `${winding.name}, layer insulation`,
          rule: 'voltage between adjacent layers ≤ breakdown of both enamels and the layer tape; pass at ≤ 50 % (common practice, no source)',
          value: winding.layerToLayerV,
          limit: winding.layerInsulationV,
          unit: 'V',
        },
        0.5,
      ),
    );
  }
  checks.push(
    upperLimit(
      {
        id: 'transformer.winding-insulation',
        subject: 'secondary to the other windings',
        rule: 'hipot test voltage (2·U + 1000 V) ≤ breakdown of the winding tape between the secondary and its neighbours; pass at ≤ 80 % (common practice, no source)',
        value: figures.hipotTestVoltageV,
        limit: Math.max(1e-9, figures.windingInsulationV),
        unit: 'V',
      },
      0.8,
    ),
  );
  const workingV = Math.max(1, figures.secondaryWorkingVoltageV);
  const column = creepageColumn({ ...spacing, pcb: false }, workingV);
  checks.push(
    lowerLimitVerdict({
      id: 'transformer.flange-creepage',
      subject: 'bobbin flange',
      rule: `creepage along the bobbin flange ≥ the IEC 60664-1 figure at the secondary's working voltage ${workingV.toFixed(0)} V, column ${column} (${CREEPAGE_METHOD_TEXT})`,
      value: figures.flangeCreepageM * 1000,
      limit: requiredCreepageMm(workingV, column),
      unit: 'mm',
    }),
  );
  return checks;
}
