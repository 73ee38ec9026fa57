import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;

beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s?.stop();
});

describe('a refused budget answers its typed problem', () => {
  it('a model syntax error: 422 with code model_syntax, field model and the line and column', async () => {
    const m = await s.as('metrologist');
    const r = await m
      .post('/api/budgets')
      .send({ document: sampleDocument('syntax', { model: 'y = a + * b * c' }) })
      .expect(422);
    const e = r.body.error;
    expect(e.code).toBe('model_syntax');
    expect(e.field).toBe('model');
    expect(e.location).toMatchObject({ line: 1, column: expect.any(Number) });
    expect(e.message).toMatch(new RegExp(`^model line 1, column ${e.location.column}: `));
  });

  it('a schema issue: 422 with code invalid_field and the path, no location', async () => {
    const m = await s.as('metrologist');
    const doc = sampleDocument('bad u', { inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: -1 } }], model: 'y = a' });
    const r = await m.post('/api/budgets').send({ document: doc }).expect(422);
    expect(r.body.error).toEqual({ code: 'invalid_field', field: 'inputs[0].distribution.u', message: 'inputs[0].distribution.u: must be greater than 0' });
  });

  it('an unknown symbol in a saved version: 422 naming its token', async () => {
    const m = await s.as('metrologist');
    const r = await m
      .post('/api/budgets')
      .send({ document: sampleDocument('unknown', { model: 'y = a + b * zz' }) })
      .expect(422);
    expect(r.body.error).toMatchObject({ code: 'unknown_symbol', field: 'model', location: { line: 1, token: 'zz' } });
  });
});

describe('stored warnings through the API carry their code', () => {
  it('the version and the review state give { code, message, symbols, field }', async () => {
    const m = await s.as('metrologist');
    const doc = sampleDocument('spare input');
    doc.inputs.push({ symbol: 'spare', unit: 'mm', distribution: { kind: 'normal', value: 1, u: 0.1 } });
    const id = (await m.post('/api/budgets').send({ document: doc }).expect(201)).body.id;
    const expected = { code: 'input-not-in-model', message: 'The input "spare" does not appear in the model.', symbols: ['spare'], field: 'inputs[3]' };
    expect((await m.get(`/api/budgets/${id}`).expect(200)).body.result.warnings).toContainEqual(expected);
    expect((await m.get(`/api/budgets/${id}/review`).expect(200)).body.warnings).toContainEqual(expected);
  });
});
