// Bounded load: autocannon against the server on 127.0.0.1, and the same closed loop in process
// for the baselines. Both stop after `amount` requests, or at `maxSeconds` whichever comes first.
import autocannon from 'autocannon';

export interface LoadResult {
  latencies: number[];
  statusCounts: Record<string, number>;
  errors: number;
  seconds: number;
  /** Completed requests per second. */
  rate: number;
}

export interface CannonOptions {
  url: string;
  connections: number;
  amount: number;
  maxSeconds: number;
  method?: 'GET' | 'POST';
  headers?: Record<string, string>;
  /** Per-request path and body, for requests that rotate through ids. */
  next?: () => { path: string; body?: string };
}

export function cannon(o: CannonOptions): Promise<LoadResult> {
  const u = new URL(o.url);
  if (u.hostname !== '127.0.0.1') throw new Error(`load tests go to 127.0.0.1 only, not ${u.hostname}`);
  const latencies: number[] = [];
  const statusCounts: Record<string, number> = {};
  let errors = 0;
  const started = performance.now();
  return new Promise((resolve, reject) => {
    const next = o.next;
    const instance = autocannon(
      {
        url: o.url,
        connections: o.connections,
        amount: o.amount,
        timeout: 30,
        method: o.method ?? 'GET',
        headers: o.headers,
        requests: next ? [{ setupRequest: (req) => ({ ...req, ...next() }) }] : undefined,
      },
      (err) => {
        clearTimeout(watchdog);
        if (err) return reject(err);
        const seconds = (performance.now() - started) / 1000;
        resolve({ latencies, statusCounts, errors, seconds, rate: latencies.length / seconds });
      },
    );
    const watchdog = setTimeout(() => instance.stop(), o.maxSeconds * 1000);
    instance.on('response', (_client, statusCode, _bytes, responseTime) => {
      latencies.push(responseTime);
      statusCounts[statusCode] = (statusCounts[statusCode] ?? 0) + 1;
    });
    instance.on('reqError', () => {
      errors++;
    });
  });
}

/** `concurrency` workers call `fn` until `amount` calls have been made (or time runs out). */
export async function closedLoop(concurrency: number, amount: number, maxSeconds: number, fn: (i: number) => Promise<void>): Promise<LoadResult> {
  const latencies: number[] = [];
  let issued = 0;
  let errors = 0;
  let firstError: unknown;
  const started = performance.now();
  const deadline = started + maxSeconds * 1000;
  const worker = async () => {
    while (issued < amount && performance.now() < deadline) {
      const i = issued++;
      const t0 = performance.now();
      try {
        await fn(i);
        latencies.push(performance.now() - t0);
      } catch (e) {
        errors++;
        firstError ??= e;
      }
    }
  };
  await Promise.all(Array.from({ length: concurrency }, worker));
  if (errors && latencies.length === 0) throw firstError;
  const seconds = (performance.now() - started) / 1000;
  return { latencies, statusCounts: { ok: latencies.length }, errors, seconds, rate: latencies.length / seconds };
}

/** "all 5000 answered 200" or what went wrong, for the notes. */
export function statusText(r: LoadResult, expected: number): string {
  const parts = Object.entries(r.statusCounts).map(([k, v]) => `${v}× ${k}`);
  const bad = Object.entries(r.statusCounts).filter(([k]) => k !== String(expected) && k !== 'ok');
  return `${parts.join(', ')}${r.errors ? `, ${r.errors} errors` : ''}${bad.length || r.errors ? ' (NOT all as expected)' : ''}`;
}
