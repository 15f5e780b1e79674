// The one-minute soak inside `npm test` (the ten-minute one is `npm run soak`): scripts/soak.mjs
// starts its own cluster, fakes and API process, sends mixed reads and writes at a fixed rate to
// 127.0.0.1 for 60 s with autocannon, and stops everything. Every answer must be 2xx, nothing may
// error or time out, and the server's RSS may grow by at most 10 % after the warm-up.
// 60 requests/s here: this runs beside the other suites on two cores.
import { describe, expect, it } from 'vitest';
import { runSoak } from '../../scripts/soak.mjs';

describe('soak, one minute', () => {
  it('60 s of mixed traffic: no error, RSS growth ≤ 10 %', async () => {
    const s = await runSoak({ seconds: 60, rate: 60, warmup: 15, every: 20, log: (line: string) => console.log(`[soak] ${line}`) });
    console.log(`[soak] cases tried: ${s.requests} requests, failures: ${s.non2xx + s.errors + s.timeouts} (non-2xx ${s.non2xx}, errors ${s.errors}, timeouts ${s.timeouts}), orphans found: ${s.orphans}; RSS growth ${s.rssGrowthPct} %`);
    expect(s.alive, 'the server process died').toBe(true);
    expect(s.unexpected).toEqual([]);
    expect(s.orphans).toBe(0);
    expect({ non2xx: s.non2xx, errors: s.errors, timeouts: s.timeouts }).toEqual({ non2xx: 0, errors: 0, timeouts: 0 });
    expect(s.requests).toBeGreaterThanOrEqual(60 * 60 * 0.75);
    expect(s.rssGrowthPct).toBeLessThanOrEqual(10);
    expect(s.ok).toBe(true);
  }, 180_000);
});
