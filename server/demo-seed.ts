import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { parseBudgetFile } from '../shared/budget/budget-file';
import type { Role } from '../shared/policy/policy';
import type { Services } from './app';
import type { SessionUser } from './http/request-user';

/** The password of every demo account (the sign-in page says so). */
export const DEMO_PASSWORD = 'dubito-demo';

/** The fictional Kestrel Fen Metrology Laboratory. */
const PEOPLE: { role: Role; name: string }[] = [
  { role: 'admin', name: 'Orla Fenwick' },
  { role: 'metrologist', name: 'Tobin Marsh' },
  { role: 'reviewer', name: 'Ilse Varga' },
  { role: 'auditor', name: 'Rufus Pell' },
  { role: 'trainee', name: 'Nia Castell' },
];

const gaugeTemplate = {
  format: 'dubito-budget/1',
  title: 'Template: gauge block by mechanical comparison',
  measurand: { symbol: 'l', unit: 'mm', description: 'length of the gauge block under test at 20 °C' },
  model: 'l = l_s + d + l_s * (alpha_s * dtheta - dalpha * theta_s)',
  inputs: [
    { symbol: 'l_s', unit: 'mm', description: 'reference block, from its certificate', distribution: { kind: 'normal', value: 50.00002, U: 0.00004, k: 2 } },
    { symbol: 'd', unit: 'mm', description: 'mean of the comparator readings', distribution: { kind: 'observations', values: [0.000215, 0.000218, 0.000212, 0.000216, 0.000214] } },
    { symbol: 'alpha_s', unit: '1/degC', description: 'expansion coefficient of the reference', distribution: { kind: 'rectangular', value: 11.5e-6, halfWidth: 1e-6 } },
    { symbol: 'dtheta', unit: 'degC', description: 'temperature difference between the blocks', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.05 } },
    { symbol: 'dalpha', unit: '1/degC', description: 'difference of expansion coefficients', distribution: { kind: 'rectangular', value: 0, halfWidth: 1e-6 } },
    { symbol: 'theta_s', unit: 'degC', description: 'deviation of the bench from 20 °C', distribution: { kind: 'arcsine', value: 0, halfWidth: 0.5 } },
  ],
  monteCarlo: { trials: 100000, seed: 'kestrel-gb' },
};

const thermometerTemplate = {
  format: 'dubito-budget/1',
  title: 'Template: digital thermometer in a stirred bath',
  measurand: { symbol: 'E', unit: 'degC', description: 'error of the indication' },
  model: 'E = t_i + dt_res - (t_ref + dt_drift + dt_bath)',
  inputs: [
    { symbol: 't_i', unit: 'degC', description: 'indication of the thermometer under test', distribution: { kind: 'observations', values: [25.03, 25.04, 25.03, 25.05, 25.04, 25.03] } },
    { symbol: 'dt_res', unit: 'degC', description: 'resolution of the display (0.01 °C)', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.005 } },
    { symbol: 't_ref', unit: 'degC', description: 'reference probe, from its certificate', distribution: { kind: 'normal', value: 25.012, U: 0.012, k: 2 } },
    { symbol: 'dt_drift', unit: 'degC', description: 'drift of the reference since calibration', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.006 } },
    { symbol: 'dt_bath', unit: 'degC', description: 'inhomogeneity of the bath', distribution: { kind: 'triangular', value: 0, halfWidth: 0.01 } },
  ],
  monteCarlo: { trials: 100000, seed: 'kestrel-th' },
};

