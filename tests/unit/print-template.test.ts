// The printable template must print at 1:1: checked from the PDF's own coordinates.
import makerjs from 'makerjs';
import { describe, expect, it } from 'vitest';
import { OVERLAP_MM, planTiles, PT_PER_MM, templatePdf } from '../../files/print/template';

const info = { designTitle: 'Test plate', revisionNumber: 3, units: 'mm' as const, date: '2026-12-02', paper: 'a4' as const };

/** Rectangles drawn with the `re` operator (ISO 32000-1 §8.5.2.1: x y width height re). */
function rects(pdf: Buffer): number[][] {
  const text = pdf.toString('latin1');
  return [...text.matchAll(/(-?[\d.]+) (-?[\d.]+) (-?[\d.]+) (-?[\d.]+) re/g)].map((m) => m.slice(1, 5).map(Number));
}

describe('printable template', () => {
  it('has a calibration bar exactly 100 mm long (283.4646 pt at 72 pt/in, 1 in = 25.4 mm) and a 4 in bar of 288 pt', async () => {
    const pdf = await templatePdf(new makerjs.models.Rectangle(80, 50), info);
    expect(pdf.subarray(0, 5).toString()).toBe('%PDF-');
    const widths = rects(pdf).map((r) => r[2]);
    expect(widths.some((w) => Math.abs(w - 100 * PT_PER_MM) < 1e-3)).toBe(true);
    expect(Math.abs(100 * PT_PER_MM - 283.46456693)).toBeLessThan(1e-6);
    expect(widths.some((w) => Math.abs(w - 288) < 1e-3)).toBe(true);
    // The cover page is not scaled: no `cm` operator with a scale other than 1 or the y flip before the bar.
    const text = pdf.toString('latin1');
    const barAt = text.indexOf(`${(100 * PT_PER_MM).toFixed(3).slice(0, 6)}`);
    const before = text.slice(0, barAt);
    const scales = [...before.matchAll(/(-?[\d.]+) 0 0 (-?[\d.]+) [\d.-]+ [\d.-]+ cm/g)].map((m) => [Number(m[1]), Math.abs(Number(m[2]))]);
    for (const [sx, sy] of scales) expect([sx, sy]).toEqual([1, 1]);
  });

  it('fits a small part on one tile and tiles a large one with overlap (A4 and Letter)', () => {
    expect(planTiles(150, 200, 'a4')).toMatchObject({ cols: 1, rows: 1 });
    // A4 printable width 210 − 2·12 = 186 mm; step 176 mm: 500 mm needs ceil((500 − 10)/176) = 3 columns.
    const big = planTiles(500, 300, 'a4');
    expect(big.cols).toBe(3);
    expect(big.tiles[1].x).toBeCloseTo(big.areaW - OVERLAP_MM, 9);
    // Letter printable width 215.9 − 24 = 191.9 mm; step 181.9: ceil(490/181.9) = 3.
    expect(planTiles(500, 300, 'letter').cols).toBe(3);
    // Every point of the part lies on some tile.
    for (const x of [0, 175, 176, 351, 499.9]) expect(big.tiles.some((t) => x >= t.x && x <= t.x + big.areaW)).toBe(true);
  });

  it('writes one cover page plus one page per tile', async () => {
    const pdf = await templatePdf(new makerjs.models.Rectangle(500, 300), info);
    const pages = (pdf.toString('latin1').match(/\/Type \/Page\b/g) ?? []).length;
    const plan = planTiles(500, 300, 'a4');
    expect(pages).toBe(1 + plan.cols * plan.rows);
  });
});
