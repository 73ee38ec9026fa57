import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

export default defineConfig({
  plugins: [react(), tailwindcss()],
  worker: { format: 'es' },
  optimizeDeps: { include: ['mathjs', 'plotly.js-basic-dist-min', 'react-plotly.js/factory'] },
  server: { proxy: { '/api': 'http://localhost:3000' } },
  build: { outDir: 'dist', chunkSizeWarningLimit: 2000 },
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
