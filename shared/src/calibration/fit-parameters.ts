import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { DomainError } from '../errors';
import type { PriorRange } from './calibration.types';

/** A parameter as the fit moves it: u ∈ [0, 1] over its prior range, linearly or on a log scale. */
export interface FitParameter {
  prior: PriorRange;
  scale: 'log' | 'linear';
  initialValue: number;
}

/**
 * The model of a fit: for each set of parameter values (physical units) the predictions at every point,
 * in the same normalized units as the target, or null where the model has no answer at those values (the
 * fit then treats the set as infinitely bad). All sets of one call are independent, so a caller may
 * evaluate them in parallel (the Jacobian columns are one call).
 */
export type BatchModel = (valueSets: number[][]) => Promise<(number[] | null)[]>;

/** The first primes: the bases of the Halton sequence's coordinates. */
const HALTON_BASES = [2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37];

/** Radical inverse of k in `base` (the Halton sequence's coordinate). */
function radicalInverse(k: number, base: number): number {
  let result = 0;
  let fraction = 1 / base;
  for (let i = k; i > 0; i = Math.floor(i / base)) {
    result += (i % base) * fraction;
    fraction /= base;
  }
  return result;
}

/**
 * `count` points spread over the unit cube [0, 1]^p: for one parameter an even grid with half-cells at the
 * ends, else the Halton sequence from its first point (a low-discrepancy set, deterministic; Halton 1960,
 * from memory).
 */
export function startPoints(p: number, count: number): number[][] {
  if (count <= 0) return [];
  if (p === 1) return Array.from({ length: count }, (_, k) => [(k + 0.5) / count]);
  return Array.from({ length: count }, (_, k) =>
    Array.from({ length: p }, (_, j) => radicalInverse(k + 1, HALTON_BASES[j % HALTON_BASES.length] as number)),
  );
}

export interface FitOptions {
  /**
   * Points over the prior ranges evaluated with the design's own values, in one batch, before the first
   * step; the fit starts from the best of them (default none). For a cost with several valleys, such as a
   * waveform's samples, where a local fit from the design's values can stop in the wrong one.
   */
  startPoints?: number;
  maxIterations?: number;
  /** Finite-difference step in u (default 1e-3; a simulator's answer needs a larger one, e.g. 1e-2). */
  stepU?: number;
  /** Stop when an accepted step lowers the cost by less than this fraction (default 1e-9). */
  relativeTolerance?: number;
  /**
   * Overlap each iteration's trial step with its Jacobian (default false): the step is proposed from the
   * Jacobian of the previous point brought up to date along the last step (Broyden's rank-one secant update),
   * and goes out in one batch with the fresh Jacobian's columns at the current point, which the next step's
   * update starts from. So a pool of p + 1 workers runs one round of model runs an iteration instead of two
   * (Jacobian, then step), and no run is thrown away: every column is read by the next update, and a step the
   * secant Jacobian gets wrong is retried on the fresh one at the same damping, which each refused retry updates
   * along its own step. The path differs from the plain fit's only in the Jacobian each step is proposed from.
   */
  overlapJacobian?: boolean;
  /**
   * Damping values tried at once after a refused step, from the fresh Jacobian (default 1): λ, 11λ, 121λ, …
   * go out in one batch and the fit takes the first, in that order, that lowers the cost (without
   * overlapJacobian exactly the one-at-a-time search's path). A fixed number, not the pool's size, so the path
   * is the same on any pool; a pool that wide runs the tail of refused steps near the optimum (where a
   * finite-difference Jacobian's error leaves no step that lowers the cost and the fit stops after eight)
   * in a few rounds instead of eight.
   */
  dampingTrials?: number;
  /** Evaluate the central-difference Jacobian at the optimum for the statistics (default true). */
  finalJacobian?: boolean;
  onProgress?: (fraction: number) => void;
  shouldCancel?: () => boolean;
}

export interface FitOutcome {
  values: number[];
  u: number[];
  /** m × p, ∂prediction/∂u at the optimum (central differences where the bounds allow); empty when not asked for. */
  jacobian: number[][];
  initialPrediction: number[];
  prediction: number[];
  costBefore: number;
  costAfter: number;
  iterations: number;
  evaluations: number;
  isConverged: boolean;
}

export function toValue(parameter: FitParameter, u: number): number {
  const { min, max } = parameter.prior;
  return parameter.scale === 'log' ? min * (max / min) ** u : min + u * (max - min);
}

