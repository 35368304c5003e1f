// Worker-thread entry of scripts/bench/calibration.bench.ts: one model evaluation of a calibration, with the
// run's time on its thread (ms), from which the bench reads how even the runs of a batch are.
import { predictDatasets, type CalibrationDataset } from '../../shared/src/calibration';
import type { Design } from '../../shared/src/designs/design.types';

export function predict(task: { design: Design; datasets: CalibrationDataset[] }): {
  predictions: number[][] | null;
  runMs: number;
} {
  const t0 = performance.now();
  const predictions = predictDatasets(task.design, task.datasets);
  return { predictions, runMs: performance.now() - t0 };
}
