import { isDomainError } from '../errors';
import { fitParameters, leastSquaresCost, toValue, type BatchModel, type FitParameter } from './fit-parameters';

/** Rounds of the search for one end of one interval (each round one batch of model runs or inner fits). */
const MAX_ROUNDS = 10;
/** An end is found when its profile t is within this share of the critical value. */
const T_TOLERANCE = 0.01;
/** Iterations of an inner fit of the other parameters with one held. */
const INNER_ITERATIONS = 8;

export interface ProfileInput {
  parameters: readonly FitParameter[];
  target: readonly number[];
  model: BatchModel;
  /** The optimum in the fit's coordinates (u ∈ [0, 1] per prior range) and its cost. */
  u: readonly number[];
  cost: number;
  /** Residual variance s² of the fit and the two-sided Student t critical value at m − p degrees of freedom. */
  residualVariance: number;
  tCritical: number;
  /** Where to look first for each end, in u (the linearized half-width t·se), or null where none is known. */
  halfWidthGuessesU: readonly (number | null)[];
  /** Finite-difference step of the inner fits (u). */
  stepU: number;
  /** Parameters to leave without an interval (the data do not see them). */
  skip?: readonly number[];
}

/** One interval in the parameter's own unit, and whether an end stopped at its prior range. */
export interface ProfileInterval {
  low: number;
  high: number;
  isLowAtPrior: boolean;
  isHighAtPrior: boolean;
}

/** One end's search: a bracket [inside, outside] of distances from the optimum in u, with their profile t. */
interface EndSearch {
  j: number;
  side: 1 | -1;
  room: number;
  inside: { d: number; t: number };
  outside: { d: number; t: number } | null;
  next: number;
  done: boolean;
  /** The end found (or the bracket's interpolated crossing so far), as a distance from the optimum. */
  end: number;
}

/**
 * Profile-likelihood intervals of a least-squares fit (Bates & Watts, *Nonlinear Regression Analysis and Its
 * Applications*, 1988, §6.1, profile t; Seber & Wild, *Nonlinear Regression*, §5.4; both from memory): for
 * parameter j held at θⱼ, S̃(θⱼ) is the least cost over the others; the profile t is
 * τ(θⱼ) = sign(θⱼ − θ̂ⱼ)·√(S̃(θⱼ) − S(θ̂))/s, and the 1 − α interval is where |τ| ≤ t(m − p, α/2), i.e. where
 * the cost rises by less than s²·t² (the F(1, m − p) threshold). Unlike ±t·se from the Jacobian it reads the
 * cost itself, so it stays valid where the cost is not quadratic near the optimum, such as a waveform's, which
 * is V-shaped where an edge moves past a sample. Each end is found outward from the optimum: a first guess at
 * the linearized half-width, widened until τ passes t (or the prior range ends, which then bounds the
 * interval), then regula falsi on τ (linear in θ for a linear model), each point kept a tenth of the bracket
 * off its ends so that every round shrinks it. All ends search
 * together, one batch of model runs (or, with more than one parameter, of inner fits of the others) a round.
 */
