import { readdirSync } from 'node:fs';
import { extname, join, resolve } from 'node:path';
import express, { type Request, type Response, type Router } from 'express';

/** A year: the longest lifetime caches honour; a fingerprinted file never changes under its name. */
const IMMUTABLE = 'public, max-age=31536000, immutable';
/** The page that names the current fingerprints, and the API, must never be answered from a cache. */
export const NO_STORE = 'no-store';

/** Encodings the build writes beside each asset (`vite.config.ts`), best first. */
const PRECOMPRESSED = [
  { encoding: 'br', suffix: '.br' },
  { encoding: 'gzip', suffix: '.gz' },
] as const;

/** Vite names every emitted asset `<name>-<8-character content hash>.<ext>`. */
const FINGERPRINT = /-[A-Za-z0-9_-]{8}\.[a-z0-9]+$/;

function isFingerprinted(path: string): boolean {
  return path.startsWith('/assets/') && FINGERPRINT.test(path);
}

function cacheControlFor(path: string): string {
  if (extname(path) === '.html') return NO_STORE;
  // Anything else without a hash is revalidated by its entity tag on every use.
  return isFingerprinted(path) ? IMMUTABLE : 'no-cache';
}

/** The compressed variants present in `assets/` when the server starts, by the asset's URL path. */
function precompressedVariants(dir: string): Map<string, Set<string>> {
  const variants = new Map<string, Set<string>>();
  let names: string[];
  try {
    names = readdirSync(join(dir, 'assets'));
  } catch {
    return variants;
  }
  const present = new Set(names);
  for (const name of names) {
    for (const { encoding, suffix } of PRECOMPRESSED) {
      if (present.has(name + suffix)) {
        const path = `/assets/${name}`;
        if (!variants.has(path)) variants.set(path, new Set());
        variants.get(path)!.add(encoding);
      }
    }
  }
  return variants;
}

/**
 * The smallest encoding both the request accepts (q > 0) and the build wrote; none without an
 * Accept-Encoding header. Browsers list gzip before br at equal weight, so our order decides, not theirs.
 */
function chooseEncoding(req: Request, available: Set<string>): (typeof PRECOMPRESSED)[number] | undefined {
  if (!req.headers['accept-encoding']) return undefined;
  return PRECOMPRESSED.find((p) => available.has(p.encoding) && req.acceptsEncodings(p.encoding) === p.encoding);
}

/**
 * Serves the built client from `dir`: fingerprinted assets cached for a year
 * and sent as the brotli or gzip file written at build time when the browser
 * accepts it, `index.html` (directly or as the fallback of every client route)
 * never stored, and a missing asset a 404 rather than the page.
 */
export function staticClient(dir: string): Router {
  const root = resolve(dir);
  const variants = precompressedVariants(root);
  const router = express.Router();

  // Cross-origin isolation lets the Monte Carlo worker share a stop flag with the page (SharedArrayBuffer),
  // so Cancel stops the engine between blocks; everything the client loads is same-origin.
  router.use((_req, res, next) => {
    res.setHeader('Cross-Origin-Opener-Policy', 'same-origin');
    res.setHeader('Cross-Origin-Embedder-Policy', 'require-corp');
    next();
  });

  router.use('/assets', (req, res, next) => {
    if (req.method !== 'GET' && req.method !== 'HEAD') return next();
    const path = `/assets${req.path}`;
    const available = variants.get(path);
    if (!available) return next();
    res.vary('Accept-Encoding');
    const chosen = chooseEncoding(req, available);
    if (!chosen) return next();
    res.type(extname(path));
    res.setHeader('Content-Encoding', chosen.encoding);
    res.sendFile(path.slice(1) + chosen.suffix, { root, cacheControl: false, headers: { 'Cache-Control': cacheControlFor(path) } }, (err) => {
      if (!err) return;
      if (res.headersSent) return next(err);
      // The variant went away after start (a rebuild): fall back to the file itself.
      res.removeHeader('Content-Encoding');
      res.removeHeader('Content-Type');
      next((err as { status?: number }).status === 404 ? undefined : err);
    });
  });

  router.use(
    express.static(root, {
      index: false,
      cacheControl: false,
      setHeaders: (res: Response, file: string) => {
        res.setHeader(
          'Cache-Control',
          cacheControlFor(
            '/' +
              file
                .slice(root.length + 1)
                .split('\\')
                .join('/'),
          ),
        );
      },
    }),
  );

  // An asset the build did not write (a page opened before an update asking for an old chunk) is not the page.
  router.use('/assets', (_req, res) => {
    res.setHeader('Cache-Control', NO_STORE);
    res.status(404).type('text/plain').send('Not found');
  });

  router.get('/{*splat}', (_req, res) => {
    res.sendFile('index.html', { root, cacheControl: false, headers: { 'Cache-Control': NO_STORE } });
  });

  return router;
}
