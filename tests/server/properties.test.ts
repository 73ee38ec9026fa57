import fc from 'fast-check';
import type request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { propertyRuns } from '../support/property-runs';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

/*
 * Whatever a user sends to the budget routes, the imports and the CSV upload,
 * the answer is a success or a 4xx with { error: { code, message } }, never a
 * 500, and the server goes on answering. Bodies are valid budgets, budgets with
 * one field replaced by a random JSON value, random JSON of every type, text
 * that is not JSON, and deep or large values within the body limit.
 */

let s: TestServer;
let budgetId: number;

beforeAll(async () => {
  s = await startTestServer();
  budgetId = (await s.services.budgets.create(s.users.metrologist, { document: sampleDocument(), note: 'v1' })).id;
});
afterAll(async () => {
  await s?.stop();
});

const hostile = fc.constantFrom<unknown>(
  null,
  true,
  0,
  -1,
  1e308,
  -1e-308,
  '',
  'x',
  '__proto__',
  [],
  {},
  [[[]]],
  { __proto__: { polluted: true } },
  'a'.repeat(5000),
  Array.from({ length: 2000 }, (_, i) => i),
  { constructor: { prototype: { polluted: true } } },
);
const value = fc.oneof(hostile, fc.jsonValue({ maxDepth: 3 }));

/** Places of a budget document where a mutation lands. */
const PATHS: (string | number)[][] = [
  [],
  ['format'],
  ['title'],
  ['measurand'],
  ['measurand', 'symbol'],
  ['measurand', 'unit'],
  ['model'],
  ['inputs'],
  ['inputs', 0],
  ['inputs', 0, 'symbol'],
  ['inputs', 0, 'unit'],
  ['inputs', 0, 'distribution'],
  ['inputs', 0, 'distribution', 'kind'],
  ['inputs', 0, 'distribution', 'value'],
  ['inputs', 0, 'distribution', 'u'],
  ['inputs', 1, 'distribution', 'halfWidth'],
  ['inputs', 2, 'distribution', 'dof'],
  ['correlations'],
  ['constants'],
  ['monteCarlo'],
  ['monteCarlo', 'trials'],
  ['monteCarlo', 'seed'],
  ['coverageProbability'],
  ['reporting'],
  ['reporting', 'basis'],
  ['__proto__'],
  ['constructor'],
  ['labNote'],
];

function mutate(doc: Record<string, unknown>, path: (string | number)[], v: unknown): unknown {
  if (path.length === 0) return v;
  let node: Record<string | number, unknown> = doc;
  for (const key of path.slice(0, -1)) {
    const next = node[key];
    if (typeof next !== 'object' || next === null) return doc;
    node = next as Record<string | number, unknown>;
  }
  Object.defineProperty(node, path[path.length - 1], { value: v, enumerable: true, writable: true, configurable: true });
  return doc;
}

const MODELS = ['y = a + b * c', 'y = a / (b - b)', 'y = log(0) + a', 'y = a b', 'y = constructor', 'y = a − b', `y = ${'('.repeat(70)}a${')'.repeat(70)}`];

/** A budget document as a client might send it: valid, mutated, or any JSON at all. */
const document = fc.oneof(
  { weight: 2, arbitrary: fc.constantFrom(...MODELS).map((model) => sampleDocument('Random', { model })) },
  { weight: 3, arbitrary: fc.tuple(fc.constantFrom(...PATHS), value).map(([path, v]) => mutate(sampleDocument('Mutated'), path, v)) },
  { weight: 1, arbitrary: value },
);

/** A request body as text: JSON of the shapes above, or text that only looks like it. */
const jsonText = fc.oneof(
  fc.tuple(document, fc.oneof(fc.constant(''), fc.string({ maxLength: 30 }), value)).map(([d, note]) => JSON.stringify({ document: d, note })),
  document.map((d) => JSON.stringify(d)),
  value.map((v) => JSON.stringify(v) ?? 'null'),
  fc.string({ maxLength: 200 }),
  fc.integer({ min: 1_000, max: 100_000 }).map((n) => `{"document":${'['.repeat(n)}${']'.repeat(n)}}`),
  fc.integer({ min: 1_000, max: 50_000 }).map((n) => `{"document":${'{"a":'.repeat(n)}1${'}'.repeat(n)}}`),
  fc.integer({ min: 100, max: 5_000 }).map((n) => JSON.stringify({ document: sampleDocument('Wide', { model: `y = ${Array(n).fill('a').join(' + ')}` }) })),
  fc.constant(JSON.stringify({ document: sampleDocument('Long title', { title: 'T'.repeat(1_000_000) }) })),
  // Near the 8 MB body limit, and past it.
  fc.constantFrom(7_500_000, 9_000_000).map((n) => JSON.stringify({ document: sampleDocument('Large', { labNote: 'x'.repeat(n) }) })),
);

