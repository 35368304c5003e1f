import { describe, expect, it } from 'vitest';
import { driverPeriodGuessS } from '../../src/runs/driver-design-circuit';
import { runDriverDesign } from '../../src/runs/driver-runs';
import { ngspiceDriverFigures, supply } from './driver-comparison';
import { hasNgspice } from './run-ngspice';

// Outside reference: ngspice (REFERENCES.md §7) on the exported netlist. The app's own run (runDriverDesign:
// warm start, settling windows and the recorded cycles, all delimited by the live turn-on trigger) of a
// saturation-limited 3 V supply: the core saturates at 20 mA, the primary current ramps on to ~75 mA, and
// after each turn-off the collector and the primary current ring through the supply and through half the peak
// several times. A trigger that re-armed on every collector ring read ~570 kHz here (or recorded less than
// one whole cycle); ngspice, continuing from the ladder state where our run ended, runs at ~121 kHz.
const saturating = supply('3 V cells, saturation-limited core (20 mA)', (d) => {
  d.transformer.saturationCurrentA = 0.02;
});

describe.skipIf(!hasNgspice())('the app’s driver run against ngspice', () => {
  it('reads a saturation-limited oscillator’s frequency within 3 % and its output within 1 % of ngspice', async () => {
    const { design } = saturating;
    if (design.drive.kind !== 'driver') throw new Error('a driver design');
    const run = runDriverDesign(design);
    expect(run.isSettled).toBe(true);
    expect(run.figures).not.toBeNull();
    // ngspice from the ladder state our run ended in, read over whole cycles after 30 estimated periods
    // (the transformer starts without current, so the first periods are a restart; with the estimate's
    // period at ~10 µs against the ~8.3 µs run, the restart's last uneven cycles still fall after 20).
    const periodS = driverPeriodGuessS(design.drive.driver);
    const spice = await ngspiceDriverFigures(design, run.finalCapacitorVoltagesV, {
      fromS: 30 * periodS,
      stopS: 70 * periodS,
    });
    expect(spice.isIrregular).toBe(false);
    expect(Math.abs(run.oscillationFrequencyHz! / spice.frequencyHz - 1)).toBeLessThan(0.03);
    expect(Math.abs(run.outputMeanV / spice.outputMeanV - 1)).toBeLessThan(0.01);
    // Every recorded cycle is a whole conduction cycle, not a ring: the record spans the cycles it counts.
    expect(run.figures!.cycles).toBeGreaterThanOrEqual(3);
  }, 240_000);
});
