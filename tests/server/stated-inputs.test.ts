import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { sampleDocument, startTestServer, type TestServer } from './helpers';

let s: TestServer;

beforeAll(async () => {
  s = await startTestServer();
});
afterAll(async () => {
  await s?.stop();
});

// A thermometer calibration of the fictional lab: a certificate with U at p = 95 % and ν = 9 in mK
// for a reading in °C, the resolution of the display, and a specification in ppm of a resistance.
const stated = () =>
  sampleDocument('Stated as entered', {
    measurand: { symbol: 'y', unit: 'degC' },
    model: 'y = t + d + R * c',
    inputs: [
      {
        symbol: 't',
        unit: 'degC',
        distribution: { kind: 'normal', value: 20.3, U: 12, p: 0.95, dof: 9, uncertaintyUnit: 'mK', stated: { as: 'certificate', source: 'certificate KF-0423' } },
      },
      { symbol: 'd', unit: 'degC', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.005, stated: { as: 'resolution' } } },
      { symbol: 'R', unit: 'ohm', distribution: { kind: 'rectangular', value: 100, halfWidth: 5, uncertaintyUnit: 'ppm', stated: { as: 'specification' } } },
      { symbol: 'c', unit: 'degC/ohm', distribution: { kind: 'constant', value: 0.001 } },
    ],
  });

describe('inputs kept as they were stated, through the API', () => {
  it('export returns the stated fields unchanged, import takes them back, and the server computes with them', async () => {
    const m = await s.as('metrologist');
    const doc = stated();
    const id = (await m.post('/api/budgets').send({ document: doc, note: '' }).expect(201)).body.id;
    const exported = JSON.parse((await m.get(`/api/budgets/${id}/export`).expect(200)).text);
    expect(exported.inputs).toEqual(doc.inputs);

    const file = Buffer.from(JSON.stringify(exported));
    const again = (await m.post('/api/budgets/import').field('note', 'round trip').attach('file', file, { filename: 'b.json', contentType: 'application/json' }).expect(201)).body.id;
    const reread = JSON.parse((await m.get(`/api/budgets/${again}/export`).expect(200)).text);
    expect(reread.inputs).toEqual(doc.inputs);
    expect(reread.inputs[0].distribution).not.toHaveProperty('k');

    // u_c² = (0.012/t_0.975(9))² + (0.01/(2√3))² + (100·5×10⁻⁶/√3 · 0.001)², with t_0.975(9) = 2.262157 (scipy):
    // 0.00530467² + 0.00288675² + (2.887×10⁻⁷)² → u_c = 0.00603928 °C (scipy)
    const b = (await m.get(`/api/budgets/${again}`).expect(200)).body;
    expect(b.document.inputs).toEqual(doc.inputs);
    expect(b.result.gum.standardUncertainty).toBeCloseTo(0.00603928, 7);
  });

  it('refuses an uncertainty unit of another kind, naming the field', async () => {
    const m = await s.as('metrologist');
    const doc = stated();
    (doc.inputs as { distribution: Record<string, unknown> }[])[0].distribution.uncertaintyUnit = 'kg';
    const r = await m.post('/api/budgets').send({ document: doc, note: '' }).expect(422);
    expect(JSON.stringify(r.body)).toMatch(/inputs\[0\]\.distribution\.uncertaintyUnit/);
  });
});
