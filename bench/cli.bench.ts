/*
 * Command-line benchmark (npm run bench, after the engine's): whole processes,
 * start-up included, of the installed command (`cli/bin/dubito`, which starts
 * from the snapshot `npm run build:cli` made), the plain build beside it.
 *   1. `dubito compute` on the JCGM 101:2008 9.3 mass model at 10⁶ trials
 *      against `python3 bench/mass_numpy.py --runs 1 --no-warm-up` (interpreter
 *      start, numpy import and one computation of the model, as the command
 *      makes one), alternating, median of RUNS each: target ≤ 1.0 ×;
 *   2. `dubito --help` (start-up without the engine);
 *   3. a batch of 100 copies of the 9.3 budget with their own seeds, `--jobs 2`:
 *      target ≤ 100 × one budget's computation + one start-up, where the
 *      start-up is a process that loads the engine and computes the budget
 *      without the Monte Carlo method (`--no-monte-carlo`), and one budget's
 *      computation is what the Monte Carlo method adds to that.
 * Wall time is the target; the CPU time of each child process (Linux
 * /proc/self/stat, reaped children) is shown beside it, being less moved by
 * the load of a shared machine. Prints PASS/MISS; never fails on a MISS.
 */
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { availableParallelism, tmpdir } from 'node:os';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { snapshotBlobName } from '../cli/snapshot-blob.mjs';
import { findPython, median, verdict } from './support';

const here = dirname(fileURLToPath(import.meta.url));
const root = join(here, '..');
const bin = join(root, 'cli', 'bin', 'dubito');
const plainBuild = join(root, 'cli', 'dist', 'dubito.js');
const massFile = join(root, 'tests', 'reference-budgets', 'jcgm101-9.3-mass-calibration.json');
const RUNS = Number(process.env.BENCH_RUNS ?? 7);
const BATCH_RUNS = Number(process.env.BENCH_BATCH_RUNS ?? 3);
const BATCH = 100;

const s = (x: number) => `${x.toFixed(3)} s`;

/** CPU seconds (user + system) of this process's reaped children so far; null where /proc is absent. */
function childrenCpu(): number | null {
  try {
    const stat = readFileSync('/proc/self/stat', 'utf8');
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    // fields from the state (3rd field of stat): cutime and cstime are the 16th and 17th of stat
    return (Number(fields[13]) + Number(fields[14])) / 100;
  } catch {
    return null;
  }
}

interface Timed {
  wall: number;
  cpu: number | null;
}

function timed(exe: string, args: string[]): Timed {
  const cpu0 = childrenCpu();
  const t0 = performance.now();
  const r = spawnSync(exe, args, { cwd: root, encoding: 'utf8', maxBuffer: 1 << 28 });
  const wall = (performance.now() - t0) / 1000;
  const cpu1 = childrenCpu();
  if (r.status !== 0 && r.status !== 2) throw new Error(`${exe} ${args.join(' ')} exited with ${r.status}: ${r.stderr}`);
  return { wall, cpu: cpu0 === null || cpu1 === null ? null : cpu1 - cpu0 };
}

const medianOf = (xs: Timed[]): Timed => ({ wall: median(xs.map((x) => x.wall)), cpu: xs.some((x) => x.cpu === null) ? null : median(xs.map((x) => x.cpu as number)) });
const cpuText = (t: Timed) => (t.cpu === null ? '' : `, CPU ${s(t.cpu)}`);

