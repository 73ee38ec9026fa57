import { spawn, spawnSync } from 'node:child_process';
import { copyFileSync, cpSync, existsSync, mkdtempSync, readFileSync, readdirSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { basename, join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { projectRoot as root } from '../support/built-once';
import { binDubito, builtCli, dubito, ensureBuiltCli, plainDubito, snapshotBlob } from './built-cli';

beforeAll(ensureBuiltCli);

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
    expect(r.stdout).toMatch(/Estimate y +10\.050 +undefined\nStandard uncertainty u\(y\) +0\.029 +undefined/);
    expect(r.stdout).toContain('The GUM result cannot be compared with the Monte Carlo method. The variance of t_ν is undefined for ν ≤ 2');
    expect(r.stdout).toContain('U from k = t_p(ν_eff) of the t-distribution (GUM G.4)\nThe GUM figures are reported although the Monte Carlo method could not validate them.');
    expect(r.stdout).toContain('Y = (10.05 ± 0.12) mm.'); // k = t_0.975(2) = 4.30 (GUM Table G.2, from memory), u = 0.05/√3
    expect(r.stdout).toContain('warning (a): The input "a" has only 3 observations (ν = 2)');
  });

  it("prints the adaptive stability (JCGM 101:2008 7.9.4) and a fixed k from the budget's reporting choice", () => {
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
    expect(r.stdout).toMatch(/Stable: \d+ sequences of 10.000 trials; twice the standard deviation of the sequence averages .* is within the tolerance δ = 0\.050 \(JCGM 101:2008 7\.9\.4\)/); // u = 1.4: c = 14, ℓ = −1, δ = 0.05 (JCGM 101:2008 8.2)
    expect(r.stdout).toContain('U from k fixed by the laboratory');
    expect(r.stdout).toContain('p = 95.45 %'); // k = 2 for ν_eff = ∞: 2Φ(2) − 1 = 0.9545 (normal table, from memory; recomputed by coverageProbabilityFor)
    expect(r.stdout).toContain('coverage factor k = 2.00, which for a normal distribution corresponds to a coverage probability of approximately 95 %');
  });

  const refusals: [string, string[], RegExp][] = [
    ['a file that is not JSON', [tempFile('{ "format": ')], /not a JSON document/],
    ['a missing file', ['/nonexistent/budget.json'], /cannot read .*no such file/],
    ['a folder', ['examples'], /cannot read examples: a folder, not a file \(its budgets: examples\/\*\.json\)/],
    [
      'a bad field',
      [tempFile(JSON.stringify({ format: 'dubito-budget/1', title: 't', measurand: { symbol: 'Y' }, model: 'Y = a', inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: -1 } }] }))],
      /inputs\[0\]\.distribution\.u: must be greater than 0/,
    ],
    [
      'a forbidden function',
      [
        tempFile(
          JSON.stringify({ format: 'dubito-budget/1', title: 't', measurand: { symbol: 'Y' }, model: 'Y = evaluate(a)', inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: 1 } }] }),
        ),
      ],
      /the function "evaluate" is not allowed/,
    ],
    [
      'an unknown symbol',
      [
        tempFile(
          JSON.stringify({ format: 'dubito-budget/1', title: 't', measurand: { symbol: 'Y' }, model: 'Y = a * q', inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: 1 } }] }),
        ),
      ],
      /unknown symbol "q"/,
    ],
    ['too many trials', ['examples/dc-voltage-10v.json', '--trials', '60000000'], /must not exceed 5e\+7/],
    ['an unknown option', ['examples/dc-voltage-10v.json', '--bogus'], /bogus/],
    ['a bad format', ['examples/dc-voltage-10v.json', '--format', 'xml'], /--format must be json, jsonl or table/],
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

/** A folder of budgets: copies of examples with their own seeds, and `bad.json` refused for a negative u when asked for. */
function budgetFolder(withRefused: boolean): string {
  const dir = mkdtempSync(join(tmpdir(), 'dubito-batch-'));
  ['dc-voltage-10v', 'gauge-block-50mm', 'weight-class-f1-200g'].forEach((name, i) => {
    const doc = JSON.parse(readFileSync(join(root, 'examples', `${name}.json`), 'utf8'));
    writeFileSync(join(dir, `${name}.json`), JSON.stringify({ ...doc, monteCarlo: { trials: 20000, seed: `batch-${i}` } }));
  });
  if (withRefused) {
    writeFileSync(
      join(dir, 'bad.json'),
      JSON.stringify({ format: 'dubito-budget/1', title: 't', measurand: { symbol: 'Y' }, model: 'Y = a', inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: -1 } }] }),
    );
  }
  return dir;
}

