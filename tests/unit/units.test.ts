import { describe, expect, it } from 'vitest';
import { formatLength, fromMm, inchFraction, len, lengthText, MM_PER_INCH, parseLength, textInUnits, toMm } from '../../shared/units';

describe('units (16 CFR 500.19: 1 in = 25.4 mm exactly)', () => {
  it('defines the inch as exactly 25.4 mm (16 CFR 500.19; 1959 international yard and pound)', () => {
    expect(MM_PER_INCH).toBe(25.4);
    expect(toMm(1, 'in')).toBe(25.4);
    expect(fromMm(25.4, 'in')).toBe(1);
    expect(toMm(12.5, 'mm')).toBe(12.5);
  });

  it('converts the usual router bit sizes (pure arithmetic from 25.4 mm/in)', () => {
    expect(toMm(1 / 8, 'in')).toBeCloseTo(3.175, 12);
    expect(toMm(1 / 4, 'in')).toBeCloseTo(6.35, 12);
    expect(toMm(3 / 8, 'in')).toBeCloseTo(9.525, 12);
    expect(toMm(1 / 2, 'in')).toBeCloseTo(12.7, 12);
  });

  it('reads decimals, fractions and mixed numbers', () => {
    expect(parseLength('12.5', 'mm')).toEqual({ ok: true, mm: 12.5 });
    expect(parseLength('3/4', 'in')).toEqual({ ok: true, mm: 19.05 });
    expect(parseLength('1-1/2', 'in')).toEqual({ ok: true, mm: 38.1 });
    expect(parseLength('1 1/2', 'in')).toEqual({ ok: true, mm: 38.1 });
    expect(parseLength('.5', 'in')).toEqual({ ok: true, mm: 12.7 });
  });

  it('lets a suffix override the default unit', () => {
    expect(parseLength('3/4"', 'mm')).toEqual({ ok: true, mm: 19.05 });
    expect(parseLength('1-1/2 in', 'mm')).toEqual({ ok: true, mm: 38.1 });
    expect(parseLength('12.5mm', 'in')).toEqual({ ok: true, mm: 12.5 });
    expect(parseLength(' 6 mm ', 'in')).toEqual({ ok: true, mm: 6 });
  });

  it('refuses what is not a length, with a message', () => {
    for (const bad of ['', 'abc', '1/0', '-3', '1//2', '1.2.3', '3/4 ft']) {
      const r = parseLength(bad, 'in');
      expect(r.ok, bad).toBe(false);
      if (!r.ok) expect(r.message.length).toBeGreaterThan(5);
    }
  });

  it('formats millimetres and decimal inches', () => {
    expect(formatLength(12.5, 'mm')).toBe('12.5 mm');
    expect(formatLength(12.345, 'mm')).toBe('12.35 mm');
    expect(formatLength(19.05, 'in')).toBe('0.75"');
    expect(formatLength(25.4, 'in')).toBe('1"');
  });

  it('formats inches to the nearest 1/64, reduced', () => {
    expect(formatLength(38.1, 'in', { fraction: true })).toBe('1-1/2"');
    expect(formatLength(19.05, 'in', { fraction: true })).toBe('3/4"');
    expect(inchFraction(25.4 / 64)).toBe('1/64"');
    expect(inchFraction(50.8)).toBe('2"');
    expect(inchFraction(0)).toBe('0"');
    expect(inchFraction(25.4 * (1 + 63.7 / 64))).toBe('2"'); // rounds up to the next whole inch
    expect(inchFraction(-38.1)).toBe('-1-1/2"');
  });

  it('round-trips every 1/64 from 0 to 4 in through format and parse', () => {
    for (let n = 0; n <= 256; n++) {
      const mm = (n / 64) * 25.4;
      const r = parseLength(inchFraction(mm), 'mm');
      expect(r.ok).toBe(true);
      if (r.ok) expect(r.mm).toBeCloseTo(mm, 9);
    }
  });

  it('writes lengths inside a sentence in the reader\'s units (1 in = 25.4 mm; 6.35 mm = 1/4 in exactly)', () => {
    const t = lengthText`A ${len(6.35)} bit cannot cut a ${len(2)} corner {radius}; ${'ask'} first.`;
    expect(t.message).toBe('A 6.35 mm bit cannot cut a 2 mm corner {radius}; ask first.');
    expect(t.lengthsMm).toEqual([6.35, 2]);
    expect(textInUnits(t, 'mm')).toBe(t.message);
    // 6.35 / 25.4 = 0.25 exactly; 2 / 25.4 = 0.07874… → 0.079 (three places, as every inch figure on screen).
    expect(textInUnits(t, 'in')).toBe('A 0.25" bit cannot cut a 0.079" corner {radius}; ask first.');
    expect(textInUnits({ message: 'No lengths here.' }, 'in')).toBe('No lengths here.');
  });
});