export function toU(parameter: FitParameter, value: number): number {
  const { min, max } = parameter.prior;
  const u = parameter.scale === 'log' ? Math.log(value / min) / Math.log(max / min) : (value - min) / (max - min);
  return Number.isFinite(u) ? u : 0;
}

/** Sum of squared differences of a prediction from the target; Infinity for no answer or a non-finite sum. */
export function leastSquaresCost(target: readonly number[], prediction: readonly number[] | null): number {
  if (!prediction) return Infinity;
  let sum = 0;
  for (let i = 0; i < target.length; i += 1) sum += ((target[i] as number) - (prediction[i] as number)) ** 2;
  return Number.isFinite(sum) ? sum : Infinity;
}

/**
 * Broyden's rank-one update of a Jacobian along a step: B = J + (Δf − J·s)·sᵀ / (sᵀs), the least change of J
 * (Frobenius norm) that maps the step s onto the change of the prediction Δf it caused (Broyden, Math. Comp.
 * 19, 577–593, 1965; its use inside Levenberg–Marquardt: Madsen, Nielsen & Tingleff, *Methods for Non-Linear
 * Least Squares Problems*, 2004, §3.4; both from memory). m × p in, m × p out.
 */
export function secantJacobian(move: { jacobian: number[][]; step: number[]; change: number[] }): number[][] {
  const { jacobian, step, change } = move;
  const norm = step.reduce((sum, sj) => sum + sj * sj, 0);
  if (!(norm > 0)) return jacobian;
  return jacobian.map((row, i) => {
    const predicted = row.reduce((sum, dij, j) => sum + dij * (step[j] as number), 0);
    const miss = ((change[i] as number) - predicted) / norm;
    return row.map((dij, j) => dij + miss * (step[j] as number));
  });
}

/**
 * Bounded Levenberg–Marquardt fit of `parameters` so that `model` matches `target` in least squares.
 * Each step is ml-levenberg-marquardt's (damped normal equations solved by Cholesky, clamped to the
 * bounds), taken one iteration at a time with the Jacobian we hand it: our loop evaluates the Jacobian's
 * columns as one batch (in parallel where the model allows), accepts a step only when it lowers the cost
 * and otherwise raises the damping (×11, down ×9 on success, the package's factors). Coordinates are
 * u ∈ [0, 1] over each prior range, so the bounds are the prior ranges. With `startPoints` the first step
 * starts from the best of those points and the design's values; the cost "before" stays the design's.
 */
