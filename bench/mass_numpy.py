"""Vectorised numpy run of the JCGM 101:2008 9.3 mass calibration model, the
comparison point of the engine benchmark. Same steps as the engine: draws,
model, sort, probabilistically symmetric and shortest 95 % intervals (7.7),
mean and standard deviation (7.6), a 100-bin histogram.

Prints one JSON object: median seconds per phase and in total over --runs
runs after one warm-up (none with --no-warm-up), and the last run's results.
"""

import argparse
import json
import statistics
import time

import numpy as np


def run(trials: int, rng: np.random.Generator, p: float = 0.95) -> tuple[dict, dict]:
    times = {}
    c0 = time.process_time()
    t0 = time.perf_counter()
    m_rc = rng.normal(100000.0, 0.05, trials)  # mg
    dm_rc = rng.normal(1.234, 0.02, trials)  # mg
    rho_a = rng.uniform(1.1, 1.3, trials)  # kg/m^3
    rho_w = rng.uniform(7000.0, 9000.0, trials)
    rho_r = rng.uniform(7950.0, 8050.0, trials)
    t1 = time.perf_counter()
    times["sample"] = t1 - t0
    y = (m_rc + dm_rc) * (1 + (rho_a - 1.2) * (1 / rho_w - 1 / rho_r)) - 100000.0
    t2 = time.perf_counter()
    times["evaluate"] = t2 - t1
    mean = float(np.mean(y))
    std = float(np.std(y, ddof=1))
    t3 = time.perf_counter()
    times["moments"] = t3 - t2
    counts, edges = np.histogram(y, bins=100)
    t4 = time.perf_counter()
    times["histogram"] = t4 - t3
    s = np.sort(y)
    q = int(round(p * trials))
    r = (trials - q) // 2 if (trials - q) % 2 == 0 else (trials - q + 1) // 2
    symmetric = [float(s[r - 1]), float(s[r - 1 + q])]
    lengths = s[q:] - s[: trials - q]
    best = int(np.argmin(lengths))
    shortest = [float(s[best]), float(s[best + q])]
    t5 = time.perf_counter()
    times["intervals"] = t5 - t4
    times["total"] = t5 - t0
    times["cpu"] = time.process_time() - c0
    result = {
        "estimate": mean,
        "standardUncertainty": std,
        "interval": symmetric,
        "shortestInterval": shortest,
        "histogramTotal": int(counts.sum()),
        "histogramStart": float(edges[0]),
    }
    return times, result


def main() -> None:
    parser = argparse.ArgumentParser()
    parser.add_argument("--trials", type=int, default=1_000_000)
    parser.add_argument("--runs", type=int, default=7)
    parser.add_argument("--no-warm-up", dest="warm_up", action="store_false", help="as a script run once would: no run before the timed ones")
    args = parser.parse_args()
    rng = np.random.default_rng(20080901)
    if args.warm_up:
        run(args.trials, rng)
    samples = []
    result = {}
    for _ in range(args.runs):
        times, result = run(args.trials, rng)
        samples.append(times)
    medians = {k: statistics.median(t[k] for t in samples) for k in samples[0]}
    print(json.dumps({"numpy": np.__version__, "trials": args.trials, "runs": args.runs, "seconds": medians, "result": result}))


if __name__ == "__main__":
    main()
