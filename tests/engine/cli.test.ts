import { spawnSync } from 'node:child_process';
import { mkdtempSync, readdirSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '..', '..');
const cli = join(root, 'cli', 'dubito.ts');

function dubito(...args: string[]) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', cli, ...args], { cwd: root, encoding: 'utf8' });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

function tempFile(content: string): string {
  const dir = mkdtempSync(join(tmpdir(), 'dubito-cli-'));
  const file = join(dir, 'budget.json');
  writeFileSync(file, content);
  return file;
}

const examples = readdirSync(join(root, 'examples')).filter((f) => f.endsWith('.json'));

describe('dubito compute', () => {
  it('has at least four example budgets', () => {
    expect(examples.length).toBeGreaterThanOrEqual(4);
  });

  it.each(examples)('computes examples/%s as JSON', (file) => {
    const r = dubito('compute', join('examples', file), '--trials', '20000');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const result = JSON.parse(r.stdout);
    expect(Number.isFinite(result.gum.estimate)).toBe(true);
    expect(result.gum.standardUncertainty).toBeGreaterThan(0);
    expect(result.monteCarlo.trials).toBe(20000);
    expect(result.validation).toHaveProperty('passed');
  });

  it('prints a readable table with the certificate statement', () => {
    const r = dubito('compute', 'examples/dc-voltage-10v.json', '--format', 'table', '--no-monte-carlo');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('symbol');
    expect(r.stdout).toContain('coverage factor k =');
  });

  it('takes --seed and --adaptive (JCGM 101:2008 7.9)', () => {
    const a = JSON.parse(dubito('compute', 'examples/thermometer-pt100.json', '--trials', '5000', '--seed', 's1').stdout);
    const b = JSON.parse(dubito('compute', 'examples/thermometer-pt100.json', '--trials', '5000', '--seed', 's1').stdout);
    expect(a.monteCarlo).toEqual(b.monteCarlo);
    const adaptive = JSON.parse(dubito('compute', 'examples/thermometer-pt100.json', '--adaptive').stdout);
    expect(adaptive.monteCarlo.adaptive).toBe(true);
    expect(adaptive.monteCarlo.trials).toBeGreaterThanOrEqual(20000);
  });

  it('prints the verdict "not possible" with its reason, no Monte Carlo u, and what is reported, for 3 observations (JCGM 101:2008 6.4.9)', () => {
    const file = tempFile(
      JSON.stringify({
        format: 'dubito-budget/1',
        title: 'three readings',
        measurand: { symbol: 'Y', unit: 'mm' },
        model: 'Y = a',
        inputs: [{ symbol: 'a', unit: 'mm', distribution: { kind: 'observations', values: [10.0, 10.1, 10.05] } }],
        monteCarlo: { trials: 20000, seed: 'cli' },
      }),
    );
    const r = dubito('compute', file, '--format', 'table');
    expect(r.status).toBe(0);
    expect(r.stdout).toContain('y and u undefined (no variance)');
    expect(r.stdout).toContain('GUM validated against Monte Carlo: not possible\n  the variance of t_ν is undefined for ν ≤ 2');
    expect(r.stdout).toContain('reported: GUM figures, k = t_p(ν_eff) (NOT validated by the Monte Carlo method)');
    expect(r.stdout).toContain('Y = (10.05 ± 0.12) mm.'); // k = t_0.975(2) = 4.30 (GUM Table G.2, from memory), u = 0.05/√3
    expect(r.stdout).toContain('warning: The input "a" has only 3 observations (ν = 2)');
  });

  it('prints the adaptive stability (JCGM 101:2008 7.9.4) and a fixed k from the budget\'s reporting choice', () => {
    const file = tempFile(
      JSON.stringify({
        format: 'dubito-budget/1',
        title: 'sum',
        measurand: { symbol: 'Y' },
        model: 'Y = a + b',
        inputs: [
          { symbol: 'a', distribution: { kind: 'normal', value: 0, u: 1 } },
          { symbol: 'b', distribution: { kind: 'normal', value: 0, u: 1 } },
        ],
        reporting: { basis: 'k-fixed', k: 2 },
      }),
    );
    const r = dubito('compute', file, '--format', 'table', '--adaptive');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/adaptive \(JCGM 101:2008 7\.9\): h = \d+ sequences of M = 10000; s\(y\) = .* δ = 0\.050 {2}stabilized: yes/); // u = 1.4: c = 14, ℓ = −1, δ = 0.05 (JCGM 101:2008 8.2)
    expect(r.stdout).toContain('reported: GUM figures, k fixed at 2');
    expect(r.stdout).toContain('coverage factor k = 2.00, which for a normal distribution corresponds to a coverage probability of approximately 95 %');
  });

  const refusals: [string, string[], RegExp][] = [
    ['a file that is not JSON', [tempFile('{ "format": ')], /not a JSON document/],
    ['a missing file', ['/nonexistent/budget.json'], /cannot read .*no such file/],
    ['a bad field', [tempFile(JSON.stringify({ format: 'dubito-budget/1', title: 't', measurand: { symbol: 'Y' }, model: 'Y = a', inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: -1 } }] }))], /inputs\[0\]\.distribution\.u: must be greater than 0/],
    ['a forbidden function', [tempFile(JSON.stringify({ format: 'dubito-budget/1', title: 't', measurand: { symbol: 'Y' }, model: 'Y = evaluate(a)', inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: 1 } }] }))], /the function "evaluate" is not allowed/],
    ['an unknown symbol', [tempFile(JSON.stringify({ format: 'dubito-budget/1', title: 't', measurand: { symbol: 'Y' }, model: 'Y = a * q', inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: 1 } }] }))], /unknown symbol "q"/],
    ['too many trials', ['examples/dc-voltage-10v.json', '--trials', '60000000'], /must not exceed 5e\+7/],
    ['an unknown option', ['examples/dc-voltage-10v.json', '--bogus'], /bogus/],
    ['a bad format', ['examples/dc-voltage-10v.json', '--format', 'xml'], /--format must be json or table/],
  ];
  it.each(refusals)('refuses %s with status 2 and one line on stderr', (_what, args, message) => {
    const r = dubito('compute', ...args);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr).toMatch(message);
    expect(r.stderr.trim().split('\n')).toHaveLength(1);
    expect(r.stderr).not.toMatch(/\s+at\s+\S+:\d+/); // no stack trace
  });

  it('refuses an unknown command with status 2', () => {
    const r = dubito('frobnicate');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/unknown command/);
  });
});
