/** A fresh Sizer worker (a module worker Vite bundles with the shared engine). */
export function createSizerWorker(): Worker {
  return new Worker(new URL('./sizer.worker.ts', import.meta.url), { type: 'module', name: 'sizer' });
}