const lines = (stdout: string) =>
  stdout
    .trimEnd()
    .split('\n')
    .map((l) => JSON.parse(l));

describe('dubito compute on many budgets', () => {
  it('takes files and patterns, and writes one JSON line per budget in the order given, each with the figures of a run on its own', () => {
    const r = dubito('compute', 'examples/dc-voltage-10v.json', 'examples/[gp]*.json', '--trials', '20000');
    expect(r.stderr).toBe('');
    expect(r.status).toBe(0);
    const out = lines(r.stdout);
    expect(out.map((l) => l.file)).toEqual(['examples/dc-voltage-10v.json', 'examples/gauge-block-50mm.json', 'examples/pipette-100ul.json']);
    const alone = JSON.parse(dubito('compute', 'examples/pipette-100ul.json', '--trials', '20000').stdout);
    expect(out[2].result).toEqual(alone);
  });

  it('refuses a pattern that matches nothing', () => {
    const r = dubito('compute', 'examples/*.nothing');
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/no budget file matches "examples\/\*\.nothing"/);
  });

  it('refuses --format json for several budgets, and --jobs above the cores', () => {
    expect(dubito('compute', 'examples/*.json', '--format', 'json').stderr).toMatch(/--format json takes one budget/);
    const r = dubito('compute', 'examples/*.json', '--jobs', String(availableParallelism() + 1));
    expect(r.status).toBe(2);
    expect(r.stderr).toMatch(/--jobs must not exceed/);
  });

  it.skipIf(availableParallelism() < 2)('gives the same lines with --jobs 2 as with --jobs 1', () => {
    const dir = budgetFolder(true);
    const one = dubito('compute', join(dir, '*.json'), '--jobs', '1');
    const two = dubito('compute', join(dir, '*.json'), '--jobs', '2');
    expect(two.status).toBe(2);
    expect(two.stdout).toBe(one.stdout);
    expect(lines(two.stdout)).toHaveLength(4);
  });

  it.each([['1'], ['2']])('computes the good budgets and exits 2 when one is refused (--jobs %s)', (jobs) => {
    if (Number(jobs) > availableParallelism()) return;
    const dir = budgetFolder(true);
    const r = dubito('compute', join(dir, '*.json'), '--jobs', jobs);
    expect(r.status).toBe(2);
    expect(r.stderr).toBe('');
    const out = lines(r.stdout);
    expect(out.map((l) => l.file)).toEqual(['bad', 'dc-voltage-10v', 'gauge-block-50mm', 'weight-class-f1-200g'].map((n) => join(dir, `${n}.json`)));
    expect(out[0]).toEqual({ file: join(dir, 'bad.json'), error: { code: 'invalid_field', message: 'inputs[0].distribution.u: must be greater than 0', field: 'inputs[0].distribution.u' } });
    for (const l of out.slice(1)) {
      expect(l.result.monteCarlo.trials).toBe(20000);
      expect(l.result.gum.standardUncertainty).toBeGreaterThan(0);
    }
    // each budget's own seed: the runs differ from each other
    expect(out[1].result.monteCarlo.seed).toBe('batch-0');
    expect(out[3].result.monteCarlo.seed).toBe('batch-2');
  });

  it('a refused model names its line and column in `location`, and each warning carries its code', () => {
    const bad = tempFile(
      JSON.stringify({ format: 'dubito-budget/1', title: 't', measurand: { symbol: 'Y' }, model: 'Y = a + * a', inputs: [{ symbol: 'a', distribution: { kind: 'normal', value: 1, u: 0.1 } }] }),
    );
    const [refused] = lines(dubito('compute', bad, '--format', 'jsonl', '--no-monte-carlo').stdout);
    expect(refused.error).toMatchObject({ code: 'model_syntax', field: 'model', location: { line: 1, column: expect.any(Number) } });
    const spare = tempFile(
      JSON.stringify({
        format: 'dubito-budget/1',
        title: 't',
        measurand: { symbol: 'Y' },
        model: 'Y = a',
        inputs: [
          { symbol: 'a', distribution: { kind: 'normal', value: 1, u: 0.1 } },
          { symbol: 'b', distribution: { kind: 'normal', value: 1, u: 0.1 } },
        ],
      }),
    );
    const result = JSON.parse(dubito('compute', spare, '--no-monte-carlo').stdout);
    expect(result.warnings).toEqual([{ code: 'input-not-in-model', message: 'The input "b" does not appear in the model.', symbols: ['b'], field: 'inputs[1]' }]);
  });

  it('names a file it cannot read in its line, with field null, and computes the rest', () => {
    const r = dubito('compute', '/nonexistent/budget.json', 'examples/dc-voltage-10v.json', '--no-monte-carlo');
    expect(r.status).toBe(2);
    const [missing, good] = lines(r.stdout);
    expect(missing).toEqual({ file: '/nonexistent/budget.json', error: { code: 'file_unreadable', message: 'cannot read /nonexistent/budget.json: no such file', field: null } });
    expect(good.result.gum.standardUncertainty).toBeGreaterThan(0);
  });

  it('writes NAME.result.json beside each budget, passes over result files on the next run, and removes the result of a budget now refused', () => {
    const dir = budgetFolder(false);
    const first = dubito('compute', join(dir, '*.json'), '--beside');
    expect(first.status).toBe(0);
    expect(first.stdout).toBe('');
    const written = readdirSync(dir)
      .filter((f) => f.endsWith('.result.json'))
      .sort();
    expect(written).toEqual(['dc-voltage-10v.result.json', 'gauge-block-50mm.result.json', 'weight-class-f1-200g.result.json']);
    const stored = JSON.parse(readFileSync(join(dir, 'gauge-block-50mm.result.json'), 'utf8'));
    expect(stored).toEqual(JSON.parse(dubito('compute', join(dir, 'gauge-block-50mm.json')).stdout));

    writeFileSync(join(dir, 'gauge-block-50mm.json'), '{ "format": ');
    const second = dubito('compute', join(dir, '*.json'), '--beside');
    expect(second.status).toBe(2);
    expect(second.stderr.trim().split('\n')).toEqual([`dubito: ${join(dir, 'gauge-block-50mm.json')}: not a JSON document: ${second.stderr.split('not a JSON document: ')[1].trim()}`]);
    expect(existsSync(join(dir, 'gauge-block-50mm.result.json'))).toBe(false);
    expect(existsSync(join(dir, 'dc-voltage-10v.result.json'))).toBe(true);
  });

  it('writes results into --out-dir, and refuses two budgets that would write one file', () => {
    const dir = budgetFolder(false);
    const out = join(dir, 'results', 'today');
    const r = dubito('compute', join(dir, 'dc-voltage-10v.json'), join(dir, 'weight-class-f1-200g.json'), '--out-dir', out, '--no-monte-carlo');
    expect(r.status).toBe(0);
    expect(readdirSync(out).sort()).toEqual(['dc-voltage-10v.result.json', 'weight-class-f1-200g.result.json']);
    expect(JSON.parse(readFileSync(join(out, 'dc-voltage-10v.result.json'), 'utf8')).monteCarlo).toBeNull();

    const other = mkdtempSync(join(tmpdir(), 'dubito-batch-'));
    copyFileSync(join(dir, 'dc-voltage-10v.json'), join(other, 'dc-voltage-10v.json'));
    const clash = dubito('compute', join(dir, 'dc-voltage-10v.json'), join(other, 'dc-voltage-10v.json'), '--out-dir', out);
    expect(clash.status).toBe(2);
    expect(clash.stderr).toMatch(/would both write/);
  });

  it('prints a table per budget under its file name', () => {
    const r = dubito('compute', 'examples/dc-voltage-10v.json', 'examples/pipette-100ul.json', '--format', 'table', '--no-monte-carlo');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^# examples\/dc-voltage-10v\.json\n/);
    expect(r.stdout).toContain('\n# examples/pipette-100ul.json\n');
  });
});