export async function fitParameters(
  parameters: readonly FitParameter[],
  target: readonly number[],
  model: BatchModel,
  options: FitOptions = {},
): Promise<FitOutcome> {
  const p = parameters.length;
  const m = target.length;
  if (m < p + 1 || m < 2) throw new DomainError('invalid_argument', 'Too few points for the parameters', 'runs');
  const maxIterations = options.maxIterations ?? 30;
  const stepU = options.stepU ?? 1e-3;
  const tolerance = options.relativeTolerance ?? 1e-9;
  const valuesOf = (u: readonly number[]) => u.map((ui, j) => toValue(parameters[j] as FitParameter, ui));
  let evaluations = 0;
  // The answers at every point run so far: the model is deterministic, so a point is never run twice (the
  // central Jacobian at the optimum reuses the forward columns the last step was proposed from).
  const answered = new Map<string, number[] | null>();
  const evaluate = async (us: number[][]): Promise<(number[] | null)[]> => {
    if (options.shouldCancel?.()) throw new DomainError('cancelled', 'The calibration was cancelled');
    const keys = us.map((at) => at.join(' '));
    const fresh = us.filter((_, k) => !answered.has(keys[k] as string) && keys.indexOf(keys[k] as string) === k);
    if (fresh.length > 0) {
      evaluations += fresh.length;
      const answers = await model(fresh.map(valuesOf));
      fresh.forEach((at, k) => answered.set(at.join(' '), answers[k] ?? null));
    }
    return keys.map((key) => answered.get(key) ?? null);
  };

  let u = parameters.map((parameter) => Math.min(1, Math.max(0, toU(parameter, parameter.initialValue))));
  /** The one-sided steps at `at` (forward unless the bound is within a step) and the points they reach. */
  const stepsAt = (at: readonly number[]) => at.map((uj) => (uj + stepU <= 1 ? stepU : -stepU));
  const shifted = (at: readonly number[], signs: readonly number[]) =>
    signs.map((h, j) => at.map((ui, k) => (k === j ? ui + h : ui)));
  const jacobianAt = async (at: number[], atPrediction: number[]): Promise<number[][]> => {
    const steps = stepsAt(at);
    return jacobianFrom(at, atPrediction, steps, await evaluate(shifted(at, steps)));
  };
  /** The one-sided Jacobian at `at` from the answers at its steps; a step without an answer is tried the other way. */
  const jacobianFrom = async (
    at: number[],
    atPrediction: number[],
    steps: number[],
    forward: (number[] | null)[],
  ): Promise<number[][]> => {
    const missing = forward.flatMap((answer, j) => (answer ? [] : [j]));
    const retried = missing.length
      ? await evaluate(
          missing.map(
            (j) =>
              shifted(
                at,
                steps.map((h) => -h),
              )[j] as number[],
          ),
        )
      : [];
    const columns = forward.map((answer, j) => {
      const h = answer ? (steps[j] as number) : -(steps[j] as number);
      const values = answer ?? retried[missing.indexOf(j)] ?? null;
      return values ? values.map((v, i) => (v - (atPrediction[i] as number)) / h) : Array<number>(m).fill(0);
    });
    return Array.from({ length: m }, (_, i) => columns.map((column) => column[i] as number));
  };

  const starts = startPoints(p, options.startPoints ?? 0);
  // Without start points the first batch carries the Jacobian's columns at the design's values too.
  const firstSteps = starts.length === 0 ? stepsAt(u) : null;
  const [first, ...others] = await evaluate([u, ...starts, ...(firstSteps ? shifted(u, firstSteps) : [])]);
  if (!first) {
    throw new DomainError(
      'not_converged',
      "The model has no answer at the design's own values; check the design",
      'parameters',
    );
  }
  let prediction = first;
  const initialPrediction = first;
  const costBefore = leastSquaresCost(target, first);
  let currentCost = costBefore;
  others.slice(0, starts.length).forEach((answer, k) => {
    const startCost = leastSquaresCost(target, answer);
    if (answer && startCost < currentCost) {
      u = starts[k] as number[];
      prediction = answer;
      currentCost = startCost;
    }
  });
  const firstJacobian = firstSteps ? await jacobianFrom(u, prediction, firstSteps, others) : null;

  const propose = (jacobian: number[][], damping: number): number[] | null => {
    let proposal: number[] | null = null;
    const x = Array.from({ length: m }, (_, i) => i);
    levenbergMarquardt(
      { x, y: [...target] },
      (values: number[]) => {
        if (values.every((v, j) => v === u[j])) return (i: number) => prediction[i] as number;
        proposal = [...values];
        return () => NaN;
      },
      {
        initialValues: [...u],
        minValues: Array<number>(p).fill(0),
        maxValues: Array<number>(p).fill(1),
        damping,
        maxIterations: 1,
        errorTolerance: 0,
        jacobianFunction: () => (i: number) => jacobian[i] as number[],
      },
    );
    return proposal;
  };

  /**
   * The Jacobian the statistics read, at the optimum: central differences (u ± step) where both lie in
   * [0, 1], so that the curvature over the step does not bias the slopes (a forward difference's error is
   * of the step's order, a central one's of its square); else the one-sided column as above.
   */
  const centralJacobianAt = async (at: number[], atPrediction: number[]): Promise<number[][]> => {
    const twoSided = at.map((uj) => uj - stepU >= 0 && uj + stepU <= 1);
    const columns = twoSided.flatMap((both, j) => (both ? [j] : []));
    if (columns.length === 0) return jacobianAt(at, atPrediction);
    const shift = (j: number, h: number) => at.map((ui, k) => (k === j ? ui + h : ui));
    const answers = await evaluate(columns.flatMap((j) => [shift(j, stepU), shift(j, -stepU)]));
    const oneSided = twoSided.some((both) => !both) ? await jacobianAt(at, atPrediction) : null;
    const central = new Map<number, number[]>();
    columns.forEach((j, c) => {
      const up = answers[2 * c];
      const down = answers[2 * c + 1];
      if (up && down)
        central.set(
          j,
          up.map((v, i) => (v - (down[i] as number)) / (2 * stepU)),
        );
    });
    const fallback = central.size < columns.length && !oneSided ? await jacobianAt(at, atPrediction) : oneSided;
    return Array.from({ length: m }, (_, i) =>
      at.map((_, j) => central.get(j)?.[i] ?? (((fallback as number[][])[i] as number[])[j] as number)),
    );
  };

  // The Jacobian fresh at the current u, or null once a step has moved u; with overlapJacobian, the last
  // fresh one and the step since, from which the next step's secant Jacobian is made.
  let jacobian: number[][] | null = firstJacobian ?? (await jacobianAt(u, prediction));
  let lastMove: { jacobian: number[][]; step: number[]; change: number[] } | null = null;
  let damping = 1e-2;
  let iterations = 0;
  let isConverged = false;
  const dampingTrials = Math.max(1, Math.floor(options.dampingTrials ?? 1));
  const isAcceptable = (answer: number[] | null | undefined): answer is number[] =>
    !!answer && leastSquaresCost(target, answer) < currentCost;
  const hasMoved = (proposal: number[] | null): proposal is number[] =>
    !!proposal && proposal.some((v, j) => Math.abs(v - (u[j] as number)) >= 1e-10);
  while (iterations < maxIterations) {
    iterations += 1;
    let accepted: { u: number[]; prediction: number[]; damping: number } | null = null;
    let attempts = 0;
    if (!jacobian && lastMove) {
      // One batch: the step from the secant Jacobian, and the fresh columns here.
      const proposal = propose(secantJacobian(lastMove), damping);
      const steps = stepsAt(u);
      const [answer, ...forward] = await evaluate([...(hasMoved(proposal) ? [proposal] : []), ...shifted(u, steps)]);
      const columns = hasMoved(proposal) ? forward : [answer ?? null, ...forward];
      jacobian = await jacobianFrom(u, prediction, steps, columns);
      // A refused secant step may be the secant Jacobian's fault: the fresh one tries the same damping first.
      if (hasMoved(proposal)) {
        attempts += 1;
        if (isAcceptable(answer)) accepted = { u: proposal, prediction: answer, damping };
      }
    }
    let current: number[][] = jacobian ?? (await jacobianAt(u, prediction));
    /** With overlapJacobian a refused retry still teaches the Jacobian the change along it (secant update). */
    const learnFrom = (proposal: number[], answer: number[] | null | undefined) => {
      if (!options.overlapJacobian || !answer) return;
      current = secantJacobian({
        jacobian: current,
        step: proposal.map((v, j) => v - (u[j] as number)),
        change: answer.map((v, i) => v - (prediction[i] as number)),
      });
    };
    while (!accepted && attempts < 8) {
      // A step's first try is one damping value; after a refusal, the ladder of dampingTrials values.
      const width = attempts === 0 ? 1 : dampingTrials;
      const dampings = Array.from({ length: Math.min(width, 8 - attempts) }, (_, k) =>
        Math.min(damping * 11 ** k, 1e7),
      );
      const proposals: number[][] = [];
      for (const trial of dampings) {
        const proposal = propose(current, trial);
        if (!hasMoved(proposal)) break;
        proposals.push(proposal);
      }
      if (proposals.length === 0) break;
      const answers = await evaluate(proposals);
      attempts += proposals.length;
      const k = answers.findIndex(isAcceptable);
      if (k < 0) proposals.forEach((proposal, i) => learnFrom(proposal, answers[i]));
      if (k >= 0)
        accepted = { u: proposals[k] as number[], prediction: answers[k] as number[], damping: dampings[k] as number };
      else damping = Math.min((dampings[proposals.length - 1] as number) * 11, 1e7);
    }
    options.onProgress?.(iterations / maxIterations);
    if (!accepted) {
      isConverged = true;
      break;
    }
    const acceptedCost = leastSquaresCost(target, accepted.prediction);
    const improvement = (currentCost - acceptedCost) / Math.max(currentCost, 1e-300);
    damping = Math.max(accepted.damping / 9, 1e-7);
    lastMove = options.overlapJacobian
      ? {
          jacobian: current,
          step: accepted.u.map((v, j) => v - (u[j] as number)),
          change: accepted.prediction.map((v, i) => v - (prediction[i] as number)),
        }
      : null;
    u = accepted.u;
    prediction = accepted.prediction;
    currentCost = acceptedCost;
    jacobian = null;
    if (improvement < tolerance) {
      isConverged = true;
      break;
    }
  }
  const finalJacobian = options.finalJacobian === false ? [] : await centralJacobianAt(u, prediction);
  options.onProgress?.(1);
  return {
    values: valuesOf(u),
    u,
    jacobian: finalJacobian,
    initialPrediction,
    prediction,
    costBefore,
    costAfter: currentCost,
    iterations,
    evaluations,
    isConverged,
  };
}
