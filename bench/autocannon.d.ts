// The part of autocannon 8's programmatic API the bench uses (the package ships no types).
declare module 'autocannon' {
  import type { EventEmitter } from 'node:events';

  interface AutocannonRequest {
    method?: string;
    path?: string;
    headers?: Record<string, string>;
    body?: string;
    setupRequest?: (req: AutocannonRequest, context: Record<string, unknown>) => AutocannonRequest;
  }

  interface AutocannonOptions {
    url: string;
    connections?: number;
    amount?: number;
    duration?: number;
    timeout?: number;
    method?: string;
    headers?: Record<string, string>;
    body?: string;
    requests?: AutocannonRequest[];
    pipelining?: number;
    bailout?: number;
  }

  interface Histogram {
    average: number;
    mean: number;
    stddev: number;
    min: number;
    max: number;
    p50: number;
    p90: number;
    p97_5: number;
    p99: number;
  }

  interface AutocannonResult {
    latency: Histogram;
    requests: Histogram & { total: number };
    duration: number;
    errors: number;
    timeouts: number;
    non2xx: number;
    '2xx': number;
    statusCodeStats: Record<string, { count: number }>;
  }

  interface Instance extends EventEmitter {
    stop(): void;
    on(event: 'response', listener: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): this;
    on(event: 'reqError', listener: (error: Error) => void): this;
    on(event: 'done', listener: (result: AutocannonResult) => void): this;
  }

  function autocannon(opts: AutocannonOptions, cb: (err: Error | null, result: AutocannonResult) => void): Instance;
  export = autocannon;
}
