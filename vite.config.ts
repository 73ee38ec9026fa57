import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  worker: { format: 'es' },
  optimizeDeps: { include: ['mathjs', 'plotly.js-basic-dist-min', 'react-plotly.js/factory'] },
  // Same cross-origin isolation as the server, so the Monte Carlo worker can share its stop flag.
  server: {
    proxy: { '/api': 'http://localhost:3000' },
    headers: { 'Cross-Origin-Opener-Policy': 'same-origin', 'Cross-Origin-Embedder-Policy': 'require-corp' },
  },
  build: { outDir: 'dist', chunkSizeWarningLimit: 2000 },
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
