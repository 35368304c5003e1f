/** A fresh live-analysis worker (a module worker Vite bundles with the shared engine). */
export function createLiveAnalysisWorker(): Worker {
  return new Worker(new URL('./live-analysis.worker.ts', import.meta.url), { type: 'module', name: 'live-analysis' });
}
