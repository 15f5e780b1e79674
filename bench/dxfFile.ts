// Invented bench drawings, written as minimal ASCII DXF (a HEADER and an ENTITIES section, no
// tables or handles) in the R12 text layout: each group is a code line then a value line
// (Autodesk DXF Reference, "DXF Format"). $INSUNITS 4 = millimetres. LWPOLYLINE is formally an
// R14 entity; readers of minimal files (ours and dxf-parser) take it in an AC1009 header.

/** A small deterministic generator (mulberry32), so every run reads the same file. */
export function prng(seed: number): () => number {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const HEADER = ['0', 'SECTION', '2', 'HEADER', '9', '$ACADVER', '1', 'AC1009', '9', '$INSUNITS', '70', '4', '9', '$MEASUREMENT', '70', '1', '0', 'ENDSEC'];
const LAYER_NAMES = ['outline', 'pocket', 'recess', 'channel', 'guide'];

export interface BenchDxf {
  text: string;
  entities: Record<string, number>;
}

/**
 * About `targetBytes` of LINE, ARC and LWPOLYLINE entities (about 50 / 25 / 25 %) scattered over a
 * 2400 × 1200 mm sheet: about 100 000 entities for 10 MB.
 */
export function bigMixedDxf(targetBytes = 10 * 1024 * 1024, seed = 20261201): BenchDxf {
  const rnd = prng(seed);
  const f = (v: number) => v.toFixed(4);
  const parts: string[] = [HEADER.join('\n'), '0\nSECTION\n2\nENTITIES'];
  let bytes = parts[0].length + parts[1].length;
  const entities: Record<string, number> = { LINE: 0, ARC: 0, LWPOLYLINE: 0 };
  const end = '0\nENDSEC\n0\nEOF\n';
  while (bytes < targetBytes - end.length) {
    const layer = LAYER_NAMES[Math.floor(rnd() * LAYER_NAMES.length)];
    const x = rnd() * 2400;
    const y = rnd() * 1200;
    const pick = rnd();
    let e: string;
    if (pick < 0.5) {
      const a = rnd() * 2 * Math.PI;
      const len = 5 + rnd() * 60;
      e = `0\nLINE\n8\n${layer}\n10\n${f(x)}\n20\n${f(y)}\n30\n0.0\n11\n${f(x + len * Math.cos(a))}\n21\n${f(y + len * Math.sin(a))}\n31\n0.0`;
      entities.LINE++;
    } else if (pick < 0.75) {
      const r = 2 + rnd() * 40;
      const s = rnd() * 360;
      e = `0\nARC\n8\n${layer}\n10\n${f(x)}\n20\n${f(y)}\n30\n0.0\n40\n${f(r)}\n50\n${f(s)}\n51\n${f((s + 20 + rnd() * 300) % 360)}`;
      entities.ARC++;
    } else {
      const n = 3 + Math.floor(rnd() * 4);
      const closed = rnd() < 0.5;
      const v: string[] = [];
      let px = x;
      let py = y;
      for (let i = 0; i < n; i++) {
        v.push(`10\n${f(px)}\n20\n${f(py)}`);
        if (rnd() < 0.3) v.push(`42\n${f(rnd() - 0.5)}`);
        px += (rnd() - 0.5) * 40;
        py += (rnd() - 0.5) * 40;
      }
      e = `0\nLWPOLYLINE\n8\n${layer}\n90\n${n}\n70\n${closed ? 1 : 0}\n${v.join('\n')}`;
      entities.LWPOLYLINE++;
    }
    parts.push(e);
    bytes += e.length + 1;
  }
  parts.push(end);
  return { text: parts.join('\n'), entities };
}

/**
 * Two open zig-zag runs of `segments` LINE entities each, on the outline and pocket layers: after
 * import they draw as two layer paths of `segments` segments each. A 300 × 200 mm panel.
 */
export function twoLayerDxf(segments = 5000, seed = 7): BenchDxf {
  const rnd = prng(seed);
  const f = (v: number) => v.toFixed(3);
  const parts: string[] = [HEADER.join('\n'), '0\nSECTION\n2\nENTITIES'];
  const run = (layer: string, y0: number, amp: number) => {
    let x = 0;
    let y = y0;
    const step = 300 / segments;
    for (let i = 0; i < segments; i++) {
      const nx = x + step;
      const ny = y0 + (i % 2 === 0 ? amp : -amp) * (0.6 + 0.4 * rnd());
      parts.push(`0\nLINE\n8\n${layer}\n10\n${f(x)}\n20\n${f(y)}\n11\n${f(nx)}\n21\n${f(ny)}`);
      x = nx;
      y = ny;
    }
  };
  run('outline', 60, 40);
  run('pocket', 140, 25);
  parts.push('0\nENDSEC\n0\nEOF\n');
  return { text: parts.join('\n'), entities: { LINE: 2 * segments } };
}

/**
 * One open zig-zag run of `segments` LINE entities on the outline layer, 300 mm long. With
 * `changeFrom`, the segments from that index on swing wider: a later revision of the same part,
 * so a compare finds both unchanged and changed segments.
 */
export function zigzagDxf(segments = 5000, changeFrom = segments): BenchDxf {
  const rnd = prng(11);
  const f = (v: number) => v.toFixed(3);
  const parts: string[] = [HEADER.join('\n'), '0\nSECTION\n2\nENTITIES'];
  const step = 300 / segments;
  let x = 0;
  let y = 100;
  for (let i = 0; i < segments; i++) {
    const amp = (i >= changeFrom ? 55 : 40) * (0.6 + 0.4 * rnd());
    const nx = x + step;
    const ny = 100 + (i % 2 === 0 ? amp : -amp);
    parts.push(`0\nLINE\n8\noutline\n10\n${f(x)}\n20\n${f(y)}\n11\n${f(nx)}\n21\n${f(ny)}`);
    x = nx;
    y = ny;
  }
  parts.push('0\nENDSEC\n0\nEOF\n');
  return { text: parts.join('\n'), entities: { LINE: segments } };
}
