// Clearance suggestions on made-up cut logs, each answer worked by hand beside the check.
import { describe, expect, it } from 'vitest';
import { suggestClearance } from '../../shared/fit/clearance';

describe('clearance suggestion from a fit history (common practice: bracket the fit, then settle)', () => {
  it('has nothing to say without cuts', () => {
    expect(suggestClearance([])).toBeNull();
  });
  it('averages the good cuts: (0.5 + 0.75) / 2 = 0.625 mm', () => {
    const s = suggestClearance([
      { clearanceMm: 0.25, result: 'tight' },
      { clearanceMm: 0.5, result: 'good' },
      { clearanceMm: 0.75, result: 'good' },
      { clearanceMm: 1.25, result: 'loose' },
    ]);
    expect(s).toMatchObject({ clearanceMm: 0.625, cuts: 4 });
  });
  it('splits the gap between tight and loose: tight at 0.3, loose at 1.1 → 0.7 mm', () => {
    expect(suggestClearance([
      { clearanceMm: 0.1, result: 'tight' },
      { clearanceMm: 0.3, result: 'tight' },
      { clearanceMm: 1.1, result: 'loose' },
      { clearanceMm: 1.5, result: 'loose' },
    ])?.clearanceMm).toBe(0.7);
  });
  it('steps out by 0.25 mm when every cut was tight: 0.4 + 0.25 = 0.65 mm', () => {
    expect(suggestClearance([{ clearanceMm: 0.2, result: 'tight' }, { clearanceMm: 0.4, result: 'tight' }])?.clearanceMm).toBe(0.65);
  });
  it('steps in by 0.25 mm when every cut was loose, never below zero: 0.6 − 0.25 = 0.35; 0.1 → 0', () => {
    expect(suggestClearance([{ clearanceMm: 0.6, result: 'loose' }, { clearanceMm: 1, result: 'loose' }])?.clearanceMm).toBe(0.35);
    expect(suggestClearance([{ clearanceMm: 0.1, result: 'loose' }])?.clearanceMm).toBe(0);
  });
  it('leaves out a good cut that contradicts the bounds: good at 0.2 below tight at 0.4 is ignored, good 0.6 → 0.6 mm', () => {
    expect(suggestClearance([
      { clearanceMm: 0.4, result: 'tight' },
      { clearanceMm: 0.2, result: 'good' },
      { clearanceMm: 0.6, result: 'good' },
    ])?.clearanceMm).toBe(0.6);
  });
  it('says so when the history disagrees with itself', () => {
    const s = suggestClearance([{ clearanceMm: 1, result: 'tight' }, { clearanceMm: 0.5, result: 'loose' }]);
    expect(s?.basis).toMatch(/disagree/);
    expect(s?.clearanceMm).toBe(0.75);
  });
});
