// SVG → the internal geometry (a flat makerjs model in millimetres, y up). The text is checked for
// anything unsafe before it is parsed (no DTD, so no entity expansion; no scripts, event handlers,
// embedded documents or outside references, because the original upload is kept and offered for
// download), parsed by fast-xml-parser, and its shapes are drawn through their transforms.
// Units: the root width/height in absolute units, else CSS reference pixels, 96 px = 1 in
// (W3C CSS Values and Units Level 3, §5.2 absolute lengths).
import { XMLParser, XMLValidator } from 'fast-xml-parser';
import makerjs from 'makerjs';
import type { LayerName } from '../../shared/schemas/geometry';
import { MM_PER_INCH } from '../../shared/units';
import { FileRejected } from '../errors';
import { FALLBACK_LAYER, matchLayer } from '../layers';
import { type Affine, compose, IDENTITY, maxStretch, translation } from '../model/affine';
import { type CollectorLimits, DEFAULT_LIMITS, PathCollector } from '../model/collector';
import type { ImportResult, SourceUnits, UnitsFrom } from '../types';
import { type NormalizedPath, normalizePathData, PathDataError } from './pathData';
import { parseTransform, TransformError } from './transform';

export interface SvgImportOptions {
  /** Most elements read from one file (default 200 000). */
  maxElements?: number;
  limits?: Partial<CollectorLimits>;
}

export const DEFAULT_MAX_ELEMENTS = 200_000;
const MAX_DEPTH = 64;
const MAX_USE_NESTING = 8;
const PX_MM = MM_PER_INCH / 96;
/** Absolute CSS units in mm (CSS Values and Units Level 3, §5.2). */
const UNIT_MM: Record<string, number> = { '': PX_MM, px: PX_MM, mm: 1, cm: 10, in: MM_PER_INCH, pt: MM_PER_INCH / 72, pc: MM_PER_INCH / 6 };
/** makerjs reads path data y-down and returns it y-up (y negated); this undoes that so our matrix applies. */
const UNFLIP: Affine = [1, 0, 0, -1, 0, 0];

const FORBIDDEN_ELEMENTS = new Set(['script', 'foreignobject', 'iframe', 'embed', 'object', 'handler', 'listener', 'audio', 'video']);
const SHAPES = new Set(['path', 'rect', 'circle', 'ellipse', 'line', 'polyline', 'polygon']);
const CONTAINERS = new Set(['g', 'a']);
const NOT_DRAWN = new Set([
  'defs', 'symbol', 'clipPath', 'mask', 'marker', 'pattern', 'linearGradient', 'radialGradient', 'stop', 'filter',
  'metadata', 'title', 'desc', 'style', 'animate', 'animateTransform', 'animateMotion', 'set', 'view', 'cursor',
]);
const NOT_CUT = new Set(['text', 'image']);

type XNode = Record<string, unknown>;
type Attrs = Record<string, string>;

const tagOf = (node: XNode): string | undefined => Object.keys(node).find((k) => k !== ':@');
const childrenOf = (node: XNode, tag: string): XNode[] => (Array.isArray(node[tag]) ? (node[tag] as XNode[]) : []);
const attrsOf = (node: XNode): Attrs => (node[':@'] as Attrs | undefined) ?? {};
const localName = (name: string) => (name.includes(':') ? name.slice(name.indexOf(':') + 1) : name);
const isElement = (tag: string | undefined): tag is string => !!tag && !tag.startsWith('#') && !tag.startsWith('?');

const invalid = (why: string) => new FileRejected('invalid_svg', `The SVG file cannot be read: ${why}.`);
const unsafe = (what: string) =>
  new FileRejected('unsafe_svg', `The SVG file contains ${what}. Jigwright refuses SVG files with scripts, embedded documents or links to outside files, because the original file is kept for download. Remove it and upload the file again.`);

