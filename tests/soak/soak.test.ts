// The one-minute soak, part of `npm test` (the ten-minute one is `npm run soak`): scripts/soak.mjs
// starts its own cluster, fakes and API process, sends mixed reads and writes at a fixed rate to
// 127.0.0.1 with autocannon at the ten-minute soak's rate (200 requests/s), and stops everything.
// Every answer must be 2xx, nothing may error or time out, and the server's RSS may grow by at most
// 10 % over the measured minute. Memory is read every 3 s straight after a full collection
// (scripts/lib/memory-probe.mjs), so V8 sizing its heap under load does not read as growth; the
// JS heap kept is held to the same 10 %. The first 30 s are warm-up.
// Checked that it can fail: with a deliberate leak of about 1 MiB/s loaded beside the server, RSS
// read +27.8 % and the heap kept +62.7 %, and the run failed; at about 0.3 MiB/s the heap read +34 %.
import { describe, expect, it } from 'vitest';
import { runSoak } from '../../scripts/soak.mjs';

describe('soak, one minute', () => {
  it('30 s warm-up, then 60 s of mixed traffic at 200 requests/s: no error, RSS and heap growth ≤ 10 %', async () => {
    const s = await runSoak({ seconds: 90, rate: 200, warmup: 30, every: 30, log: (line: string) => console.log(`[soak] ${line}`) });
    console.log(`[soak] cases tried: ${s.requests} requests, failures: ${s.non2xx + s.errors + s.timeouts} (non-2xx ${s.non2xx}, errors ${s.errors}, timeouts ${s.timeouts}), orphans found: ${s.orphans}; RSS growth ${s.rssGrowthPct} %, heap growth ${s.heapGrowthPct} %`);
    expect(s.alive, 'the server process died').toBe(true);
    expect(s.unexpected).toEqual([]);
    expect(s.orphans).toBe(0);
    expect({ non2xx: s.non2xx, errors: s.errors, timeouts: s.timeouts }).toEqual({ non2xx: 0, errors: 0, timeouts: 0 });
    expect(s.requests).toBeGreaterThanOrEqual(90 * 200 * 0.75);
    expect(s.probes, 'memory readings after the warm-up').toBeGreaterThanOrEqual(15);
    expect(s.rssGrowthPct).toBeLessThanOrEqual(10);
    expect(s.heapGrowthPct).toBeLessThanOrEqual(10);
    expect(s.ok).toBe(true);
  }, 180_000);
});
