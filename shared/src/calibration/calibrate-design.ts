import type { Design } from '../designs/design.types';
import { DomainError, isDomainError } from '../errors';
import { checkCalibrationData, thinPoints } from './calibration-data';
import {
  fittedValueOf,
  modelKindOf,
  predictDataset,
  waveformProbeOf,
  type SimulatorRunOptions,
} from './calibration-models';
import type {
  CalibrationDataset,
  CalibrationResult,
  ChosenParameter,
  FittedParameter,
  IdentifiabilityWarning,
} from './calibration.types';
import { fitParameters, toValue, type BatchModel, type FitOptions, type FitParameter } from './fit-parameters';
import { profileIntervals } from './profile-intervals';
import { CORRELATION_WARNING, fitStatistics } from './fit-statistics';
import { applyParameterValues, checkChosenParameters, uncertainParameter } from './uncertain-parameters';

/**
 * Start points per fitted parameter of a fit with a waveform (see FitOptions.startPoints): a waveform's
 * sample cost has narrow valleys (the tester's collector over 1.2 periods: coupling 0.95's valley is about
 * ±0.01 wide, with another near 0.98–0.99), and 16 points over a prior range of 0.85–0.999 fall 0.009 apart.
 */
export const WAVEFORM_START_POINTS_PER_PARAMETER = 16;

/** Confidence of the reported intervals unless a caller asks for another. */
export const DEFAULT_CONFIDENCE = 0.95;

export interface CalibrationInput {
  design: Design;
  parameters: ChosenParameter[];
  datasets: CalibrationDataset[];
  confidence?: number;
}

/**
 * Predictions of every dataset for each design of a batch (same order), or null for a design the models
 * have no answer for. The designs of one call are independent: a server hands them to its worker pool.
 */
export type DesignBatchPredictor = (designs: Design[]) => Promise<(number[][] | null)[]>;

/**
 * The predictions of every dataset for one design, in this thread; null when the engine or the simulator
 * refuses the design (a parameter set outside what the models can solve). A cancel still throws.
 */
export function predictDatasets(
  design: Design,
  datasets: readonly CalibrationDataset[],
  options: SimulatorRunOptions = {},
): number[][] | null {
  try {
    const predictions = datasets.map((dataset) => predictDataset(design, dataset, options));
    return predictions.every((values) => values.every(Number.isFinite)) ? predictions : null;
  } catch (error) {
    if (isDomainError(error) && error.code !== 'cancelled') return null;
    throw error;
  }
}

/** A predictor that evaluates the batch here, one design after another. */
export function inProcessPredictor(
  options: SimulatorRunOptions = {},
): (datasets: readonly CalibrationDataset[]) => DesignBatchPredictor {
  return (datasets) => (designs) =>
    Promise.resolve(designs.map((design) => predictDatasets(design, datasets, options)));
}

/** The datasets a calibration reads: each run thinned to the points a fit can use. */
export function preparedDatasets(datasets: readonly CalibrationDataset[]): CalibrationDataset[] {
  return datasets.map((dataset) => ({ ...dataset, points: thinPoints(dataset.points) }));
}

function rms(values: readonly number[]): number {
  return values.length ? Math.sqrt(values.reduce((sum, v) => sum + v * v, 0) / values.length) : 0;
}

/**
 * Fits the chosen uncertain parameters of a design to its bench runs (see `fitParameters`) and reports
 * each fitted value with its confidence interval (`fitStatistics`), the residual of each run before and
 * after, the correlation matrix and identifiability warnings, and the curves to overlay. Residuals are
 * measured − predicted magnitudes, each run divided by its largest |measured| so that runs of different
 * sizes weigh alike. Bad data throw a DomainError naming the run and the column before any fit.
 */