export function importSvg(source: string, opts: SvgImportOptions = {}): ImportResult {
  const text = source.charCodeAt(0) === 0xfeff ? source.slice(1) : source;
  if (/<!DOCTYPE/i.test(text) || /<!ENTITY/i.test(text)) {
    throw new FileRejected('unsafe_svg', 'The SVG file has a DOCTYPE or ENTITY declaration. Jigwright does not read DTDs (entities can expand without limit); save the SVG without a DOCTYPE.');
  }
  if (/<\?xml-stylesheet/i.test(text)) throw unsafe('a link to an outside style sheet (<?xml-stylesheet?>)');

  const valid = XMLValidator.validate(text, { allowBooleanAttributes: true });
  if (valid !== true) throw invalid(`it is not well-formed XML (line ${valid.err.line}, column ${valid.err.col}: ${valid.err.msg})`);
  let doc: XNode[];
  try {
    const parser = new XMLParser({
      preserveOrder: true,
      ignoreAttributes: false,
      attributeNamePrefix: '',
      allowBooleanAttributes: true,
      parseAttributeValue: false,
      parseTagValue: false,
      trimValues: false,
      ignoreDeclaration: true,
      ignorePiTags: true,
      processEntities: true,
      htmlEntities: false,
      cdataPropName: '#cdata',
    });
    doc = parser.parse(text) as XNode[];
  } catch (e) {
    throw invalid(`it is not well-formed XML (${e instanceof Error ? e.message.slice(0, 120) : String(e)})`);
  }
  const root = doc.find((n) => isElement(tagOf(n)));
  const rootTag = root && tagOf(root);
  if (!root || !rootTag || localName(rootTag) !== 'svg') throw invalid(`its root element is <${rootTag ?? 'nothing'}>, not <svg>`);

  const ids = inspect(root, rootTag, opts.maxElements ?? DEFAULT_MAX_ELEMENTS);
  const viewport = readViewport(attrsOf(root));
  const drawing = new SvgDrawing(ids, { ...DEFAULT_LIMITS, ...opts.limits });
  drawing.children(root, rootTag, IDENTITY, viewport.view, undefined, []);
  const model = drawing.finish();
  return { model, sourceUnits: viewport.units, unitsFrom: viewport.from, entityCounts: drawing.counts, warnings: drawing.warnings() };
}

/** Safety checks over every element and attribute, the element limit and nesting, and the id index for <use>. */
function inspect(root: XNode, rootTag: string, maxElements: number): Map<string, XNode> {
  const ids = new Map<string, XNode>();
  let count = 0;
  const visit = (node: XNode, tag: string, depth: number) => {
    if (depth > MAX_DEPTH) throw new FileRejected('unsupported_svg', `The SVG file nests elements more than ${MAX_DEPTH} levels deep.`);
    if (++count > maxElements) {
      throw new FileRejected('too_many_entities', `The SVG file has more than ${maxElements.toLocaleString('en-US')} elements, more than Jigwright reads in one file. Simplify it.`);
    }
    const name = localName(tag);
    if (FORBIDDEN_ELEMENTS.has(name.toLowerCase())) throw unsafe(`a <${name}> element`);
    const attrs = attrsOf(node);
    for (const [key, value] of Object.entries(attrs)) checkAttribute(name, key, String(value));
    if (attrs.id && !ids.has(attrs.id)) ids.set(attrs.id, node);
    for (const child of childrenOf(node, tag)) {
      const childTag = tagOf(child);
      if (name === 'style' && (childTag === '#text' || childTag === '#cdata')) checkCss(textOf(child));
      if (isElement(childTag)) visit(child, childTag, depth + 1);
    }
  };
  visit(root, rootTag, 0);
  return ids;
}

function textOf(node: XNode): string {
  const tag = tagOf(node);
  if (tag === '#text') return String(node['#text'] ?? '');
  if (tag) return childrenOf(node, tag).map(textOf).join('');
  return '';
}

function checkAttribute(element: string, key: string, value: string): void {
  const name = localName(key).toLowerCase();
  if (name.startsWith('on')) throw unsafe(`an event-handler attribute (${key} on <${element}>)`);
  // <set>/<animate attributeName="onclick" | "href"> adds a handler or a link at run time (OWASP XSS Filter Evasion Cheat Sheet).
  if (name === 'attributename' && /^\s*((\w+:)?on|(\w+:)?href\s*$)/i.test(value)) throw unsafe(`an animation that sets ${value.trim().slice(0, 30)} (on <${element}>)`);
  const compact = value.replace(/[\s\u0000-\u001f]/g, '').toLowerCase();
  if (compact.includes('javascript:') || compact.includes('vbscript:')) throw unsafe(`a script link (in ${key} on <${element}>)`);
  if ((name === 'href' || name === 'src') && !isLocalReference(value)) throw unsafe(`a link to an outside resource (${key}="${value.slice(0, 60)}" on <${element}>)`);
  if (compact.includes('url(')) checkCss(value);
}

