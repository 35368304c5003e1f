// Worker-thread entry of scripts/bench/calibration.bench.ts: one model evaluation of a calibration.
import { predictDatasets, type CalibrationDataset } from '../../shared/src/calibration';
import type { Design } from '../../shared/src/designs/design.types';

export function predict(task: { design: Design; datasets: CalibrationDataset[] }): number[][] | null {
  return predictDatasets(task.design, task.datasets);
}