function resistorVersion(step: 1 | 2 | 3) {
  const inputs: unknown[] = [
    { symbol: 'R_s', unit: 'ohm', description: 'reference resistor KF-R10K-3, certificate value', distribution: { kind: 'normal', value: 10000.053, U: step === 3 ? 0.004 : 0.005, k: 2 } },
    { symbol: 'r', description: 'ratio of the readings', distribution: { kind: 'observations', values: [1.0000121, 1.0000118, 1.0000124, 1.0000119, 1.000012] } },
    { symbol: 'dR_drift', unit: 'ohm', description: 'drift of the reference since its calibration', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.003 } },
  ];
  if (step >= 2) {
    inputs.push({ symbol: 'dR_T', unit: 'ohm', description: 'temperature effect in the enclosure', distribution: { kind: 'rectangular', value: 0, halfWidth: 0.002 } });
  }
  return {
    format: 'dubito-budget/1',
    title: 'Resistor KF-R10K-7 by substitution against a reference',
    measurand: { symbol: 'R_x', unit: 'ohm', description: 'resistance at 23 °C' },
    model: step >= 2 ? 'R_x = (R_s + dR_drift + dR_T) * r' : 'R_x = (R_s + dR_drift) * r',
    inputs,
    monteCarlo: { trials: 100000, seed: 'kestrel-r10k' },
  };
}

/** Fills an empty database with the demo lab. Budgets are computed by the engine like any save. */
export async function seedDemo(s: Services, opts: { examplesDir: string; log: (msg: string) => void }): Promise<void> {
  const users = {} as Record<Role, SessionUser>;
  for (const p of PEOPLE) {
    users[p.role] = await s.accounts.create(null, { email: `${p.role}@dubito.example`, name: p.name, role: p.role, password: DEMO_PASSWORD });
  }
  const { admin, metrologist, reviewer, trainee } = users;

  let files: string[] = [];
  try {
    files = readdirSync(opts.examplesDir)
      .filter((f) => f.endsWith('.json'))
      .sort();
  } catch {
    opts.log(`no examples folder at ${opts.examplesDir}`);
  }
  for (const f of files) {
    try {
      const doc = parseBudgetFile(readFileSync(join(opts.examplesDir, f), 'utf8'));
      await s.budgets.create(metrologist, { document: doc, note: `imported from examples/${f}` }, 'budget.imported');
    } catch (e) {
      opts.log(`skipped examples/${f}: ${(e as Error).message}`);
    }
  }

  const gauge = await s.budgets.create(admin, { document: gaugeTemplate, note: 'lab template', template: true });
  await s.budgets.create(admin, { document: thermometerTemplate, note: 'lab template', template: true });

  // One budget through three versions, a review that returns it, and an approval.
  const r = await s.budgets.create(metrologist, { document: resistorVersion(1), note: 'first draft' });
  await s.budgets.save(metrologist, r.id, { baseVersion: 1, document: resistorVersion(2), note: 'added the temperature effect of the enclosure' });
  await s.reviews.transition(metrologist, r.id, { to: 'in_review' });
  s.reviews.addComment(reviewer, r.id, { version: 2, symbol: 'R_s', body: 'The 2025 certificate of the reference gives U = 0.004 Ω; please use it.' });
  const c2 = s.reviews.addComment(reviewer, r.id, { version: 2, symbol: 'dR_T', body: 'Good to see this term. Where does the 2 mΩ bound come from?' });
  await s.reviews.transition(reviewer, r.id, { to: 'draft', comment: 'Please update the reference value from the current certificate.' });
  s.reviews.addComment(metrologist, r.id, { version: 2, symbol: 'dR_T', body: 'From the enclosure logger: ±0.1 K at 20 mΩ/K.' });
  s.reviews.resolveComment(metrologist, r.id, c2.id, true);
  await s.budgets.save(metrologist, r.id, { baseVersion: 2, document: resistorVersion(3), note: 'reference from the 2025 certificate' });
  await s.reviews.transition(metrologist, r.id, { to: 'in_review' });
  await s.reviews.transition(reviewer, r.id, {
    to: 'approved',
    password: DEMO_PASSWORD,
    reason: 'Version 3 takes the reference value from the 2025 certificate, which answers the open R_s thread and the return comment.',
  });

  // A trainee's draft cloned from a template.
  await s.budgets.clone(trainee, gauge.id, { title: 'Gauge block KF-GB-50-114 (training)' });
  await s.mail.flush();
  opts.log('demo data: 5 accounts (password dubito-demo), templates, examples and a reviewed budget');
}
