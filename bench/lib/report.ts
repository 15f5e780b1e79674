// The one table `npm run bench` prints and writes to bench/results.md.

export type Verdict = 'PASS' | 'MISS' | 'ERROR';

export interface Row {
  id: string;
  what: string;
  measured: string;
  baseline: string;
  ratio: string;
  target: string;
  verdict: Verdict;
  /** Why a row missed (which part of the target), or the error. */
  why?: string;
}

/** PASS only when every condition holds; otherwise MISS with the conditions that failed. */
export function judge(conditions: { ok: boolean; label: string }[]): { verdict: Verdict; why?: string } {
  const failed = conditions.filter((c) => !c.ok).map((c) => c.label);
  return failed.length ? { verdict: 'MISS', why: `misses: ${failed.join('; ')}` } : { verdict: 'PASS' };
}

export function errorRow(id: string, what: string, target: string, e: unknown): Row {
  const msg = e instanceof Error ? e.message : String(e);
  return { id, what, measured: '—', baseline: '—', ratio: '—', target, verdict: 'ERROR', why: msg.split('\n')[0].slice(0, 200) };
}

const cell = (s: string) => s.replace(/\|/g, '\\|').replace(/\n/g, ' ');

export function markdownTable(rows: Row[]): string {
  const head = ['#', 'benchmark', 'measured', 'baseline (same run)', 'ratio', 'target', 'result'];
  const lines = [`| ${head.join(' | ')} |`, `|${head.map(() => '---').join('|')}|`];
  for (const r of rows) {
    const verdict = r.verdict === 'PASS' ? 'PASS' : `**${r.verdict}**${r.why ? ` (${r.why})` : ''}`;
    lines.push(`| ${[r.id, r.what, r.measured, r.baseline, r.ratio, r.target, verdict].map(cell).join(' | ')} |`);
  }
  return lines.join('\n');
}
