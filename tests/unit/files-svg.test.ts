// SVG import and the preview renderer. Units: CSS absolute lengths, 96 px = 1 in, 1 in = 25.4 mm
// (W3C CSS Values and Units Level 3, §5.2; 16 CFR 500.19). Geometry attributes per SVG 1.1 (W3C).
import makerjs from 'makerjs';
import { describe, expect, it } from 'vitest';
import { FileRejected } from '../../files/errors';
import { importSvg } from '../../files/svg/import';
import { modelToSvg } from '../../files/svg/render';
import { summarizeModel } from '../../shared/geometry/summary';
import { LAYER_STYLE } from '../../shared/geometry/layers';

const svg = (body: string, root = 'width="100mm" height="50mm" viewBox="0 0 100 50"') => `<?xml version="1.0" encoding="UTF-8"?>\n<svg xmlns="http://www.w3.org/2000/svg" ${root}>${body}</svg>`;

function extents(model: makerjs.IModel) {
  const e = makerjs.measure.modelExtents(model)!;
  return { minX: e.low[0], minY: e.low[1], maxX: e.high[0], maxY: e.high[1] };
}
const paths = (model: makerjs.IModel) => Object.values(model.paths ?? {});

function rejection(fn: () => unknown): FileRejected {
  try {
    fn();
  } catch (e) {
    if (e instanceof FileRejected) return e;
    throw e;
  }
  throw new Error('expected a FileRejected error');
}

function expectExtents(model: makerjs.IModel, want: { minX: number; minY: number; maxX: number; maxY: number }, digits = 9) {
  const got = extents(model);
  for (const k of ['minX', 'minY', 'maxX', 'maxY'] as const) expect(got[k]).toBeCloseTo(want[k], digits);
}

describe('SVG units and orientation', () => {
  it('reads a rect at its size in mm from width/height in mm and the viewBox, y flipped up', () => {
    const r = importSvg(svg('<rect x="10" y="5" width="80" height="30"/>'));
    expect(r.sourceUnits).toBe('mm');
    expect(r.unitsFrom).toBe('svg-size');
    expect(r.entityCounts).toEqual({ rect: 1 });
    // SVG y 5..35 down from the top of a 50 mm page is 15..45 up from its bottom
    expectExtents(r.model, { minX: 10, minY: 15, maxX: 90, maxY: 45 });
    expect(summarizeModel(r.model).area).toBeCloseTo(2400, 9);
  });

  it('reads inches: width="4in" over a 400-unit viewBox is 101.6 mm (16 CFR 500.19)', () => {
    const r = importSvg(svg('<rect width="400" height="200"/>', 'width="4in" height="2in" viewBox="0 0 400 200"'));
    expect(r.sourceUnits).toBe('in');
    expectExtents(r.model, { minX: 0, minY: 0, maxX: 101.6, maxY: 50.8 });
  });

  it('reads centimetres', () => {
    const r = importSvg(svg('<rect width="10" height="5"/>', 'width="10cm" height="5cm" viewBox="0 0 10 5"'));
    expect(r.sourceUnits).toBe('cm');
    expectExtents(r.model, { minX: 0, minY: 0, maxX: 100, maxY: 50 });
  });

  it('reads CSS pixels at 96 per inch when only a viewBox is given, and says so', () => {
    const r = importSvg(svg('<rect width="96" height="48"/>', 'viewBox="0 0 96 96"'));
    expect(r.sourceUnits).toBe('px');
    expect(r.unitsFrom).toBe('svg-px');
    expectExtents(r.model, { minX: 0, minY: 48 * (25.4 / 96), maxX: 25.4, maxY: 25.4 });
  });

  it('reads user units as pixels when there is no viewBox', () => {
    const r = importSvg(svg('<line x1="0" y1="0" x2="192" y2="0"/>', 'width="192" height="96"'));
    expect(r.unitsFrom).toBe('svg-px');
    expectExtents(r.model, { minX: 0, minY: 25.4, maxX: 50.8, maxY: 25.4 });
  });

  it('centres a viewBox of another aspect ratio (preserveAspectRatio xMidYMid meet, SVG 1.1 §7.8)', () => {
    const r = importSvg(svg('<rect width="10" height="10"/>', 'width="40mm" height="20mm" viewBox="0 0 10 10"'));
    expectExtents(r.model, { minX: 10, minY: 0, maxX: 30, maxY: 20 });
  });

  it('accepts lengths with units on shapes (mm at 96 px per inch)', () => {
    const r = importSvg(svg('<circle cx="10mm" cy="10mm" r="5mm"/>', 'width="50mm" height="50mm" viewBox="0 0 188.97637795 188.97637795"'));
    const [c] = paths(r.model) as makerjs.IPathCircle[];
    expect(c.type).toBe('circle');
    expect(c.radius).toBeCloseTo(5, 6);
    expect(c.origin[0]).toBeCloseTo(10, 6);
    expect(c.origin[1]).toBeCloseTo(40, 6);
  });
});

