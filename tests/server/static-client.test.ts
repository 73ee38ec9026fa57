import { mkdirSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliCompressSync, gzipSync } from 'node:zlib';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, startTestServer, tempDir, type TestServer } from './helpers';

/*
 * A fake built client: index.html, a fingerprinted chunk with the brotli and
 * gzip files the build writes beside it, and a fingerprinted stylesheet
 * without them. Bodies are distinct text, so a test can tell which file came.
 */
const INDEX = '<!doctype html><html><head><script type="module" src="/assets/index-Ab3dE_9z.js"></script></head><body><div id="root"></div></body></html>';
const CHUNK = `export const pages = [${Array.from({ length: 400 }, (_, i) => `"page ${i}"`).join(',')}];\n`;
const STYLES = `.row { padding: 0.25rem; }\n`.repeat(200);

let s: TestServer;
beforeAll(async () => {
  const dist = tempDir();
  mkdirSync(join(dist, 'assets'));
  writeFileSync(join(dist, 'index.html'), INDEX);
  writeFileSync(join(dist, 'assets', 'index-Ab3dE_9z.js'), CHUNK);
  // Written with a marker inside, so the answer proves the pre-compressed file was sent, not the plain one compressed anew.
  writeFileSync(join(dist, 'assets', 'index-Ab3dE_9z.js.br'), brotliCompressSync(`${CHUNK}// br\n`));
  writeFileSync(join(dist, 'assets', 'index-Ab3dE_9z.js.gz'), gzipSync(`${CHUNK}// gz\n`));
  writeFileSync(join(dist, 'assets', 'index-Qw7rT2yU.css'), STYLES);
  s = await startTestServer({ staticDir: dist });
});
afterAll(async () => {
  await s?.stop();
});

const IMMUTABLE = 'public, max-age=31536000, immutable';

describe('the built client is sent compressed', () => {
  it('sends the brotli file written at build time to a browser that accepts brotli', async () => {
    const res = await s.anonymous().get('/assets/index-Ab3dE_9z.js').set('Accept-Encoding', 'gzip, deflate, br').expect(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.headers['content-type']).toMatch(/^text\/javascript/);
    expect(res.headers.vary).toMatch(/Accept-Encoding/i);
    expect(res.text).toBe(`${CHUNK}// br\n`);
  });

  it('sends the gzip file to a browser that accepts gzip only', async () => {
    const res = await s.anonymous().get('/assets/index-Ab3dE_9z.js').set('Accept-Encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.text).toBe(`${CHUNK}// gz\n`);
    const brotliRefused = await s.anonymous().get('/assets/index-Ab3dE_9z.js').set('Accept-Encoding', 'br;q=0, gzip').expect(200);
    expect(brotliRefused.headers['content-encoding']).toBe('gzip');
  });

  it('sends the plain file to a client that asks for no encoding', async () => {
    const res = await s.anonymous().get('/assets/index-Ab3dE_9z.js').set('Accept-Encoding', 'identity').expect(200);
    expect(res.headers['content-encoding']).toBeUndefined();
    expect(res.text).toBe(CHUNK);
  });

  it('compresses on the fly a file the build left plain', async () => {
    const res = await s.anonymous().get('/assets/index-Qw7rT2yU.css').set('Accept-Encoding', 'gzip').expect(200);
    expect(res.headers['content-encoding']).toBe('gzip');
    expect(res.text).toBe(STYLES);
  });

  it('compresses the JSON answers of the API', async () => {
    const m = await s.as('metrologist');
    const created = await m.post('/api/budgets').send({ document: sampleDocument() }).expect(201);
    const res = await m.get(`/api/budgets/${created.body.id}`).set('Accept-Encoding', 'br, gzip').expect(200);
    expect(res.headers['content-encoding']).toBe('br');
    expect(res.body.document.title).toBe('Length of a test bar');
    expect(res.headers['cache-control']).toBe('no-store');
  });
});

describe('what a browser may keep', () => {
  it('keeps a fingerprinted asset for a year, whichever encoding it got', async () => {
    for (const encoding of ['br', 'gzip', 'identity']) {
      const res = await s.anonymous().get('/assets/index-Ab3dE_9z.js').set('Accept-Encoding', encoding).expect(200);
      expect(res.headers['cache-control']).toBe(IMMUTABLE);
    }
    const css = await s.anonymous().get('/assets/index-Qw7rT2yU.css').expect(200);
    expect(css.headers['cache-control']).toBe(IMMUTABLE);
  });

  it('never stores the page that names the current assets, at its own address or as a client route', async () => {
    for (const path of ['/', '/index.html', '/sign-in', '/budgets/12/versions/3']) {
      const res = await s.anonymous().get(path).expect(200);
      expect(res.headers['cache-control'], path).toBe('no-store');
      expect(res.text, path).toBe(INDEX);
    }
  });

  it('answers an asset the build did not write with 404, not with the page', async () => {
    const res = await s.anonymous().get('/assets/index-Zz9yX8wV.js').expect(404);
    expect(res.headers['cache-control']).toBe('no-store');
    expect(res.text).not.toContain('<html');
  });

  it('keeps the cross-origin isolation the Monte Carlo stop flag needs on the page and its assets', async () => {
    for (const path of ['/sign-in', '/assets/index-Ab3dE_9z.js']) {
      const res = await s.anonymous().get(path).set('Accept-Encoding', 'br').expect(200);
      expect(res.headers['cross-origin-opener-policy'], path).toBe('same-origin');
      expect(res.headers['cross-origin-embedder-policy'], path).toBe('require-corp');
    }
  });
});