function main(): void {
  if (!existsSync(plainBuild)) throw new Error('cli/dist/dubito.js is missing: run npm run build:cli');
  console.log(`Dubito command-line benchmark — Node ${process.version}, ${availableParallelism()} cores, whole processes, median of ${RUNS} runs (batch: ${BATCH_RUNS})\n`);

  const python = findPython();
  const dubitoRuns: Timed[] = [];
  const plainRuns: Timed[] = [];
  const numpyRuns: Timed[] = [];
  const helpRuns: Timed[] = [];
  const startRuns: Timed[] = [];
  const numpy = [join(here, 'mass_numpy.py'), '--runs', '1', '--no-warm-up'];
  timed(bin, ['compute', massFile]); // the file system cache, as numpy gets below
  timed(process.execPath, [plainBuild, 'compute', massFile]);
  for (let i = 0; i < RUNS; i++) {
    dubitoRuns.push(timed(bin, ['compute', massFile]));
    if (python) numpyRuns.push(timed(python, numpy));
    plainRuns.push(timed(process.execPath, [plainBuild, 'compute', massFile]));
    helpRuns.push(timed(bin, ['--help']));
    startRuns.push(timed(bin, ['compute', massFile, '--no-monte-carlo']));
  }
  const one = medianOf(dubitoRuns);
  const plain = medianOf(plainRuns);
  const help = medianOf(helpRuns);
  const start = medianOf(startRuns);
  const blob = snapshotBlobName();
  const from = existsSync(join(root, 'cli', 'dist', blob)) ? `from the snapshot cli/dist/${blob}` : 'no snapshot for this node: the plain build';
  console.log(`dubito compute (cli/bin/dubito, ${from}), JCGM 101 9.3 at 10⁶ trials: ${s(one.wall)}${cpuText(one)}`);
  console.log(`  the plain build without the snapshot (node cli/dist/dubito.js), for reference: ${s(plain.wall)}${cpuText(plain)}`);
  if (python) {
    const np = medianOf(numpyRuns);
    const ratio = one.wall / np.wall;
    console.log(`python3 bench/mass_numpy.py --runs 1 --no-warm-up (start, numpy import, one computation of the model): ${s(np.wall)}${cpuText(np)}`);
    const cpuRatio = one.cpu !== null && np.cpu !== null ? `; CPU ${(one.cpu / np.cpu).toFixed(2)} ×` : '';
    console.log(`  Dubito / numpy, whole process: ${ratio.toFixed(2)} × (target ≤ 1.0 ×) ${verdict(ratio <= 1.0)}${cpuRatio}`);
  } else {
    console.log('python3 with numpy not found: the numpy comparison is skipped');
  }
  console.log(`dubito --help (start-up alone): ${s(help.wall)}${cpuText(help)}`);
  console.log(`dubito compute --no-monte-carlo (start-up with the engine, the model compiled, GUM): ${s(start.wall)}${cpuText(start)}`);

  // the batch: 100 copies of the 9.3 budget, each with its own seed
  const jobs = Math.min(2, availableParallelism());
  const dir = mkdtempSync(join(tmpdir(), 'dubito-bench-batch-'));
  try {
    const doc = JSON.parse(readFileSync(massFile, 'utf8'));
    for (let i = 0; i < BATCH; i++) writeFileSync(join(dir, `mass-${String(i).padStart(3, '0')}.json`), JSON.stringify({ ...doc, monteCarlo: { ...doc.monteCarlo, seed: `bench-${i}` } }));
    const batchRuns: Timed[] = [];
    for (let i = 0; i < BATCH_RUNS; i++) batchRuns.push(timed(bin, ['compute', join(dir, '*.json'), '--jobs', String(jobs), '--format', 'jsonl']));
    const batch = medianOf(batchRuns);
    const computation = Math.max(one.wall - start.wall, 0);
    const target = BATCH * computation + start.wall;
    console.log(`dubito compute, ${BATCH} budgets (9.3 at 10⁶ trials, own seeds), --jobs ${jobs}: ${s(batch.wall)}${cpuText(batch)} = ${s(batch.wall / BATCH)} per budget`);
    console.log(`  target ≤ ${BATCH} × ${s(computation)} (one computation) + ${s(start.wall)} (one start-up) = ${s(target)} ${verdict(batch.wall <= target)}`);
    if (batch.cpu !== null && one.cpu !== null && start.cpu !== null) {
      const cpuTarget = BATCH * Math.max(one.cpu - start.cpu, 0) + start.cpu;
      console.log(`  in CPU time: ${s(batch.cpu)} against ${s(cpuTarget)} ${verdict(batch.cpu <= cpuTarget)}`);
    }
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

main();