/** CSV-like text: random characters, numbers with either decimal mark, separators, quotes and empty lines. */
const csvText = fc.oneof(
  fc.string({ maxLength: 400 }),
  fc
    .tuple(
      fc.array(fc.array(fc.oneof(fc.double().map(String), fc.constantFrom('1,5', '1.234,5', '"a,b"', '', ' ', '\t', 'NaN', '-', '1e999')), { maxLength: 5 }), { maxLength: 30 }),
      fc.constantFrom(',', ';', '\t'),
      fc.constantFrom('\n', '\r\n', '\r'),
    )
    .map(([rows, separator, newline]) => rows.map((r) => r.join(separator)).join(newline)),
);

type Send = (agent: request.Agent) => request.Test;

const requestOf: fc.Arbitrary<{ what: string; send: Send }> = fc.oneof(
  jsonText.map((text) => ({ what: `POST /api/budgets ${text.slice(0, 120)}`, send: (a: request.Agent) => a.post('/api/budgets').type('json').send(text) })),
  fc.tuple(fc.oneof(fc.constantFrom<unknown>(1, 2, 99, 0, -1, '1', null), value), document, fc.constantFrom<unknown>('', 'n', null, 7)).map(([baseVersion, d, note]) => {
    const text = JSON.stringify({ baseVersion, document: d, note });
    return { what: `PUT ${text.slice(0, 120)}`, send: (a: request.Agent) => a.put(`/api/budgets/${budgetId}`).type('json').send(text) };
  }),
  fc.tuple(jsonText, fc.constantFrom('1', '999999', 'abc', '-1', '1e3', '__proto__')).map(([text, id]) => ({
    what: `PUT /api/budgets/${id} ${text.slice(0, 120)}`,
    send: (a: request.Agent) => a.put(`/api/budgets/${id}`).type('json').send(text),
  })),
  jsonText.map((text) => ({ what: `POST import ${text.slice(0, 120)}`, send: (a: request.Agent) => a.post('/api/budgets/import').type('json').send(text) })),
  fc
    .tuple(jsonText, fc.option(fc.string({ maxLength: 20 }), { nil: undefined }), fc.constantFrom(undefined, 'true', 'false', 'yes'), fc.constantFrom('budget.json', 'b.txt', '', '../../x.json'))
    .map(([text, note, template, filename]) => ({
      what: `POST import file ${filename} note ${note} template ${template} ${text.slice(0, 120)}`,
      send: (a: request.Agent) => {
        const r = a.post('/api/budgets/import');
        if (note !== undefined) r.field('note', note);
        if (template !== undefined) r.field('template', template);
        return r.attach('file', Buffer.from(text), { filename: filename || 'budget.json', contentType: 'application/json' });
      },
    })),
  fc
    .tuple(
      csvText,
      fc.option(fc.oneof(fc.string({ maxLength: 20 }), fc.constantFrom('0', '1', '__proto__', 'constructor')), { nil: undefined }),
      fc.constantFrom('text/csv', 'text/plain', 'application/octet-stream', 'image/png', 'application/json'),
      fc.constantFrom('readings.csv', 'readings.txt', 'readings.png', 'r'),
      fc.constantFrom('utf8', 'utf16le', 'latin1') as fc.Arbitrary<BufferEncoding>,
    )
    .map(([text, column, contentType, filename, encoding]) => ({
      what: `POST observations ${filename} ${contentType} ${encoding} ${JSON.stringify(text.slice(0, 120))} column ${column}`,
      send: (a: request.Agent) => {
        const r = a.post('/api/uploads/observations');
        if (column !== undefined) r.field('column', column);
        return r.attach('file', Buffer.from(text, encoding), { filename, contentType });
      },
    })),
);

describe('the API under random requests', () => {
  it('answers 2xx or 4xx with { error: { code, message } }, never 500, and stays up', async () => {
    const m = await s.as('metrologist');
    const statuses = new Map<number, number>();
    await fc.assert(
      fc.asyncProperty(requestOf, async ({ what, send }) => {
        const res = await send(m);
        statuses.set(res.status, (statuses.get(res.status) ?? 0) + 1);
        const ok = res.status >= 200 && res.status < 300;
        const refused = res.status >= 400 && res.status < 500;
        expect(ok || refused, `${res.status} for ${what}: ${JSON.stringify(res.body).slice(0, 300)}`).toBe(true);
        if (refused) {
          expect(typeof res.body?.error?.code, `${what}: ${res.text.slice(0, 200)}`).toBe('string');
          expect(typeof res.body.error.message).toBe('string');
          expect(res.body.error.message.length).toBeGreaterThan(0);
        }
      }),
      propertyRuns(120),
    );
    await m.get('/api/health').expect(200);
    if (process.env.DUBITO_PROPERTY_SEED) console.log(Object.fromEntries(statuses));
    // Both outcomes were reached: the grammar gets past the validators.
    expect([...statuses.keys()].some((c) => c < 300)).toBe(true);
    expect([...statuses.keys()].some((c) => c >= 400)).toBe(true);
  });
});
