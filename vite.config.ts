import { readFile, writeFile } from 'node:fs/promises';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { brotliCompress, constants, gzip } from 'node:zlib';
import { defineConfig, type Plugin } from 'vitest/config';
import react from '@vitejs/plugin-react';
import tailwindcss from '@tailwindcss/vite';

const brotli = promisify(brotliCompress);
const gzipped = promisify(gzip);

/** Text files worth compressing; fonts (woff2) and images are compressed already. */
const COMPRESSIBLE = /\.(js|mjs|css|svg|json|wasm)$/;
/** Below a network packet or so, compression saves nothing. */
const COMPRESS_FROM_BYTES = 1024;

/**
 * Writes `<file>.br` and `<file>.gz` beside every compressible emitted file
 * under `assets/`, once per build, so the server sends the smallest form
 * without compressing on each request (`server/http/static-client.ts`).
 * Brotli quality 9 comes within about 10 % of quality 11 in a tenth of the time.
 */
function precompress(): Plugin {
  return {
    name: 'dubito-precompress',
    apply: 'build',
    async writeBundle(options, bundle) {
      const dir = options.dir!;
      const files = Object.keys(bundle).filter((f) => f.startsWith('assets/') && COMPRESSIBLE.test(f));
      await Promise.all(
        files.map(async (file) => {
          const path = join(dir, file);
          const body = await readFile(path);
          if (body.length < COMPRESS_FROM_BYTES) return;
          const [br, gz] = await Promise.all([brotli(body, { params: { [constants.BROTLI_PARAM_QUALITY]: 9, [constants.BROTLI_PARAM_SIZE_HINT]: body.length } }), gzipped(body, { level: 9 })]);
          await Promise.all([writeFile(`${path}.br`, br), writeFile(`${path}.gz`, gz)]);
        }),
      );
    },
  };
}

/** The font files every page's first paint uses: the Latin text face and the Latin regular of the figures. */
const FIRST_PAINT_FONTS = [/^assets\/inter-latin-wght-normal-[\w-]+\.woff2$/, /^assets\/jetbrains-mono-latin-400-normal-[\w-]+\.woff2$/];

/**
 * Preloads the fonts of the first paint from `index.html`: named only in the stylesheet, they were
 * asked for once the page's text was laid out, so the first frames were set in the fallback face
 * and laid out again when the font arrived.
 */
function preloadFirstPaintFonts(): Plugin {
  return {
    name: 'dubito-preload-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler: (_html, { bundle }) =>
        Object.keys(bundle ?? {})
          .filter((file) => FIRST_PAINT_FONTS.some((font) => font.test(file)))
          .map((file) => ({ tag: 'link', attrs: { rel: 'preload', href: `/${file}`, as: 'font', type: 'font/woff2', crossorigin: '' }, injectTo: 'head' as const })),
    },
  };
}

export default defineConfig({
  plugins: [react(), tailwindcss(), precompress(), preloadFirstPaintFonts()],
  worker: { format: 'es' },
  optimizeDeps: { include: ['mathjs', 'plotly.js-basic-dist-min', 'react-plotly.js/factory'] },
  // Same cross-origin isolation as the server, so the Monte Carlo worker can share its stop flag.
  server: {
    proxy: { '/api': 'http://localhost:3000' },
    headers: { 'Cross-Origin-Opener-Policy': 'same-origin', 'Cross-Origin-Embedder-Policy': 'require-corp' },
  },
  // The manifest maps each source module to its chunk and the chunks it imports: the size benchmark reads it.
  build: {
    outDir: 'dist',
    chunkSizeWarningLimit: 2000,
    manifest: true,
    rolldownOptions: {
      output: {
        codeSplitting: {
          groups: [
            {
              // The small modules that only signed-in pages use (the policy, the figures and their formats, status words and badge, the
              // breadcrumb, the review hooks) in one file: split by which pages share them they were seven files of 0.2 to 4.5 kB, and
              // the editor waited for each on one of the six connections a browser opens to the server.
              name: 'signed-in',
              test: /(shared\/policy\/(policy|version-status)|shared\/format\/(digit-groups|significant-digits|superscript|signs)|shared\/gum\/rounding|shared\/presentation\/(figures|status)|src\/app\/ui\/(numbers|breadcrumb)|src\/budget\/components\/StatusBadge|src\/features\/reviews\/api\/reviews)\.tsx?$/,
              includeDependenciesRecursively: false,
            },
          ],
        },
      },
    },
  },
  test: {
    include: ['tests/**/*.test.ts'],
    testTimeout: 60_000,
    hookTimeout: 60_000,
  },
});