describe('SVG shapes, paths and transforms', () => {
  it('reads path data through makerjs, with compact arc flags (SVG 1.1 path grammar)', () => {
    // a 10 × 10 square and a half circle of radius 5 on (20,10)–(30,10): "a5 5 0 1010 0" = flags 1, 0, then 10 0
    const r = importSvg(svg('<path d="M0,0h10v10H0z M20 10a5 5 0 1010 0z"/>'));
    const arcs = paths(r.model).filter((p) => p.type === 'arc') as makerjs.IPathArc[];
    expect(arcs).toHaveLength(1);
    expect(arcs[0].radius).toBeCloseTo(5, 9);
    expect(makerjs.angle.ofArcSpan(arcs[0])).toBeCloseTo(180, 9);
    const s = summarizeModel(r.model);
    expect(s.closedContours).toBe(2);
    expect(s.area).toBeCloseTo(100 + (Math.PI * 25) / 2, 6);
  });

  it('flattens cubic Béziers on the curve, within 0.01 mm, and reflects S control points (SVG 1.1 §8.3.6)', () => {
    // P0 (0,10) P1 (0,0) P2 (10,0) P3 (10,10) (y down): x = 10t²(3 − 2t), y = 10 − 30t(1 − t), apex 7.5 up at t = ½ (D);
    // S 20 20 20 10 reflects P2 about (10,10) to (10,20): the second curve is the first turned over, apex 7.5 down
    const r = importSvg(svg('<path d="M0 10 c0 -10 10 -10 10 0 S 20 20 20 10"/>', 'width="20mm" height="20mm" viewBox="0 0 20 20"'));
    const pts = (paths(r.model) as makerjs.IPathLine[]).map((l) => [l.end[0], 20 - l.end[1]]);
    for (const [x, y] of pts) {
      const first = x <= 10;
      const u = first ? x : x - 10;
      let lo = 0;
      let hi = 1;
      for (let k = 0; k < 80; k++) {
        const t = (lo + hi) / 2;
        if (10 * t * t * (3 - 2 * t) < u) lo = t;
        else hi = t;
      }
      const curveY = 30 * lo * (1 - lo);
      expect(y).toBeCloseTo(first ? 10 - curveY : 10 + curveY, 6);
    }
    const e = extents(r.model);
    expect(20 - e.maxY).toBeGreaterThan(2.5 - 1e-9); // SVG y of the apex: 10 − 7.5
    expect(20 - e.maxY).toBeLessThan(2.5 + 0.01);
    expect(20 - e.minY).toBeGreaterThan(17.5 - 0.01);
    expect(r.warnings.join(' ')).toMatch(/2 curves were replaced by straight segments within 0.01 mm/);
  });

  it('flattens quadratic Béziers and reflects T control points', () => {
    // Q 5 0 10 10 from (0,10): apex 5 above the chord at x = 5; T 20 10 reflects (5,0) about (10,10) → apex 5 below (D)
    const r = importSvg(svg('<path d="M0 10 Q 5 0 10 10 T 20 10"/>', 'width="20mm" height="20mm" viewBox="0 0 20 20"'));
    const e = extents(r.model);
    expect(e.maxY).toBeCloseTo(15, 2);
    expect(e.maxY).toBeLessThanOrEqual(15 + 1e-9);
    expect(e.minY).toBeCloseTo(5, 2);
    expect(e.minY).toBeGreaterThanOrEqual(5 - 1e-9);
  });

  it('flattens elliptical arcs from their centre form (SVG 1.1 F.6.5), rotation included', () => {
    // half of the ellipse centred (20,10), rx 20, ry 10, through its top (sweep 1 runs clockwise on screen)
    const r = importSvg(svg('<path d="M 0 10 A 20 10 0 0 1 40 10"/>', 'width="40mm" height="20mm" viewBox="0 0 40 20"'));
    for (const l of paths(r.model) as makerjs.IPathLine[]) {
      const [x, y] = [l.end[0], 20 - l.end[1]];
      expect(((x - 20) / 20) ** 2 + ((y - 10) / 10) ** 2).toBeCloseTo(1, 9);
      expect(y).toBeLessThanOrEqual(10 + 1e-9);
    }
    // the same arc turned 30° about its centre by the arc's own x-axis-rotation: every vertex fits
    // the turned ellipse ((u/20)² + (v/10)² = 1 in the ellipse's own axes)
    const c = Math.cos(Math.PI / 6);
    const sn = Math.sin(Math.PI / 6);
    const [sx, sy] = [20 - 20 * c, 10 - 20 * sn];
    const [ex, ey] = [20 + 20 * c, 10 + 20 * sn];
    const rot = importSvg(svg(`<path d="M ${sx} ${sy} A 20 10 30 0 1 ${ex} ${ey}"/>`, 'width="40mm" height="40mm" viewBox="0 -10 40 40"'));
    for (const l of paths(rot.model) as makerjs.IPathLine[]) {
      const [x, y] = [l.end[0] - 20, 30 - l.end[1] - 10];
      const u = c * x + sn * y;
      const v = -sn * x + c * y;
      expect((u / 20) ** 2 + (v / 10) ** 2).toBeCloseTo(1, 9);
    }
  });

  it('reads a rounded rect as w·h − (4 − π)·r² (shared/REFERENCES.md: 80 × 160, r 3.175 → 12791.3467 mm²)', () => {
    const r = importSvg(svg('<rect x="10" y="10" width="80" height="160" rx="3.175"/>', 'width="100mm" height="180mm" viewBox="0 0 100 180"'));
    const s = summarizeModel(r.model);
    expect(s.closedContours).toBe(1);
    expect(s.area).toBeCloseTo(12791.3467, 3);
    expect(paths(r.model).filter((p) => p.type === 'arc')).toHaveLength(4);
  });

  it('reads circle, ellipse, line, polyline and polygon', () => {
    const r = importSvg(svg('<circle cx="50" cy="25" r="10"/><ellipse cx="20" cy="25" rx="10" ry="5"/><line x1="0" y1="0" x2="5" y2="5"/><polyline points="0,40 10,40 10,45"/><polygon points="70 10 90 10 80 20"/>'));
    expect(r.entityCounts).toEqual({ circle: 1, ellipse: 1, line: 1, polyline: 1, polygon: 1 });
    const s = summarizeModel(r.model);
    expect(s.closedContours).toBe(3); // circle, ellipse, polygon
    expect(s.openContours).toBe(2);
    // areas: π·10² + π·10·5 (inscribed polygon, within perimeter × 0.01 mm) + ½·20·10 (D)
    const exact = Math.PI * 100 + Math.PI * 50 + 100;
    expect(s.area).toBeLessThanOrEqual(exact + 1e-9);
    expect(s.area).toBeGreaterThan(exact - 0.01 * 2 * Math.PI * 10);
  });

  it('applies nested transforms: translate, scale, rotate and matrix (SVG 1.1 §7.6)', () => {
    const r = importSvg(svg('<g transform="translate(50 25)"><g transform="rotate(90)"><rect x="0" y="0" width="20" height="10"/></g></g>'));
    // rotate(90) maps (x, y) → (−y, x) in SVG coordinates: the rect spans x 40..50, y 25..45 down
    expectExtents(r.model, { minX: 40, minY: 5, maxX: 50, maxY: 25 });
    const m = importSvg(svg('<rect width="10" height="10" transform="matrix(2 0 0 1 5 0) scale(1, 0.5)"/>'));
    expectExtents(m.model, { minX: 5, minY: 45, maxX: 25, maxY: 50 });
  });

  it('draws a circle under a skew as a sampled curve within 0.01 mm', () => {
    const r = importSvg(svg('<circle cx="0" cy="0" r="10" transform="translate(50 25) skewX(30)"/>'));
    expect(paths(r.model).every((p) => p.type === 'line')).toBe(true);
    expect(summarizeModel(r.model).closedContours).toBe(1);
    expect(r.warnings.join(' ')).toMatch(/straight segments within 0.01 mm/);
  });

  it('places <use href="#id"> copies moved by x and y', () => {
    const r = importSvg(svg('<defs><circle id="peg" cx="0" cy="0" r="2"/></defs><use href="#peg" x="10" y="10"/><use xlink:href="#peg" x="30" y="10" xmlns:xlink="http://www.w3.org/1999/xlink"/>'));
    const centres = (paths(r.model) as makerjs.IPathCircle[]).map((c) => [c.origin[0], c.origin[1]]);
    expect(centres).toEqual([[10, 40], [30, 40]]);
  });

  it('takes layers from data-layer, a layer-<name> class or a layer id, inherited from groups', () => {
    const r = importSvg(svg('<g id="pocket"><rect width="5" height="5"/></g><circle r="1" cx="20" cy="20" class="x layer-relief"/><line x2="5" data-layer="MARKS"/><line y2="5"/>'));
    const layers = paths(r.model).map((p) => p.layer);
    expect(layers).toEqual(['pocket', 'pocket', 'pocket', 'pocket', 'relief', 'marks', 'outline']);
  });

  it('leaves text and images out with a warning, and skips hidden elements', () => {
    const r = importSvg(svg('<rect width="5" height="5"/><text x="0" y="0">Jig</text><image href="data:image/png;base64,iVBORw0KGgo=" width="1" height="1"/><rect width="9" height="9" style="display: none"/>'));
    expect(paths(r.model)).toHaveLength(4);
    expect(r.warnings.join(' ')).toMatch(/<text> ×1, <image> ×1/);
    expect(r.warnings.join(' ')).toMatch(/1 hidden element/);
  });
});