describe('dubito compute into a pipe closed early', () => {
  it('stops quietly, with the status so far, when the reader goes away (`dubito compute … | head`)', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'dubito-pipe-'));
    // more lines than a pipe holds, so the command is still writing when the reader leaves
    const text = readFileSync(join(root, 'examples', 'thermometer-pt100.json'), 'utf8');
    for (let i = 0; i < 120; i++) writeFileSync(join(dir, `probe-${String(i).padStart(3, '0')}.json`), text);
    try {
      const child = spawn(binDubito, ['compute', join(dir, '*.json'), '--no-monte-carlo'], { cwd: root });
      let stderr = '';
      child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
      child.stdout.once('data', () => child.stdout.destroy());
      const status = await new Promise<number | null>((resolve) => child.on('close', (code) => resolve(code)));
      expect(stderr).toBe('');
      expect(status).toBe(0);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

describe('dubito --help', () => {
  it('prints the usage with every option and exits 0', () => {
    const r = dubito('--help');
    expect(r.status).toBe(0);
    expect(r.stdout).toMatch(/^usage: dubito compute FILE\|PATTERN\.\.\./);
    for (const option of ['--trials', '--adaptive', '--seed', '--no-monte-carlo', '--format', '--out-dir', '--beside', '--jobs']) expect(r.stdout).toContain(option);
  });

  it('loads no engine to get there: the built entry imports the engine only on demand', () => {
    // the modules dubito.js imports at start, followed through its static imports
    const dist = join(root, 'cli', 'dist');
    const loaded = new Set<string>();
    const follow = (file: string) => {
      if (loaded.has(file)) return;
      loaded.add(file);
      const text = readFileSync(join(dist, file), 'utf8');
      for (const m of text.matchAll(/^import\s+(?:[^'"]*?\s+from\s+)?["'](\.\/[^"']+)["']/gms)) follow(m[1].slice(2));
    };
    follow('dubito.js');
    const atStart = [...loaded].map((f) => readFileSync(join(dist, f), 'utf8')).join('\n');
    expect(atStart).not.toMatch(/shared\/compute\/compute-budget\.ts|node_modules\/mathjs|node_modules\/zod/);
    expect(readFileSync(builtCli, 'utf8')).toMatch(/^#!\/usr\/bin\/env node\n/);
  });
});

describe('the installed command and its start-up snapshot', () => {
  it('starts from the snapshot built with this node', () => {
    expect(existsSync(snapshotBlob)).toBe(true);
    // the shell's trace shows the command it runs in the end
    const r = spawnSync('sh', ['-x', binDubito, '--help'], { cwd: root, encoding: 'utf8' });
    expect(r.status).toBe(0);
    expect(r.stderr).toContain(`exec node --snapshot-blob ${root}/cli/bin/../dist/${basename(snapshotBlob)} -- --help`);
    expect(r.stdout).toMatch(/^usage: dubito compute/);
  });

  it('gives the same output, byte for byte, as the plain build: every example, a table, a batch on two threads, a refusal', () => {
    const runs: string[][] = [
      ...examples.map((f) => ['compute', join('examples', f), '--trials', '20000']),
      ['compute', 'tests/reference-budgets/jcgm101-9.3-mass-calibration.json'],
      ['compute', 'examples/thermometer-pt100.json', '--format', 'table'],
      ['compute', 'examples/*.json', '--trials', '5000', '--jobs', String(Math.min(2, availableParallelism()))],
      ['compute', 'examples/*.json', 'missing.json', '--no-monte-carlo'],
    ];
    for (const args of runs) {
      const fromSnapshot = dubito(...args);
      const plain = plainDubito(...args);
      expect(fromSnapshot, args.join(' ')).toEqual(plain);
    }
    expect(plainDubito('compute', 'missing.json').status).toBe(2);
  });

  it('runs the plain build where no snapshot was built for the node at hand', () => {
    const copy = mkdtempSync(join(tmpdir(), 'dubito-bin-'));
    try {
      cpSync(join(root, 'cli', 'bin'), join(copy, 'bin'), { recursive: true });
      cpSync(join(root, 'cli', 'dist'), join(copy, 'dist'), { recursive: true, filter: (f) => !f.endsWith('.blob') });
      const r = spawnSync('sh', ['-x', join(copy, 'bin', 'dubito'), 'compute', 'examples/dc-voltage-10v.json', '--no-monte-carlo'], { cwd: root, encoding: 'utf8' });
      expect(r.status).toBe(0);
      expect(r.stderr).toContain(`exec node ${copy}/bin/../dist/dubito.js compute`);
      expect(JSON.parse(r.stdout)).toEqual(JSON.parse(plainDubito('compute', 'examples/dc-voltage-10v.json', '--no-monte-carlo').stdout));
    } finally {
      rmSync(copy, { recursive: true, force: true });
    }
  });
});
