import { describe, expect, it } from 'vitest';
import { EPSILON0, layerCapacitanceF } from '../../src/transformer';

// W. G. Hurley, W. H. Wölfle, Transformers and Inductors for Power Electronics: Theory, Design and Applications,
// Wiley, 2013, §8.4.2, Eq. (8.35) and Example 8.10, pp. 239–244 (read in a full-text copy in a public
// repository). The two layers of a 39-turn primary (two 0.5 mm wires in parallel) on a mean diameter of
// 21.858 mm, 20 mm long, 0.1 mm of tape and two 0.034 mm wire insulations between them, taken as parallel plates
// of relative permittivity 3.8 throughout: Cs = 273 pF ("this does not take the air medium created by the wire
// shape into account"; the book divides by 0.169 mm).
const meanTurnLengthM = Math.PI * 21.858e-3;
const breadthM = 20e-3;

describe('the capacitance between two layers (Hurley & Wölfle, 2013, Example 8.10)', () => {
  it('gives the book’s 273 pF as parallel plates once the permittivity is the book’s 3.8', () => {
    // The engine's sheets, with no wire (copper and overall diameter 0) and the whole 0.169 mm as tape, hold the
    // engine's tape permittivity 3.2 (common practice, no source); the book takes 3.8 for all of it.
    const engineF = layerCapacitanceF({
      meanTurnLengthM,
      breadthM,
      copperDiameterM: 0,
      overallDiameterM: 0,
      tapeM: 0.169e-3,
    });
    expect(engineF * (3.8 / 3.2) * 1e12).toBeCloseTo(273.4, 1);
    expect(Math.round(engineF * (3.8 / 3.2) * 1e12)).toBe(273);
  });

  it('counts what the book leaves out: the air of the round wire’s shape lowers the layer capacitance', () => {
    // The same two layers with the wire itself: 0.5 mm copper, 0.034 mm insulation each, 0.1 mm of tape. The
    // engine adds d·(1 − π/4) of air per layer of round wire (a sheet of the wire's copper area), so the
    // capacitance falls to about a third of the book's plates. Which is nearer a measured winding is not
    // settled here: no measured multilayer winding could be read (see the references in DEVELOPERS.md).
    const withWireF = layerCapacitanceF({
      meanTurnLengthM,
      breadthM,
      copperDiameterM: 0.5e-3,
      overallDiameterM: 0.568e-3,
      tapeM: 0.1e-3,
    });
    const gapM = 0.1e-3 / 3.2 + 0.068e-3 / 3.5 + 0.5e-3 * (1 - Math.PI / 4);
    expect(withWireF).toBeCloseTo((EPSILON0 * meanTurnLengthM * breadthM) / gapM, 18);
    expect(withWireF * 1e12).toBeLessThan(273 / 3);
  });
});
