import { defineConfig, defaultClientConditions } from 'vite';
import react from '@vitejs/plugin-react';

/** Where `vite` (dev) forwards `/api`: the NestJS server on its default port. */
const apiTarget = 'http://127.0.0.1:8080';

export default defineConfig({
  plugins: [react()],
  resolve: {
    // `source` makes `@ladderwright/shared/*` resolve to its TypeScript sources instead of shared/dist.
    conditions: ['source', ...defaultClientConditions],
  },
  server: {
    host: '127.0.0.1',
    port: 5173,
    proxy: { '/api': { target: apiTarget, changeOrigin: false } },
  },
  // The Sizer worker is an ES module (it shares chunks with the page, e.g. the engine).
  worker: { format: 'es' },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    // dist/.vite/manifest.json: which chunks each route loads (scripts/bench/workbench.mjs reads it).
    manifest: true,
    rolldownOptions: {
      output: {
        // Libraries change less often than our code: separate chunks stay cached across releases.
        codeSplitting: {
          groups: [
            {
              name: 'vendor-react',
              test: /node_modules[\\/](react|react-dom|scheduler|react-router|react-router-dom)[\\/]/,
            },
            { name: 'vendor-query', test: /node_modules[\\/]@tanstack[\\/]/ },
          ],
        },
      },
    },
  },
});
