/*
 * Client size benchmark (part of npm run bench; alone: npm run bench:client).
 * Builds the client into a temporary folder, then for each route adds up the
 * JavaScript the browser must fetch before the page is usable: what the built
 * index.html loads (its module script and modulepreloads) plus the route's
 * chunks (for a signed-in page, the signed-in frame's too) and every chunk
 * they import statically, from Vite's manifest. Dynamic
 * imports (the histogram's chart library) and Web Workers are listed apart:
 * they arrive after the page is on screen. Sizes are of the files as written
 * and gzip level 9 (what the server sends a browser without brotli); brotli is
 * what most browsers receive. Prints PASS/MISS per target; never exits with an
 * error for a MISS.
 */
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

interface ManifestChunk {
  file: string;
  src?: string;
  isEntry?: boolean;
  imports?: string[];
  dynamicImports?: string[];
  css?: string[];
  assets?: string[];
}
type Manifest = Record<string, ManifestChunk>;

const root = fileURLToPath(new URL('..', import.meta.url));
const KB = 1000;

/** The signed-in frame (navigation, sign-in check), which the router loads lazily before any signed-in page. */
const SHELL = 'src/app/shell.tsx';
/** Routes, the modules the router loads lazily for each, and the target for their JavaScript, gzipped. */
const ROUTES = [
  { route: '/sign-in', modules: ['src/features/auth/components/SignInPage.tsx'], targetKb: 150 },
  { route: '/budgets', modules: [SHELL, 'src/features/budgets/components/BudgetsListPage.tsx'], targetKb: null },
  { route: '/budgets/:id (editor)', modules: [SHELL, 'src/app/routes/editor-route.tsx'], targetKb: 350 },
];

/** Packages that must not reach a page's first JavaScript, and the routes they must stay out of. */
const KEPT_OUT = [
  { what: 'engine (mathjs)', pattern: /node_modules\/mathjs\//, routes: ['/sign-in', '/budgets'] },
  { what: 'chart library (plotly)', pattern: /node_modules\/(plotly\.js|react-plotly)/, routes: ['/sign-in', '/budgets', '/budgets/:id (editor)'] },
];

async function buildClient(outDir: string): Promise<Map<string, string[]>> {
  const { build } = await import('vite');
  const output = await build({ root, logLevel: 'error', build: { outDir, emptyOutDir: true, manifest: true } });
  const outputs = Array.isArray(output) ? output : [output];
  // Which source modules went into which chunk, to say what a route's JavaScript contains.
  const modulesOf = new Map<string, string[]>();
  for (const o of outputs) {
    if (!('output' in o)) continue;
    for (const item of o.output)
      if (item.type === 'chunk')
        modulesOf.set(
          item.fileName,
          item.moduleIds.map((id) => id.split('\\').join('/')),
        );
  }
  return modulesOf;
}

/** The JavaScript files the built page loads at once: its module scripts and modulepreload links. */
function filesOfIndexHtml(outDir: string): string[] {
  const html = readFileSync(join(outDir, 'index.html'), 'utf8');
  const files: string[] = [];
  for (const m of html.matchAll(/<script[^>]*type="module"[^>]*src="\/([^"]+)"/g)) files.push(m[1]);
  for (const m of html.matchAll(/<link[^>]*rel="modulepreload"[^>]*href="\/([^"]+)"/g)) files.push(m[1]);
  return files;
}

/** A manifest entry's file and the files of everything it imports statically, transitively. */
function staticClosure(manifest: Manifest, key: string, into = new Set<string>()): Set<string> {
  const chunk = manifest[key];
  if (!chunk) throw new Error(`${key} is not in the build manifest: the router no longer loads it lazily`);
  if (into.has(chunk.file)) return into;
  into.add(chunk.file);
  for (const imported of chunk.imports ?? []) staticClosure(manifest, imported, into);
  return into;
}

interface Size {
  raw: number;
  gzip: number;
  brotli: number;
}

function sizeOf(outDir: string, files: Iterable<string>): Size {
  const total = { raw: 0, gzip: 0, brotli: 0 };
  for (const f of files) {
    const body = readFileSync(join(outDir, f));
    total.raw += body.length;
    total.gzip += gzipSync(body, { level: 9 }).length;
    total.brotli += brotliCompressSync(body, { params: { [constants.BROTLI_PARAM_QUALITY]: 9 } }).length;
  }
  return total;
}

const kb = (bytes: number) => (bytes / KB).toFixed(1).padStart(8);
const verdict = (ok: boolean) => (ok ? 'PASS' : 'MISS');

const outDir = mkdtempSync(join(tmpdir(), 'dubito-client-size-'));
const nodeEnv = process.env.NODE_ENV;
try {
  const modulesOf = await buildClient(outDir);
  process.env.NODE_ENV = nodeEnv;
  const manifest = JSON.parse(readFileSync(join(outDir, '.vite', 'manifest.json'), 'utf8')) as Manifest;
  const page = filesOfIndexHtml(outDir);

  console.log('\nClient size: JavaScript a route needs before it is usable (kB = 1000 bytes)\n');
  console.log(`${'route'.padEnd(24)}${'files'.padStart(6)}${'raw kB'.padStart(9)}${'gzip kB'.padStart(9)}${'br kB'.padStart(9)}   target (gzip)`);
  const filesOfRoute = new Map<string, Set<string>>();
  for (const { route, modules, targetKb } of ROUTES) {
    const files = new Set(page);
    for (const module of modules) staticClosure(manifest, module, files);
    filesOfRoute.set(route, files);
    const s = sizeOf(outDir, files);
    const target = targetKb === null ? '' : `≤ ${targetKb} kB  ${verdict(s.gzip <= targetKb * KB)}`;
    console.log(`${route.padEnd(24)}${String(files.size).padStart(6)} ${kb(s.raw)} ${kb(s.gzip)} ${kb(s.brotli)}   ${target}`);
  }

  console.log('\nLoaded later, apart from the figures above');
  const editor = manifest['src/app/routes/editor-route.tsx'];
  for (const key of editor.dynamicImports ?? []) {
    const s = sizeOf(outDir, staticClosure(manifest, key));
    console.log(`  ${`${key.split('/').pop()} (when a chart is shown)`.padEnd(44)} ${kb(s.raw)} raw ${kb(s.gzip)} gzip ${kb(s.brotli)} br`);
  }
  for (const worker of (editor.assets ?? []).filter((f) => /worker.*\.js$/.test(f))) {
    const s = sizeOf(outDir, [worker]);
    console.log(`  ${`${worker.replace(/^assets\//, '')} (Web Worker)`.padEnd(44)} ${kb(s.raw)} raw ${kb(s.gzip)} gzip ${kb(s.brotli)} br`);
  }

  console.log('\nKept out of the first JavaScript');
  for (const { what, pattern, routes } of KEPT_OUT) {
    for (const route of routes) {
      const found = [...filesOfRoute.get(route)!].filter((f) => (modulesOf.get(f) ?? []).some((id) => pattern.test(id)));
      console.log(`  ${what} in ${route}: ${found.length ? found.join(', ') : 'none'}  ${verdict(found.length === 0)}`);
    }
  }
} finally {
  process.env.NODE_ENV = nodeEnv;
  rmSync(outDir, { recursive: true, force: true });
}