describe('SVG files that are refused or stripped, each with a clear message', () => {
  it.each([
    ['a <script> element', '<script>alert(1)</script><rect width="1" height="1"/>', /<script> element/],
    ['a namespaced script', '<html:script xmlns:html="http://www.w3.org/1999/xhtml">x()</html:script>', /<script> element/],
    ['an onload handler', '<rect width="1" height="1" onload="alert(1)"/>', /event-handler attribute \(onload/],
    ['a foreignObject', '<foreignObject width="10" height="10"><div xmlns="http://www.w3.org/1999/xhtml">hi</div></foreignObject>', /<foreignObject> element/],
    ['an external href (http)', '<use href="http://example.invalid/parts.svg#a"/>', /link to an outside resource/],
    ['an external href (file)', '<image xlink:href="file:///etc/passwd" xmlns:xlink="http://www.w3.org/1999/xlink" width="1" height="1"/>', /link to an outside resource/],
    ['a javascript: link', '<a href="javascript:alert(1)"><rect width="1" height="1"/></a>', /script link|outside resource/],
    ['an outside url() in a style', '<rect width="1" height="1" style="fill:url(http://example.invalid/p.svg#g)"/>', /outside resource/],
    ['an @import in a style sheet', '<style>@import url(x.css);</style><rect width="1" height="1"/>', /@import/],
    ['a <set> that adds an onclick handler', '<rect width="1" height="1"><set attributeName="onclick" to="alert(1)"/></rect>', /animation that sets onclick/],
    ['an <animate> that rewrites href', '<a href="#r"><animate attributeName="xlink:href" values="http://example.invalid/"/><rect id="r" width="1" height="1"/></a>', /animation that sets xlink:href/],
  ])('refuses %s', (_label, body, message) => {
    const e = rejection(() => importSvg(svg(body)));
    expect(e.code).toBe('unsafe_svg');
    expect(e.message).toMatch(message);
  });

  it('refuses <!DOCTYPE> and <!ENTITY> declarations (no entity expansion)', () => {
    const laughs = '<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY a "aaaaaaaaaa"><!ENTITY b "&a;&a;&a;&a;&a;&a;&a;&a;&a;&a;">]><svg xmlns="http://www.w3.org/2000/svg"><text>&b;</text></svg>';
    const e = rejection(() => importSvg(laughs));
    expect(e.code).toBe('unsafe_svg');
    expect(e.message).toMatch(/DOCTYPE or ENTITY/);
    expect(rejection(() => importSvg(svg('<rect width="1" height="1"/>').replace('<svg', '<!ENTITY x "y"><svg'))).code).toBe('unsafe_svg');
  });

  it('refuses an outside style sheet processing instruction', () => {
    expect(rejection(() => importSvg('<?xml-stylesheet href="http://example.invalid/a.css"?>' + svg('<rect width="1" height="1"/>'))).code).toBe('unsafe_svg');
  });

  it('refuses malformed or truncated XML with the line and column', () => {
    const full = svg('<g><rect width="1" height="1"/></g>');
    const e = rejection(() => importSvg(full.slice(0, full.length - 10)));
    expect(e.code).toBe('invalid_svg');
    expect(e.message).toMatch(/not well-formed XML \(line \d+, column \d+/);
  });

  it('refuses a root that is not <svg>', () => {
    expect(rejection(() => importSvg('<html><body><svg></svg></body></html>')).message).toMatch(/root element is <html>, not <svg>/);
  });

  it('refuses path data that is not valid, naming the element', () => {
    const e = rejection(() => importSvg(svg('<path id="rim" d="M 0 0 L 10 X 5"/>')));
    expect(e.code).toBe('invalid_svg');
    expect(e.message).toMatch(/path data of <path id="rim"> is not valid \(expected a number at character 12\)/);
    expect(rejection(() => importSvg(svg('<path d="M 0 0 L 3"/>'))).message).toMatch(/expected a number/);
    expect(rejection(() => importSvg(svg('<path d="L 0 0"/>'))).message).toMatch(/must start with a move/);
  });

  it('refuses transforms it cannot read, and percentages', () => {
    expect(rejection(() => importSvg(svg('<rect width="1" height="1" transform="spin(3)"/>'))).code).toBe('unsupported_svg');
    expect(rejection(() => importSvg(svg('<rect width="50%" height="1"/>'))).message).toMatch(/percentage/);
  });

  it('refuses NaN, 1e308 and out-of-range coordinates', () => {
    expect(rejection(() => importSvg(svg('<line x1="NaN" x2="1"/>'))).code).toBe('invalid_svg');
    expect(rejection(() => importSvg(svg('<line x1="0" x2="1e308"/>'))).code).toBe('bad_coordinate');
    expect(rejection(() => importSvg(svg('<path d="M 0 0 L 1e400 0"/>'))).message).toMatch(/out of range/);
    expect(rejection(() => importSvg(svg('<circle r="1" cx="2000000"/>'))).message).toMatch(/within ±1,000,000 mm/);
  });

  it('refuses more elements than the limit, and deep or circular <use>', () => {
    const many = Array.from({ length: 60 }, (_, i) => `<line x1="${i}" x2="${i + 1}"/>`).join('');
    expect(rejection(() => importSvg(svg(many), { maxElements: 50 })).code).toBe('too_many_entities');
    expect(rejection(() => importSvg(svg('<g id="a"><use href="#a"/></g>'))).message).toMatch(/uses itself/);
    expect(rejection(() => importSvg(svg('<use href="#missing"/>'))).message).toMatch(/does not define/);
  });

  it('refuses a file with nothing to cut', () => {
    const e = rejection(() => importSvg(svg('<text>only words</text>')));
    expect(e.code).toBe('no_geometry');
    expect(e.message).toMatch(/only <text> ×1/);
  });
});

describe('modelToSvg (reuses shared/geometry/svg.ts)', () => {
  const model = (): makerjs.IModel => ({
    units: makerjs.unitType.Millimeter,
    paths: {
      a: { ...new makerjs.paths.Line([-20, 10], [80, 10]), layer: 'outline' },
      b: { ...new makerjs.paths.Line([80, 10], [80, 60]), layer: 'outline' },
      c: { ...new makerjs.paths.Circle([30, 35], 5), layer: 'pocket' },
    },
  });

  it('sizes the drawing in mm (viewBox in mm, width/height with mm units) so it prints 1:1', () => {
    const out = modelToSvg(model(), { title: 'Hinge jig <v2> & co' });
    expect(out).toMatch(/^<svg width="100mm" height="50mm" viewBox="0 0 100 50"/);
    expect(out).toContain('<title>Hinge jig &lt;v2&gt; &amp; co</title>');
  });

  it('draws each layer in its style from shared/geometry/layers.ts', () => {
    const out = modelToSvg(model());
    expect(out).toContain(`stroke="${LAYER_STYLE.outline.stroke}"`);
    expect(out).toContain(`stroke-dasharray:${LAYER_STYLE.pocket.dash}`);
    expect(out).not.toMatch(/<script|on\w+=/i);
  });

  it('flips y correctly: importing the preview gives back the same shapes in the same places', () => {
    const m = model();
    const back = importSvg(modelToSvg(m));
    const a = extents(m);
    const b = extents(back.model);
    // the preview's frame starts at the drawing's lower-left corner
    expect(b.maxX - b.minX).toBeCloseTo(a.maxX - a.minX, 9);
    expect(b.maxY - b.minY).toBeCloseTo(a.maxY - a.minY, 9);
    const circle = paths(back.model).filter((p) => p.layer === 'pocket');
    const ce = makerjs.measure.modelExtents({ paths: Object.fromEntries(circle.map((p, i) => [`c${i}`, p])) })!;
    expect(ce.center[0]).toBeCloseTo(30 - a.minX, 9);
    expect(ce.center[1]).toBeCloseTo(35 - a.minY, 9);
  });

  it('can state its size in inches, keeping the viewBox in mm', () => {
    const out = modelToSvg(model(), { units: 'in' });
    const m = /^<svg width="([\d.]+)in" height="([\d.]+)in" viewBox="0 0 100 50"/.exec(out)!;
    expect(Number(m[1])).toBeCloseTo(100 / 25.4, 6);
    expect(Number(m[2])).toBeCloseTo(50 / 25.4, 6);
  });
});
