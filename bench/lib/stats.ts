// Percentiles and small formatting helpers shared by the benchmarks.
import os from 'node:os';

/** Nearest-rank percentile (p in 0–100) of unsorted samples. */
export function percentile(samples: number[], p: number): number {
  if (samples.length === 0) throw new Error('percentile of no samples');
  const sorted = [...samples].sort((a, b) => a - b);
  const rank = Math.ceil((p / 100) * sorted.length);
  return sorted[Math.min(sorted.length, Math.max(1, rank)) - 1];
}

export const median = (samples: number[]) => percentile(samples, 50);

export function ms(v: number): string {
  if (!Number.isFinite(v)) return String(v);
  return v < 10 ? `${v.toFixed(2)} ms` : v < 100 ? `${v.toFixed(1)} ms` : `${Math.round(v)} ms`;
}

/** Megabytes of 10^6 bytes (the stricter reading of a "300 MB" or "1.5 MB" target). */
export const MB = 1_000_000;
export function mb(bytes: number): string {
  return `${(bytes / MB).toFixed(bytes < 10 * MB ? 2 : 1)} MB`;
}

export function ratio(a: number, b: number): string {
  return b > 0 ? `${(a / b).toFixed(2)}×` : 'n/a';
}

/** The 1-, 5- and 15-minute load averages, for the notes. */
export function loadText(): string {
  return os
    .loadavg()
    .map((v) => v.toFixed(2))
    .join(' / ');
}

export const sleep = (msDelay: number) => new Promise((r) => setTimeout(r, msDelay));
