// The generator and calculator routes through the real app (supertest). Pure computation: public.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { GeometrySummary } from '../../shared/schemas/geometry';
import { createTestContext, type TestContext } from '../support/context';


let ctx: TestContext;
beforeAll(async () => {
  ctx = await createTestContext();
});
afterAll(async () => ctx?.close());

describe('GET /api/generators', () => {
  it('lists each generator with its declarations, device params and docs', async () => {
    const res = await ctx.http.get('/api/generators');
    expect(res.status).toBe(200);
    const ids = res.body.generators.map((g: { id: string }) => g.id);
    expect(ids).toEqual(['charger-insert', 'taper-jig', 'splayed-box', 'half-lap']);
    const charger = res.body.generators[0];
    expect(charger).toMatchObject({ title: expect.any(String), kind: 'insert', description: expect.any(String), deviceParams: ['deviceWidth', 'deviceLength', 'deviceThickness', 'caseAllowance'] });
    expect(charger.params.find((p: { name: string }) => p.name === 'openingWidth')).toMatchObject({ type: 'number', unit: 'mm', min: 40, label: 'Opening width' });
    expect(charger.docs).toMatch(/^\| Parameter \| Name \|/);
    expect(charger.docs).toContain('`openingWidth`');
  });
});

describe('POST /api/generators/:id/preview', () => {
  it('answers an SVG, the fit report and the geometry summary for the defaults', async () => {
    const res = await ctx.http.post('/api/generators/charger-insert/preview').send({ params: {} });
    expect(res.status).toBe(200);
    expect(res.body.svg).toMatch(/^<svg [^>]*width="119.2mm"/);
    expect(res.body.undersideSvg).toMatch(/^<svg /);
    expect(GeometrySummary.parse(res.body.summary)).toEqual(res.body.summary);
    // Rounded rectangle closed form A = w·h − (4 − π)·r² (pure geometry).
    expect(Math.abs(res.body.summary.area - (119.2 * 199.2 - (4 - Math.PI) * 5.95 ** 2))).toBeLessThan(0.01);
    expect(res.body.report.values.find((v: { key: string }) => v.key === 'recessDepth')).toMatchObject({ value: 13, unit: 'mm' });
    expect(res.body.report.warnings).toEqual([]);
  });

  it('reports warnings with the fields to change', async () => {
    const res = await ctx.http.post('/api/generators/charger-insert/preview').send({ params: { skinThickness: 4 } });
    expect(res.status).toBe(200);
    expect(res.body.report.warnings).toEqual([expect.objectContaining({ code: 'skin_too_thick', severity: 'caution', fields: expect.arrayContaining(['skinThickness']) })]);
  });

  it('treats a missing body as the defaults', async () => {
    const res = await ctx.http.post('/api/generators/splayed-box/preview');
    expect(res.status).toBe(200);
    // Table-saw manual chart, N = 4, S = 15°: 43.08° / 14.51°.
    expect(res.body.report.values.find((v: { key: string }) => v.key === 'bladeTilt').value).toBeCloseTo(43.08, 2);
  });

  it('answers 400 invalid_params with one message per field, for ranges, types and unknown keys', async () => {
    const res = await ctx.http.post('/api/generators/charger-insert/preview').send({ params: { openingWidth: 30, stock: 'steel', bogus: 1 } });
    expect(res.status).toBe(400);
    expect(res.body.error).toEqual({
      code: 'invalid_params',
      message: 'Opening width must be at least 40 mm (and 2 more)',
      fields: {
        openingWidth: 'Opening width must be at least 40 mm',
        stock: expect.stringMatching(/^Stock must be one of: Plywood, White oak/),
        bogus: 'Unknown parameter "bogus"',
      },
    });
  });

  it('answers 400 on inconsistent combinations, on the field to change', async () => {
    const res = await ctx.http.post('/api/generators/charger-insert/preview').send({ params: { plateThickness: 8, pocketDepth: 4, skinThickness: 4 } });
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_params');
    expect(Object.keys(res.body.error.fields)).toEqual(['skinThickness']);
  });

  it('answers 400 when params is not an object', async () => {
    const res = await ctx.http.post('/api/generators/taper-jig/preview').send({ params: [1, 2] });
    expect(res.status).toBe(400);
    expect(res.body.error.fields._).toMatch(/object/);
  });

  it('answers 404 for an unknown generator', async () => {
    const res = await ctx.http.post('/api/generators/no-such-thing/preview').send({ params: {} });
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });
});

describe('calculators', () => {
  it('GET /api/calculators lists the four with their declarations', async () => {
    const res = await ctx.http.get('/api/calculators');
    expect(res.status).toBe(200);
    expect(res.body.calculators.map((c: { id: string }) => c.id)).toEqual(['wood-movement', 'taper', 'compound-bevel', 'frame-miter']);
    expect(res.body.calculators[0].params.length).toBeGreaterThan(3);
  });

  it('POST /api/calculators/wood-movement gives the Wood Handbook worked value (FPL-GTR-190: 4.380 mm)', async () => {
    const res = await ctx.http.post('/api/calculators/wood-movement').send({ params: { species: 'white-oak', cut: 'flatsawn', width: 200, mcFrom: 6, mcTo: 12 } });
    expect(res.status).toBe(200);
    expect(res.body.values.find((v: { key: string }) => v.key === 'change')).toMatchObject({ value: 4.38, unit: 'mm' });
    expect(res.body.warnings).toEqual([]);
  });

  it('POST /api/calculators/taper: 2.3859° (pure geometry)', async () => {
    const res = await ctx.http.post('/api/calculators/taper').send({ params: { wide: 50.8, narrow: 25.4, length: 609.6 } });
    expect(res.status).toBe(200);
    expect(res.body.values[0]).toMatchObject({ key: 'anglePerEdge', value: 2.3859, unit: 'deg' });
  });

  it('answers 400 with field messages, and 404 for an unknown calculator', async () => {
    const bad = await ctx.http.post('/api/calculators/frame-miter').send({ params: { cornerAngle: 200, pieces: 2.5 } });
    expect(bad.status).toBe(400);
    expect(bad.body.error).toMatchObject({ code: 'invalid_params', fields: { cornerAngle: 'Corner angle must be at most 179°', pieces: expect.any(String) } });
    const missing = await ctx.http.post('/api/calculators/nope').send({ params: {} });
    expect(missing.status).toBe(404);
  });

  it('declares all four routes public in the route list', () => {
    const mine = ctx.api.defs.filter((d) => d.path.startsWith('/generators') || d.path.startsWith('/calculators'));
    expect(mine.map((d) => `${d.method} ${d.path}`).sort()).toEqual(['get /calculators', 'get /generators', 'post /calculators/:name', 'post /generators/:id/preview']);
    for (const d of mine) expect(d.policy).toEqual({ kind: 'public' });
  });
});