export async function profileIntervals(input: ProfileInput): Promise<(ProfileInterval | null)[]> {
  const { parameters, target, model, u, cost, residualVariance, tCritical } = input;
  const p = parameters.length;
  const s = Math.sqrt(residualVariance);
  const profileT = (profileCost: number) =>
    Number.isFinite(profileCost) ? Math.sqrt(Math.max(0, profileCost - cost)) / s : Infinity;
  const searches: EndSearch[] = [];
  parameters.forEach((_, j) => {
    if (input.skip?.includes(j) || !(s > 0)) return;
    for (const side of [-1, 1] as const) {
      const room = side < 0 ? (u[j] as number) : 1 - (u[j] as number);
      const guess = input.halfWidthGuessesU[j];
      const first = guess !== null && guess !== undefined && guess > 0 ? guess : 0.05;
      searches.push({
        j,
        side,
        room,
        inside: { d: 0, t: 0 },
        outside: null,
        next: Math.min(first, room),
        done: room <= 0,
        end: 0,
      });
    }
  });

  /** The profile cost at each (parameter, u) of a round. */
  const profileCosts = async (requests: { j: number; uj: number }[]): Promise<number[]> => {
    if (p === 1) {
      const answers = await model(requests.map(({ uj }) => [toValue(parameters[0] as FitParameter, uj)]));
      return answers.map((answer) => leastSquaresCost(target, answer));
    }
    return Promise.all(requests.map(({ j, uj }) => innerFitCost(input, j, uj)));
  };

  for (let round = 0; round < MAX_ROUNDS; round += 1) {
    const open = searches.filter((search) => !search.done);
    if (open.length === 0) break;
    const costs = await profileCosts(
      open.map((search) => ({ j: search.j, uj: (u[search.j] as number) + search.side * search.next })),
    );
    open.forEach((search, k) => {
      const t = profileT(costs[k] as number);
      const point = { d: search.next, t };
      if (t <= tCritical) search.inside = point;
      else search.outside = point;
      if (Math.abs(t - tCritical) <= T_TOLERANCE * tCritical) {
        search.done = true;
        search.end = point.d;
        return;
      }
      if (!search.outside) {
        if (search.inside.d >= search.room) {
          search.done = true;
          search.end = search.room;
          return;
        }
        // Widen: τ grows about linearly with the distance, so aim past the crossing by a tenth, 1.5–4 times out.
        const aim = t > 0 ? (search.inside.d * tCritical * 1.1) / t : 4 * search.inside.d;
        search.next = Math.min(search.room, Math.max(1.5 * search.inside.d, Math.min(aim, 4 * search.inside.d)));
        return;
      }
      const { inside, outside } = search;
      const outsideT = Number.isFinite(outside.t) ? outside.t : tCritical * 4;
      const fraction = (tCritical - inside.t) / Math.max(outsideT - inside.t, 1e-12);
      const width = outside.d - inside.d;
      // Keep the next point off the bracket's ends, so that each round shrinks it.
      const next = inside.d + width * Math.min(0.9, Math.max(0.1, fraction));
      search.end = inside.d + width * Math.min(1, Math.max(0, fraction));
      search.next = next;
      if (width <= 1e-3 * Math.max(outside.d, 1e-12)) search.done = true;
    });
  }
  return parameters.map((parameter, j) => {
    const ends = searches.filter((search) => search.j === j);
    if (ends.length !== 2) return null;
    const [low, high] = ends as [EndSearch, EndSearch];
    // An end never bracketed (the rounds ran out while widening) stays at the farthest point inside.
    const endOf = (search: EndSearch) => (search.outside || search.done ? search.end : search.inside.d);
    const lowD = endOf(low);
    const highD = endOf(high);
    const uj = u[j] as number;
    const values = [toValue(parameter, uj - lowD), toValue(parameter, uj + highD)].sort((a, b) => a - b);
    return {
      low: values[0] as number,
      high: values[1] as number,
      isLowAtPrior: !low.outside && lowD >= low.room,
      isHighAtPrior: !high.outside && highD >= high.room,
    };
  });
}

/** The least cost over the other parameters with parameter j held at uj (an inner fit from the optimum). */
async function innerFitCost(input: ProfileInput, j: number, uj: number): Promise<number> {
  const { parameters, target, model, u } = input;
  const others = parameters.flatMap((parameter, k) =>
    k === j ? [] : [{ ...parameter, initialValue: toValue(parameter, u[k] as number) }],
  );
  const held = toValue(parameters[j] as FitParameter, uj);
  try {
    const outcome = await fitParameters(
      others,
      target,
      (valueSets) => model(valueSets.map((values) => [...values.slice(0, j), held, ...values.slice(j)])),
      { maxIterations: INNER_ITERATIONS, stepU: input.stepU, relativeTolerance: 1e-6, finalJacobian: false },
    );
    return outcome.costAfter;
  } catch (error) {
    if (isDomainError(error) && error.code === 'not_converged') return Infinity;
    throw error;
  }
}
