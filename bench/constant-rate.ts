/*
 * A load generator with a constant arrival rate (an open loop): the i-th request is due at
 * start + i / rate whatever the server does, it waits for a free keep-alive connection when all
 * are busy, and its latency runs from the moment it was due. A slow answer therefore delays the
 * requests behind it and shows in their latencies too; a closed loop (each connection sending its
 * next request when the last answer arrives, as autocannon does, whose rate option sends each
 * second's requests in one burst) would instead slow down with the server and hide that delay.
 * It speaks just enough HTTP/1.1 over raw sockets for GET answers with a Content-Length (Node's
 * http client costs a few hundred microseconds a request, enough to delay its own schedule).
 */
import { connect, type Socket } from 'node:net';

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

const HEADER_END = Buffer.from('\r\n\r\n');

/** One keep-alive connection with at most one request in flight. */
class Connection {
  private buffered: Buffer = Buffer.alloc(0);
  private inFlight: { due: number } | null = null;

  constructor(
    private readonly socket: Socket,
    private readonly request: Buffer,
    private readonly done: (due: number, status: number) => void,
  ) {
    socket.setNoDelay(true);
    socket.on('data', (chunk: Buffer) => this.receive(chunk));
    socket.on('error', () => this.fail());
    socket.on('close', () => this.fail());
  }

  get idle(): boolean {
    return this.inFlight === null && !this.socket.destroyed;
  }

  get closed(): boolean {
    return this.socket.destroyed;
  }

  send(due: number): void {
    this.inFlight = { due };
    this.socket.write(this.request);
  }

  close(): void {
    this.socket.destroy();
  }

  private receive(chunk: Buffer): void {
    this.buffered = this.buffered.length ? Buffer.concat([this.buffered, chunk]) : chunk;
    const end = this.buffered.indexOf(HEADER_END);
    if (end < 0 || !this.inFlight) return;
    const head = this.buffered.subarray(0, end).toString('latin1');
    const status = Number(head.slice(9, 12));
    const length = /\r\ncontent-length:\s*(\d+)/i.exec(head);
    if (!length) return this.fail();
    const total = end + HEADER_END.length + Number(length[1]);
    if (this.buffered.length < total) return;
    this.buffered = this.buffered.subarray(total);
    const { due } = this.inFlight;
    this.inFlight = null;
    this.done(due, status);
  }

  private fail(): void {
    if (!this.inFlight) return;
    const { due } = this.inFlight;
    this.inFlight = null;
    this.socket.destroy();
    this.done(due, 0);
  }
}

/**
 * GET `url` at `rate` requests per second for `seconds`, over at most `connections` keep-alive
 * connections, with `headers` on every request. Resolves when every request has been answered.
 */
export async function constantRate(opts: { url: string; rate: number; seconds: number; connections: number; headers?: Record<string, string> }): Promise<ConstantRateResult> {
  const url = new URL(opts.url);
  const headerLines = Object.entries({ host: url.host, ...opts.headers }).map(([k, v]) => `${k}: ${v}\r\n`);
  const request = Buffer.from(`GET ${url.pathname}${url.search} HTTP/1.1\r\n${headerLines.join('')}\r\n`, 'latin1');
  const total = Math.round(opts.rate * opts.seconds);
  const interval = 1000 / opts.rate;
  const latencies = new Float64Array(total);
  let recorded = 0;
  let ok = 0;
  let other = 0;
  let errors = 0;
  const waiting: number[] = [];
  let resolveAll = () => {};
  const finished = new Promise<void>((resolve) => (resolveAll = resolve));

  const pool: Connection[] = [];
  // Connections are taken in turn, so none stays idle long enough for the server's keep-alive timeout to close it under a request.
  let turn = 0;
  const dispatch = (due: number) => {
    let free: Connection | undefined;
    for (let k = 0; k < pool.length && !free; k++) {
      const c = pool[(turn + k) % pool.length];
      if (c.idle) {
        free = c;
        turn = (turn + k + 1) % pool.length;
      }
    }
    if (free) free.send(due);
    else if (pool.every((c) => c.closed))
      queueMicrotask(() => done(due, 0)); // no connection left: counted as an error
    else waiting.push(due);
  };
  const done = (due: number, status: number) => {
    latencies[recorded++] = performance.now() - due;
    if (status >= 200 && status < 300) ok++;
    else if (status > 0) other++;
    else errors++;
    if (recorded === total) resolveAll();
    else if (waiting.length) dispatch(waiting.shift()!);
  };
  await Promise.all(
    Array.from(
      { length: opts.connections },
      () =>
        new Promise<void>((resolve, reject) => {
          const socket = connect({ host: url.hostname, port: Number(url.port) }, () => resolve());
          socket.once('error', reject);
          pool.push(new Connection(socket, request, done));
        }),
    ),
  );

  const start = performance.now();
  let sent = 0;
  const tick = () => {
    const now = performance.now();
    while (sent < total && start + sent * interval <= now) dispatch(start + sent++ * interval);
    if (sent < total) setTimeout(tick, Math.max(0, start + sent * interval - performance.now()));
  };
  tick();
  await finished;
  const seconds = (performance.now() - start) / 1000;
  for (const c of pool) c.close();
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