/** Only same-document references (#id) and embedded raster images are allowed. */
function isLocalReference(value: string): boolean {
  const v = value.trim();
  return v.startsWith('#') || /^data:image\/(png|jpeg|jpg|gif|webp)[;,]/i.test(v);
}

function checkCss(css: string): void {
  if (/@import/i.test(css)) throw unsafe('a style sheet that imports another (@import)');
  const urls = css.matchAll(/url\(\s*(['"]?)([^'")]*)\1\s*\)/gi);
  for (const m of urls) if (!isLocalReference(m[2])) throw unsafe(`a link to an outside resource (url(${m[2].slice(0, 60)}))`);
}

interface Viewport {
  /** User units of the root → mm, y flipped up. */
  view: Affine;
  units: SourceUnits;
  from: UnitsFrom;
}

/** A root width/height in mm with its unit, or undefined when it is missing or relative (%, em, auto). */
function rootLength(value: string | undefined): { mm: number; unit: SourceUnits } | undefined {
  if (value === undefined) return undefined;
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(px|mm|cm|in|pt|pc)?\s*$/.exec(value);
  if (!m) return undefined;
  const unit = (m[2] ?? '') as keyof typeof UNIT_MM;
  const mm = Number(m[1]) * UNIT_MM[unit];
  if (!(mm > 0) || !Number.isFinite(mm)) throw invalid(`its width or height ("${value}") is not a positive size`);
  return { mm, unit: (unit || 'px') as SourceUnits };
}

function readViewport(attrs: Attrs): Viewport {
  const width = rootLength(attrs.width);
  const height = rootLength(attrs.height);
  if (attrs.viewBox === undefined) {
    // no viewBox: one user unit is one CSS pixel; flip about the viewport's height when known
    return { view: [PX_MM, 0, 0, -PX_MM, 0, height?.mm ?? 0], units: 'px', from: 'svg-px' };
  }
  const vb = attrs.viewBox.trim().split(/[\s,]+/).map(Number);
  if (vb.length !== 4 || !vb.every(Number.isFinite) || !(vb[2] > 0 && vb[3] > 0)) {
    throw invalid(`its viewBox ("${attrs.viewBox.slice(0, 60)}") is not four numbers with a positive width and height`);
  }
  const [vx, vy, vw, vh] = vb;
  if (!width && !height) {
    return { view: [PX_MM, 0, 0, -PX_MM, -vx * PX_MM, (vy + vh) * PX_MM], units: 'px', from: 'svg-px' };
  }
  const W = width?.mm ?? (height!.mm * vw) / vh;
  const H = height?.mm ?? (width!.mm * vh) / vw;
  let sx = W / vw;
  let sy = H / vh;
  let ox = 0;
  let oy = 0;
  // preserveAspectRatio (SVG 1.1 §7.8): default xMidYMid meet
  const par = (attrs.preserveAspectRatio ?? 'xMidYMid meet').trim().replace(/^defer\s+/, '').split(/\s+/);
  const align = par[0];
  if (align !== 'none') {
    const m = /^x(Min|Mid|Max)Y(Min|Mid|Max)$/.exec(align);
    if (!m) throw invalid(`its preserveAspectRatio ("${attrs.preserveAspectRatio}") is not valid`);
    const s = par[1] === 'slice' ? Math.max(sx, sy) : Math.min(sx, sy);
    const f = { Min: 0, Mid: 0.5, Max: 1 };
    ox = (W - vw * s) * f[m[1] as keyof typeof f];
    oy = (H - vh * s) * f[m[2] as keyof typeof f];
    sx = sy = s;
  }
  const unit = (width ?? height)!.unit;
  return { view: [sx, 0, 0, -sy, ox - vx * sx, H - oy + vy * sy], units: unit, from: unit === 'px' ? 'svg-px' : 'svg-size' };
}

/** An element, for messages: <path id="rim"> or <path> #3. */
class ElementRef {
  name = '';
  id: string | undefined;
  index = 0;
  toString(): string {
    return this.id ? `<${this.name} id="${this.id.slice(0, 40)}">` : `<${this.name}> #${this.index}`;
  }
}

class SvgDrawing {
  readonly counts: Record<string, number> = {};
  private readonly out: PathCollector;
  private readonly ref = new ElementRef();
  private shapes = 0;
  private hidden = 0;
  private emptyShapes = 0;
  private flattened = 0;
  private readonly notCut = new Map<string, number>();
  private readonly unknown = new Map<string, number>();

  constructor(
    private readonly ids: Map<string, XNode>,
    limits: CollectorLimits,
  ) {
    this.out = new PathCollector(limits);
    this.out.where = this.ref;
  }

  children(node: XNode, tag: string, ctm: Affine, view: Affine, layer: LayerName | undefined, uses: string[]): void {
    for (const child of childrenOf(node, tag)) {
      const childTag = tagOf(child);
      if (isElement(childTag)) this.element(child, childTag, ctm, view, layer, uses);
    }
  }

  private element(node: XNode, tag: string, ctm: Affine, view: Affine, inherited: LayerName | undefined, uses: string[]): void {
    if (tag.includes(':') && !tag.startsWith('svg:')) return; // another vocabulary (an editor's metadata): not drawing
    const name = localName(tag);
    const attrs = attrsOf(node);
    if (attrs.display?.trim() === 'none' || /(^|;)\s*display\s*:\s*none/i.test(attrs.style ?? '')) {
      this.hidden++;
      return;
    }
    const ref = this.ref;
    ref.name = name;
    ref.id = attrs.id;
    ref.index = (this.counts[name] ?? 0) + 1;
    let m = ctm;
    if (attrs.transform !== undefined) {
      try {
        m = compose(ctm, parseTransform(attrs.transform));
      } catch (e) {
        throw new FileRejected('unsupported_svg', `The transform on ${String(ref)} cannot be read: ${(e as TransformError).message}.`);
      }
    }
    const layer = layerOf(attrs) ?? inherited;
    if (name === 'switch') {
      // <switch> renders one alternative (SVG 1.1 §5.8); conditions are not evaluated, the first child is used
      const first = childrenOf(node, tag).find((c) => isElement(tagOf(c)));
      return first ? this.element(first, tagOf(first)!, m, view, layer, uses) : undefined;
    }
    if (CONTAINERS.has(name)) return this.children(node, tag, m, view, layer, uses);
    if (SHAPES.has(name)) {
      this.counts[name] = (this.counts[name] ?? 0) + 1;
      this.shapes++;
      return this.shape(name, attrs, compose(view, m), layer ?? FALLBACK_LAYER);
    }
    if (name === 'use') return this.use(attrs, m, view, layer, uses);
    if (name === 'svg') throw new FileRejected('unsupported_svg', 'The SVG file has an <svg> inside another <svg>. Flatten it (ungroup) and save again.');
    if (NOT_DRAWN.has(name)) return;
    if (NOT_CUT.has(name)) {
      this.counts[name] = (this.counts[name] ?? 0) + 1;
      this.notCut.set(name, (this.notCut.get(name) ?? 0) + 1);
      return;
    }
    this.unknown.set(name, (this.unknown.get(name) ?? 0) + 1);
  }

  /** <use href="#id" x y>: the referenced element, moved by (x, y) (SVG 1.1 §5.6). */
  private use(attrs: Attrs, m: Affine, view: Affine, layer: LayerName | undefined, uses: string[]): void {
    const href = Object.entries(attrs).find(([k]) => localName(k) === 'href')?.[1]?.trim();
    if (!href) return;
    const id = href.slice(1);
    const target = this.ids.get(id);
    if (!target) throw invalid(`a <use> element refers to "${href.slice(0, 60)}", which the file does not define`);
    if (uses.includes(id)) throw invalid(`"#${id.slice(0, 40)}" uses itself`);
    if (uses.length + 1 > MAX_USE_NESTING) {
      throw new FileRejected('nesting_too_deep', `The SVG file nests <use> references more than ${MAX_USE_NESTING} deep.`);
    }
    const placed = compose(m, translation(length(attrs.x, 'x'), length(attrs.y, 'y')));
    const tag = tagOf(target)!;
    if (localName(tag) === 'symbol') {
      if (attrsOf(target).viewBox !== undefined) throw new FileRejected('unsupported_svg', `The <symbol id="${id.slice(0, 40)}"> has its own viewBox, which Jigwright does not read. Ungroup it and save again.`);
      return this.children(target, tag, placed, view, layerOf(attrsOf(target)) ?? layer, [...uses, id]);
    }
    this.element(target, tag, placed, view, layer, [...uses, id]);
  }

  private shape(name: string, a: Attrs, m: Affine, layer: LayerName): void {
    const out = this.out;
    switch (name) {
      case 'line':
        return out.line(m, layer, length(a.x1, 'x1'), length(a.y1, 'y1'), length(a.x2, 'x2'), length(a.y2, 'y2'));
      case 'rect': {
        const x = length(a.x, 'x');
        const y = length(a.y, 'y');
        const w = length(a.width, 'width');
        const h = length(a.height, 'height');
        if (!(w > 0 && h > 0)) {
          this.emptyShapes++;
          return;
        }
        // rx/ry (SVG 1.1 §9.2): one given stands for both; each at most half the side
        let rx = a.rx !== undefined ? length(a.rx, 'rx') : undefined;
        let ry = a.ry !== undefined ? length(a.ry, 'ry') : undefined;
        rx = Math.min(Math.max(0, rx ?? ry ?? 0), w / 2);
        ry = Math.min(Math.max(0, ry ?? rx ?? 0), h / 2);
        if (rx === 0 || ry === 0) {
          out.line(m, layer, x, y, x + w, y);
          out.line(m, layer, x + w, y, x + w, y + h);
          out.line(m, layer, x + w, y + h, x, y + h);
          out.line(m, layer, x, y + h, x, y);
          return;
        }
        const d = `M ${x + rx} ${y} H ${x + w - rx} A ${rx} ${ry} 0 0 1 ${x + w} ${y + ry} V ${y + h - ry} A ${rx} ${ry} 0 0 1 ${x + w - rx} ${y + h} H ${x + rx} A ${rx} ${ry} 0 0 1 ${x} ${y + h - ry} V ${y + ry} A ${rx} ${ry} 0 0 1 ${x + rx} ${y} Z`;
        return this.pathData(d, m, layer);
      }
      case 'circle': {
        const r = length(a.r, 'r');
        if (!(r > 0)) {
          this.emptyShapes++;
          return;
        }
        return out.circle(m, layer, length(a.cx, 'cx'), length(a.cy, 'cy'), r);
      }
      case 'ellipse': {
        const cx = length(a.cx, 'cx');
        const cy = length(a.cy, 'cy');
        const rx = length(a.rx, 'rx');
        const ry = length(a.ry, 'ry');
        if (!(rx > 0 && ry > 0)) {
          this.emptyShapes++;
          return;
        }
        if (rx === ry) return out.circle(m, layer, cx, cy, rx);
        const f = (t: number): [number, number] => {
          const x = cx + rx * Math.cos(t);
          const y = cy + ry * Math.sin(t);
          return [m[0] * x + m[2] * y + m[4], m[1] * x + m[3] * y + m[5]];
        };
        return out.curve(layer, f, [0, 2 * Math.PI], true);
      }
      case 'polyline':
      case 'polygon': {
        const pts = (a.points ?? '').trim();
        const nums = pts === '' ? [] : pts.split(/[\s,]+/).map(Number);
        if (nums.length % 2 !== 0 || !nums.every(Number.isFinite)) throw invalid(`the points of ${String(this.ref)} are not pairs of numbers`);
        if (nums.length < 4) {
          this.emptyShapes++;
          return;
        }
        const flat: number[] = [];
        for (let i = 0; i < nums.length; i += 2) flat.push(m[0] * nums[i] + m[2] * nums[i + 1] + m[4], m[1] * nums[i] + m[3] * nums[i + 1] + m[5]);
        return out.polyline(layer, flat, name === 'polygon');
      }
      default: {
        const d = a.d ?? '';
        if (d.trim() === '') {
          this.emptyShapes++;
          return;
        }
        return this.pathData(d, m, layer);
      }
    }
  }

  private pathData(d: string, m: Affine, layer: LayerName): void {
    // curves are flattened in user units: the tolerance shrinks by how much the transform stretches
    const tolerance = this.out.limits.chordToleranceMm / (maxStretch(m) || 1);
    let normalized: NormalizedPath;
    try {
      normalized = normalizePathData(d, tolerance);
    } catch (e) {
      if (e instanceof PathDataError) throw invalid(`the path data of ${String(this.ref)} is not valid (${e.message})`);
      throw e;
    }
    this.flattened += normalized.flattened;
    const parsed = makerjs.importer.fromSVGPathData(normalized.d);
    const total = compose(m, UNFLIP);
    makerjs.model.walk(parsed, {
      onPath: (wp) => {
        const p = wp.pathContext;
        const placed = wp.offset[0] || wp.offset[1] ? compose(total, translation(wp.offset[0], wp.offset[1])) : total;
        if (p.type === makerjs.pathType.Line) {
          const l = p as makerjs.IPathLine;
          this.out.line(placed, layer, l.origin[0], l.origin[1], l.end[0], l.end[1]);
        } else if (p.type === makerjs.pathType.Arc) {
          const arc = p as makerjs.IPathArc;
          this.out.arc(placed, layer, arc.origin[0], arc.origin[1], arc.radius, arc.startAngle, arc.endAngle);
        } else if (p.type === makerjs.pathType.Circle) {
          const c = p as makerjs.IPathCircle;
          this.out.circle(placed, layer, c.origin[0], c.origin[1], c.radius);
        }
      },
    });
  }

  finish(): makerjs.IModel {
    if (this.out.count === 0) {
      if (this.shapes > 0) throw new FileRejected('zero_length', 'Every shape in the SVG file has zero length, so there is nothing to cut.');
      const found = [...this.notCut].map(([t, n]) => `<${t}> ×${n}`).join(', ');
      throw new FileRejected('no_geometry', `The SVG file has no paths or shapes to cut${found ? ` (it has only ${found})` : ''}.`);
    }
    return this.out.model();
  }

  warnings(): string[] {
    const w: string[] = [];
    const list = (m: Map<string, number>) => [...m].map(([t, n]) => `<${t}> ×${n}`).join(', ');
    if (this.notCut.size) w.push(`Text and images are not cut and were left out: ${list(this.notCut)}. Convert text to paths to cut it.`);
    if (this.unknown.size) w.push(`Elements Jigwright does not read were left out: ${list(this.unknown)}.`);
    if (this.hidden) w.push(`${this.hidden} hidden element${this.hidden === 1 ? ' was' : 's were'} left out (display: none).`);
    if (this.emptyShapes) w.push(`${this.emptyShapes} empty shape${this.emptyShapes === 1 ? ' was' : 's were'} left out (zero size or no points).`);
    if (this.out.zeroLength) w.push(`${this.out.zeroLength} zero-length path${this.out.zeroLength === 1 ? ' was' : 's were'} dropped.`);
    const curves = this.out.approximated + this.flattened;
    if (curves) w.push(`${curves} curve${curves === 1 ? ' was' : 's were'} replaced by straight segments within ${this.out.limits.chordToleranceMm} mm.`);
    return w;
  }
}

/** data-layer, a "layer-<name>" class (what shared/geometry/svg.ts writes) or an id naming one of our layers. */
function layerOf(attrs: Attrs): LayerName | undefined {
  const fromData = matchLayer(attrs['data-layer']);
  if (fromData) return fromData;
  for (const cls of (attrs.class ?? '').split(/\s+/)) {
    if (cls.startsWith('layer-')) {
      const l = matchLayer(cls.slice(6));
      if (l) return l;
    }
  }
  return matchLayer(attrs.id);
}

/** A coordinate or length attribute in user units (absolute units at 96 px per inch); missing is 0. */
function length(value: string | undefined, what: string): number {
  if (value === undefined) return 0;
  const m = /^\s*([+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?)\s*(px|mm|cm|in|pt|pc)?\s*$/.exec(value);
  if (!m) {
    if (/%\s*$/.test(value)) throw new FileRejected('unsupported_svg', `The SVG file gives ${what} as a percentage ("${value.slice(0, 30)}"); Jigwright needs numbers or absolute units.`);
    throw invalid(`${what}="${value.slice(0, 30)}" is not a length`);
  }
  return (Number(m[1]) * UNIT_MM[m[2] ?? '']) / PX_MM;
}