export async function calibrateDesign(
  input: CalibrationInput,
  makePredictor: (datasets: readonly CalibrationDataset[]) => DesignBatchPredictor,
  options: Omit<FitOptions, 'stepU'> = {},
): Promise<CalibrationResult> {
  const { design } = input;
  const confidence = input.confidence ?? DEFAULT_CONFIDENCE;
  if (!(confidence > 0.5 && confidence < 1)) {
    throw new DomainError('invalid_argument', 'confidence must lie between 0.5 and 1', 'confidence');
  }
  const chosen = checkChosenParameters(design, input.parameters);
  const datasets = preparedDatasets(input.datasets);
  checkCalibrationData(design, datasets, chosen.length);
  const declared = chosen.map((choice) => uncertainParameter(choice.id));
  const ids = chosen.map((choice) => choice.id);
  const fitParametersList: FitParameter[] = chosen.map((choice, j) => ({
    prior: choice.prior,
    scale: (declared[j] as (typeof declared)[number]).scale,
    initialValue: (declared[j] as (typeof declared)[number]).read(design),
  }));
  const scales = datasets.map((dataset) => Math.max(...dataset.points.map((point) => Math.abs(point.y)), 1e-12));
  const target = datasets.flatMap((dataset, d) =>
    dataset.points.map((point) => fittedValueOf(dataset.use, point.y) / (scales[d] as number)),
  );
  const predictor = makePredictor(datasets);
  const normalized = (predictions: number[][]) =>
    predictions.flatMap((values, d) => values.map((v) => v / (scales[d] as number)));
  const usesSimulator = datasets.some((dataset) => modelKindOf(dataset.use) === 'simulator');
  const usesWaveform = datasets.some((dataset) => waveformProbeOf(dataset.use) !== null);

  const fitModel: BatchModel = async (valueSets) => {
    if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The calibration was cancelled');
    const answers = await predictor(valueSets.map((values) => applyParameterValues(design, ids, values)));
    return answers.map((answer) => (answer ? normalized(answer) : null));
  };
  const stepU = usesSimulator ? 1e-2 : 1e-3;
  let profileEvaluations = 0;
  const outcome = await fitParameters(fitParametersList, target, fitModel, {
    // A simulator's runs are long and go to a pool: each step goes out with the Jacobian's columns, and after
    // a refused step as many damping values as an iteration has runs (p + 1), so that a pool that runs an
    // iteration in one round runs them in one round too, and the path does not depend on the pool.
    ...(usesSimulator ? { overlapJacobian: true, dampingTrials: chosen.length + 1 } : {}),
    ...options,
    stepU,
    ...(usesWaveform ? { startPoints: WAVEFORM_START_POINTS_PER_PARAMETER * chosen.length } : {}),
  });

  const residuals = target.map((y, i) => y - (outcome.prediction[i] as number));
  const statistics = fitStatistics(outcome.jacobian, residuals, chosen.length, confidence);
  // A waveform's cost is V-shaped where an edge moves past a sample, so its intervals are read from the cost
  // itself (profile likelihood); elsewhere the Jacobian's (the cost is smooth and near quadratic there).
  const profiles =
    usesWaveform && !statistics.isNearSingular
      ? await profileIntervals({
          parameters: fitParametersList,
          target,
          model: async (valueSets) => {
            profileEvaluations += valueSets.length;
            return fitModel(valueSets);
          },
          u: outcome.u,
          cost: outcome.costAfter,
          residualVariance: statistics.residualVariance,
          tCritical: statistics.tCritical,
          halfWidthGuessesU: statistics.standardErrors.map((se) =>
            se === null || se === undefined ? null : statistics.tCritical * se,
          ),
          stepU,
          skip: statistics.insensitive,
        })
      : null;
  const parameters: FittedParameter[] = chosen.map((choice, j) => {
    const parameter = declared[j] as (typeof declared)[number];
    const fit = fitParametersList[j] as FitParameter;
    const se = statistics.standardErrors[j];
    const uj = outcome.u[j] as number;
    const profile = profiles?.[j];
    // An end of ±t·se past the prior range stops at the range's end: the fit's bounds are the prior range, and
    // outside it the model is not what the interval describes (a log scale there would read thousands).
    const ends = profile
      ? [profile.low, profile.high]
      : se === null || se === undefined
        ? null
        : [
            toValue(fit, Math.max(0, uj - statistics.tCritical * se)),
            toValue(fit, Math.min(1, uj + statistics.tCritical * se)),
          ].sort((a, b) => a - b);
    return {
      id: choice.id,
      label: parameter.label,
      unit: parameter.unit,
      prior: choice.prior,
      initialValue: fit.initialValue,
      value: outcome.values[j] as number,
      interval: ends ? { low: ends[0] as number, high: ends[1] as number } : null,
      intervalMethod: profile ? 'profile' : 'linearized',
      isAtBound: uj <= 1e-9 || uj >= 1 - 1e-9,
    };
  });
  const labelOf = (j: number) => (parameters[j] as FittedParameter).label;
  const warnings: IdentifiabilityWarning[] = [
    ...statistics.insensitive.map((j) => ({
      kind: 'insensitive' as const,
      parameterIds: [ids[j] as (typeof ids)[number]],
      correlation: null,
      message: `${labelOf(j)} does not change the predicted curves of these runs; it cannot be fitted from them`,
    })),
    ...statistics.correlatedPairs.map(({ i, j, correlation }) => ({
      kind: 'correlated' as const,
      parameterIds: [ids[i] as (typeof ids)[number], ids[j] as (typeof ids)[number]],
      correlation,
      message: `${labelOf(i)} and ${labelOf(j)} are not separately identifiable from these runs (correlation ${correlation.toFixed(3)}, beyond ±${CORRELATION_WARNING}); fix one of them or add a run that tells them apart`,
    })),
    ...(statistics.isNearSingular
      ? [
          {
            kind: 'near-singular' as const,
            parameterIds: [...ids],
            correlation: null,
            message:
              'The data determine only a combination of these parameters (JᵀJ is near-singular); no intervals are given',
          },
        ]
      : []),
  ];

  let offset = 0;
  const perDataset = datasets.map((dataset, d) => {
    const n = dataset.points.length;
    const scale = scales[d] as number;
    const before = outcome.initialPrediction.slice(offset, offset + n).map((v) => v * scale);
    const after = outcome.prediction.slice(offset, offset + n).map((v) => v * scale);
    offset += n;
    const measured = dataset.points.map((point) => fittedValueOf(dataset.use, point.y));
    return {
      residual: {
        benchRunId: dataset.benchRunId,
        label: dataset.label,
        use: dataset.use,
        model: modelKindOf(dataset.use),
        pointCount: n,
        rmsBeforeV: rms(measured.map((y, i) => y - (before[i] as number))),
        rmsAfterV: rms(measured.map((y, i) => y - (after[i] as number))),
      },
      curve: {
        benchRunId: dataset.benchRunId,
        label: dataset.label,
        use: dataset.use,
        x: dataset.points.map((point) => (waveformProbeOf(dataset.use) ? point.x : Math.abs(point.x))),
        measuredV: measured,
        predictedV: before,
        calibratedV: after,
      },
    };
  });
  return {
    parameters,
    correlation: statistics.correlation,
    warnings,
    residuals: perDataset.map((entry) => entry.residual),
    curves: perDataset.map((entry) => entry.curve),
    costBefore: outcome.costBefore,
    costAfter: outcome.costAfter,
    degreesOfFreedom: statistics.degreesOfFreedom,
    confidence,
    iterations: outcome.iterations,
    evaluations: outcome.evaluations + profileEvaluations,
    isConverged: outcome.isConverged,
  };
}

/** The design with the fitted values written in: the draft of the next revision from a calibration. */
export function calibratedDesign(design: Design, result: Pick<CalibrationResult, 'parameters'>): Design {
  return applyParameterValues(
    design,
    result.parameters.map((parameter) => parameter.id),
    result.parameters.map((parameter) => parameter.value),
  );
}
