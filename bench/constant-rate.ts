/*
 * A load generator with a constant arrival rate (an open loop): the i-th request is due at
 * start + i / rate whatever the server does, it waits for a free keep-alive socket when all are
 * busy, and its latency runs from the moment it was due. A slow answer therefore delays the
 * requests behind it and shows in their latencies too; a closed loop (each connection sending its
 * next request when the last answer arrives, as autocannon does, whose rate option sends each
 * second's requests in one burst) would instead slow down with the server and hide that delay.
 */
import { Agent, request } from 'node:http';

export interface ConstantRateResult {
  /** Requests per second the schedule asked for, and answered with a 2xx per second of the run. */
  rate: number;
  achieved: number;
  ok: number;
  other: number;
  errors: number;
  /** Latency from the moment each request was due to the end of its answer, in milliseconds. */
  p50: number;
  p99: number;
  max: number;
}

/** Quantile q of sorted values (nearest rank). */
function quantile(sorted: Float64Array, q: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil(q * sorted.length) - 1)];
}

/**
 * GET `url` at `rate` requests per second for `seconds`, over at most `connections` keep-alive
 * sockets, with `headers` on every request. Resolves when every request has been answered.
 */
export async function constantRate(opts: { url: string; rate: number; seconds: number; connections: number; headers?: Record<string, string> }): Promise<ConstantRateResult> {
  const agent = new Agent({ keepAlive: true, maxSockets: opts.connections });
  const total = Math.round(opts.rate * opts.seconds);
  const interval = 1000 / opts.rate;
  const latencies = new Float64Array(total);
  let done = 0;
  let ok = 0;
  let other = 0;
  let errors = 0;
  const start = performance.now();

  await new Promise<void>((resolve) => {
    let sent = 0;
    const finish = (i: number, due: number, status: number) => {
      latencies[i] = performance.now() - due;
      if (status >= 200 && status < 300) ok++;
      else if (status > 0) other++;
      else errors++;
      if (++done === total) resolve();
    };
    const send = (i: number, due: number) => {
      const req = request(opts.url, { agent, headers: opts.headers }, (res) => {
        res.resume();
        res.once('end', () => finish(i, due, res.statusCode ?? 0));
      });
      req.once('error', () => finish(i, due, 0));
      req.end();
    };
    const tick = () => {
      const now = performance.now();
      while (sent < total && start + sent * interval <= now) {
        send(sent, start + sent * interval);
        sent++;
      }
      if (sent < total) setTimeout(tick, Math.max(0, start + sent * interval - performance.now()));
    };
    tick();
  });
  const seconds = (performance.now() - start) / 1000;
  agent.destroy();
  latencies.sort();
  return {
    rate: opts.rate,
    achieved: ok / seconds,
    ok,
    other,
    errors,
    p50: quantile(latencies, 0.5),
    p99: quantile(latencies, 0.99),
    max: latencies[latencies.length - 1],
  };
}
