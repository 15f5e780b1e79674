// Charger insert: a plate that drops into an opening routed in a table top, with a pocket on top
// for a phone, a recess underneath for a wireless charger pad and a cord channel to one edge.
// Origin at the plate's bottom-left corner, width along x, length along y, millimetres.
//
// Sources for the numbers used here (see /work/shared/REFERENCES.md):
// - Skin over the pad: the charger maker's stated range wins; without one, warn above about 3 mm
//   (Qi coil-to-receiver distance: secondary sources ~5 mm max, 3–4 mm typical; through-wood
//   tests reliable at ~3 mm — common practice).
// - A router bit cannot cut an inside corner tighter than its radius (common practice); dogbone
//   and T-bone reliefs per shared/geometry/relief.ts.
// - Wood movement across the grain: Wood Handbook FPL-GTR-190 Eq. 13-2, Table 13-5.
// - Walls under 6 mm between a pocket and the plate edge are fragile (common practice).
import makerjs from 'makerjs';
import { bool, num, str, type ParamDecl, type ParamValues } from '../params';
import { circlesModel, dogboneCentreOffset, dogboneOvercut, reliefCircles, type Circle, type CornerStyle } from '../geometry/relief';
import { mirrorForUnderside } from '../geometry/paths';
import { summarizeModel } from '../geometry/summary';
import { isOutsideLinearRange, movementCoefficient, type Cut } from '../wood/movement';
import { SPECIES_CHOICES } from '../wood/species';
import { len, lengthText } from '../units';
import { onLayer, rect, roundRect, rv, warn } from './report';
import type { FieldMessage, GeneratorDef, ReportValue, Warning } from './types';

export const MIN_WALL = 6; // mm, common practice
export const DEFAULT_MAX_SKIN = 3; // mm, without a stated range (REFERENCES.md, CP)
export const MIN_FLOOR = 1; // mm of wood left between the cord channel and the pocket floor
export const MARK_LENGTH = 3; // mm, alignment ticks on the long axis

const G_PLATE = 'Opening and plate';
const G_STOCK = 'Stock';
const G_DEVICE = 'Device pocket';
const G_PAD = 'Charger pad';
const G_CHANNEL = 'Cord channel';
const G_TOOL = 'Tooling';

export const CHARGER_INSERT_PARAMS: ParamDecl[] = [
  { type: 'number', name: 'openingWidth', label: 'Opening width', unit: 'mm', min: 40, max: 800, default: 120, step: 0.5, group: G_PLATE, help: 'Width (x) of the opening routed in the table top.' },
  { type: 'number', name: 'openingLength', label: 'Opening length', unit: 'mm', min: 40, max: 800, default: 200, step: 0.5, group: G_PLATE, help: 'Length (y) of the opening routed in the table top.' },
  { type: 'number', name: 'openingCornerRadius', label: 'Opening corner radius', unit: 'mm', min: 0, max: 100, default: 6.35, step: 0.05, group: G_PLATE, help: 'Corner radius of the opening; the plate corners follow it, less the clearance. No tighter than the bit that routes the opening.' },
  { type: 'number', name: 'fitClearance', label: 'Fit clearance per side', unit: 'mm', min: 0, max: 3, default: 0.4, step: 0.05, group: G_PLATE, help: 'Gap between the plate and the opening on each side.' },
  { type: 'number', name: 'plateThickness', label: 'Plate thickness', unit: 'mm', min: 6, max: 50, default: 18, step: 0.1, group: G_PLATE, help: 'Thickness of the insert plate.' },
  { type: 'choice', name: 'stock', label: 'Stock', choices: [{ value: 'plywood', label: 'Plywood' }, ...SPECIES_CHOICES], default: 'plywood', group: G_STOCK, help: 'Plywood barely moves; solid wood moves across the grain with the seasons (Wood Handbook Table 13-5).' },
  { type: 'choice', name: 'cut', label: 'Cut', choices: [{ value: 'flatsawn', label: 'Flatsawn' }, { value: 'quartersawn', label: 'Quartersawn' }], default: 'flatsawn', group: G_STOCK, help: 'Solid wood only: flatsawn moves about twice as much as quartersawn.' },
  { type: 'choice', name: 'grain', label: 'Grain runs along', choices: [{ value: 'length', label: 'The length (y)' }, { value: 'width', label: 'The width (x)' }], default: 'length', group: G_STOCK, help: 'Solid wood moves across the grain: along the other dimension.' },
  { type: 'number', name: 'mcMin', label: 'Lowest expected moisture content', unit: 'percent', min: 0, max: 30, default: 6, step: 0.5, group: G_STOCK, help: 'Driest the plate will get in service.' },
  { type: 'number', name: 'mcMax', label: 'Highest expected moisture content', unit: 'percent', min: 0, max: 30, default: 11, step: 0.5, group: G_STOCK, help: 'Dampest the plate will get in service.' },
  { type: 'number', name: 'deviceWidth', label: 'Device width', unit: 'mm', min: 20, max: 300, default: 76, step: 0.1, group: G_DEVICE, help: 'Width of the phone or device, without its case.' },
  { type: 'number', name: 'deviceLength', label: 'Device length', unit: 'mm', min: 40, max: 400, default: 160, step: 0.1, group: G_DEVICE, help: 'Length of the device, without its case.' },
  { type: 'number', name: 'deviceThickness', label: 'Device thickness', unit: 'mm', min: 3, max: 30, default: 8.3, step: 0.1, group: G_DEVICE, help: 'Thickness of the device, without its case.' },
  { type: 'number', name: 'caseAllowance', label: 'Case allowance per side', unit: 'mm', min: 0, max: 10, default: 1.5, step: 0.1, group: G_DEVICE, help: 'What a case adds on each side (and behind the device).' },
  { type: 'number', name: 'pocketClearance', label: 'Pocket clearance per side', unit: 'mm', min: 0, max: 5, default: 1, step: 0.1, group: G_DEVICE, help: 'Room around the cased device in the pocket.' },
  { type: 'number', name: 'pocketDepth', label: 'Pocket depth', unit: 'mm', min: 0.5, max: 30, default: 3, step: 0.1, group: G_DEVICE, help: 'Depth of the top pocket the device lies in.' },
  { type: 'number', name: 'pocketCornerRadius', label: 'Pocket corner radius', unit: 'mm', min: 0, max: 50, default: 6.35, step: 0.05, group: G_DEVICE, help: 'Inside corner radius of the pocket (corner style "radius"). No tighter than the bit radius.' },
  { type: 'boolean', name: 'fingerNotch', label: 'Finger notch', default: true, group: G_DEVICE, help: 'A round notch at the middle of the right-hand long side, to lift the device out.' },
  { type: 'number', name: 'notchDiameter', label: 'Finger notch diameter', unit: 'mm', min: 10, max: 60, default: 25, step: 0.5, group: G_DEVICE, help: 'Diameter of the finger notch; its centre sits on the pocket edge.' },
  { type: 'choice', name: 'padShape', label: 'Pad shape', choices: [{ value: 'round', label: 'Round' }, { value: 'rect', label: 'Rectangular' }], default: 'round', group: G_PAD, help: 'Shape of the wireless charger pad.' },
  { type: 'number', name: 'padDiameter', label: 'Pad diameter', unit: 'mm', min: 20, max: 200, default: 70, step: 0.1, group: G_PAD, help: 'Round pads: diameter.' },
  { type: 'number', name: 'padWidth', label: 'Pad width', unit: 'mm', min: 20, max: 200, default: 70, step: 0.1, group: G_PAD, help: 'Rectangular pads: width (x).' },
  { type: 'number', name: 'padLength', label: 'Pad length', unit: 'mm', min: 20, max: 300, default: 100, step: 0.1, group: G_PAD, help: 'Rectangular pads: length (y).' },
  { type: 'number', name: 'padClearance', label: 'Pad clearance per side', unit: 'mm', min: 0, max: 5, default: 0.5, step: 0.1, group: G_PAD, help: 'Room around the pad in its recess.' },
  { type: 'number', name: 'padThickness', label: 'Pad thickness', unit: 'mm', min: 2, max: 40, default: 10, step: 0.1, group: G_PAD, help: 'Thickness of the pad; the recess should be at least this deep.' },
  { type: 'number', name: 'skinThickness', label: 'Skin over the pad', unit: 'mm', min: 0.5, max: 30, default: 2, step: 0.1, group: G_PAD, help: 'Wood left between the pad and the device: the recess depth is plate thickness − pocket depth − skin.' },
  { type: 'boolean', name: 'ratedRange', label: 'Maker states a charging range', default: false, group: G_PAD, help: 'Use the charger maker’s stated range; without one Jigwright warns above 3 mm of skin.' },
  { type: 'number', name: 'ratedMin', label: 'Rated range: minimum', unit: 'mm', min: 0, max: 40, default: 0, step: 0.5, group: G_PAD, help: 'Least surface thickness the charger is rated for.' },
  { type: 'number', name: 'ratedMax', label: 'Rated range: maximum', unit: 'mm', min: 0.5, max: 40, default: 5, step: 0.5, group: G_PAD, help: 'Greatest surface thickness the charger is rated for.' },
  { type: 'choice', name: 'channelEdge', label: 'Cord exits at', choices: [{ value: 'right', label: 'Right edge' }, { value: 'left', label: 'Left edge' }, { value: 'top', label: 'Top edge' }, { value: 'bottom', label: 'Bottom edge' }], default: 'right', group: G_CHANNEL, help: 'Edge the cord channel runs to, as seen from the top.' },
  { type: 'number', name: 'plugWidth', label: 'Plug width', unit: 'mm', min: 3, max: 40, default: 12, step: 0.1, group: G_CHANNEL, help: 'Widest part of the cord or plug that must pass along the channel.' },
  { type: 'number', name: 'channelClearance', label: 'Channel clearance per side', unit: 'mm', min: 0, max: 5, default: 0.5, step: 0.1, group: G_CHANNEL, help: 'Room each side of the plug.' },
  { type: 'number', name: 'channelDepth', label: 'Channel depth', unit: 'mm', min: 1, max: 40, default: 6, step: 0.1, group: G_CHANNEL, help: 'Depth of the cord channel from the underside.' },
  { type: 'number', name: 'bitDiameter', label: 'Bit diameter', unit: 'mm', min: 1, max: 25.4, default: 6.35, step: 0.005, group: G_TOOL, help: 'Diameter of the router bit for the pocket and recess (1/4 in = 6.35 mm).' },
  { type: 'choice', name: 'cornerStyle', label: 'Inside corners', choices: [{ value: 'radius', label: 'Radiused' }, { value: 'dogbone', label: 'Square, dogbone reliefs' }, { value: 'tbone', label: 'Square, T-bone reliefs' }], default: 'radius', group: G_TOOL, help: 'Radiused corners follow the pocket corner radius; square corners get relief circles the size of the bit.' },
];

const DEVICE_FIELDS = ['deviceWidth', 'deviceLength', 'caseAllowance', 'pocketClearance'];

/** Plate-boundary distance for a point inside a rounded rectangle [0,W]×[0,L] with corner radius R. */
export function distanceToPlateEdge(p: [number, number], W: number, L: number, R: number): number {
  const qx = Math.min(p[0], W - p[0]);
  const qy = Math.min(p[1], L - p[1]);
  if (qx < R && qy < R) return R - Math.hypot(R - qx, R - qy);
  return Math.min(qx, qy);
}

/** Every derived dimension, computed once; check() and generate() share it. */
export function chargerLayout(p: ParamValues) {
  const c = num(p, 'fitClearance');
  const W = num(p, 'openingWidth') - 2 * c;
  const L = num(p, 'openingLength') - 2 * c;
  const plateR = Math.max(num(p, 'openingCornerRadius') - c, 0);
  const T = num(p, 'plateThickness');
  const bitR = num(p, 'bitDiameter') / 2;
  const style = str(p, 'cornerStyle') as CornerStyle;

  const pw = num(p, 'deviceWidth') + 2 * (num(p, 'caseAllowance') + num(p, 'pocketClearance'));
  const pl = num(p, 'deviceLength') + 2 * (num(p, 'caseAllowance') + num(p, 'pocketClearance'));
  const px = (W - pw) / 2;
  const py = (L - pl) / 2;
  const P = num(p, 'pocketDepth');
  const pocketR = style === 'radius' ? Math.min(num(p, 'pocketCornerRadius'), pw / 2, pl / 2) : 0;
  const pocketReliefs: Circle[] = style === 'radius' ? [] : reliefCircles(px, py, pw, pl, bitR, style, 'ends');
  const notch: Circle | null = bool(p, 'fingerNotch') ? { c: [px + pw, py + pl / 2], r: num(p, 'notchDiameter') / 2 } : null;

  const round = str(p, 'padShape') === 'round';
  const pc = num(p, 'padClearance');
  const rw = round ? num(p, 'padDiameter') + 2 * pc : num(p, 'padWidth') + 2 * pc;
  const rl = round ? rw : num(p, 'padLength') + 2 * pc;
  const rx = (W - rw) / 2;
  const ry = (L - rl) / 2;
  const recessR = round ? rw / 2 : style === 'radius' ? Math.min(bitR, rw / 2, rl / 2) : 0;
  const recessReliefs: Circle[] = round || style === 'radius' ? [] : reliefCircles(rx, ry, rw, rl, bitR, style, 'ends');
  const skin = num(p, 'skinThickness');
  const R = T - P - skin; // recess depth
  const ratedRange = bool(p, 'ratedRange');
  const skinMax = ratedRange ? num(p, 'ratedMax') : DEFAULT_MAX_SKIN;
  const skinMin = ratedRange ? num(p, 'ratedMin') : 0;

  const edge = str(p, 'channelEdge') as 'left' | 'right' | 'top' | 'bottom';
  const cw = num(p, 'plugWidth') + 2 * num(p, 'channelClearance');
  const cd = num(p, 'channelDepth');
  const channel =
    edge === 'right' ? { x: W / 2, y: L / 2 - cw / 2, w: W / 2, h: cw }
    : edge === 'left' ? { x: 0, y: L / 2 - cw / 2, w: W / 2, h: cw }
    : edge === 'top' ? { x: W / 2 - cw / 2, y: L / 2, w: cw, h: L / 2 }
    : { x: W / 2 - cw / 2, y: 0, w: cw, h: L / 2 };
  const channelLengthBeyondRecess = edge === 'left' || edge === 'right' ? W / 2 - rw / 2 : L / 2 - rl / 2;
  // The channel starts at the pocket centre, so it always runs under the pocket floor.
  const floorOverChannel = T - P - cd;

  // Walls: the least distance from each feature to the plate edge. Distance to the edge of a
  // convex plate is concave inside it, so over a rounded rectangle it is least at a corner centre.
  const edgeDist = (q: [number, number]) => distanceToPlateEdge(q, W, L, plateR);
  const rrWall = (x: number, y: number, w: number, h: number, r: number) =>
    Math.min(edgeDist([x + r, y + r]), edgeDist([x + w - r, y + r]), edgeDist([x + w - r, y + h - r]), edgeDist([x + r, y + h - r])) - r;
  const circleWall = (k: Circle) => edgeDist(k.c) - k.r;
  const pocketRectWall = rrWall(px, py, pw, pl, pocketR);
  const notchWall = notch ? circleWall(notch) : Infinity;
  const pocketWall = Math.min(pocketRectWall, ...pocketReliefs.map(circleWall), notchWall);
  const recessWall = Math.min(round ? circleWall({ c: [W / 2, L / 2], r: rw / 2 }) : rrWall(rx, ry, rw, rl, recessR), ...recessReliefs.map(circleWall));

  const stock = str(p, 'stock');
  const grainAlongLength = str(p, 'grain') === 'length';
  const across = grainAlongLength ? W : L;
  const cut: Cut = stock === 'plywood' ? 'plywood' : (str(p, 'cut') as Cut);
  const coefficient = movementCoefficient(stock, cut);
  const movement = across * coefficient * (num(p, 'mcMax') - num(p, 'mcMin'));

  return {
    W, L, plateR, T, c, bitR, style,
    pw, pl, px, py, P, pocketR, pocketReliefs, notch,
    round, rw, rl, rx, ry, recessR, recessReliefs, R, skin, skinMin, skinMax, ratedRange,
    edge, cw, cd, channel, channelLengthBeyondRecess, floorOverChannel,
    pocketRectWall, notchWall, pocketWall, recessWall, sideWall: (W - pw) / 2, endWall: (L - pl) / 2,
    stock, cut, across, coefficient, movement, movementPerSide: Math.abs(movement) / 2,
  };
}
export type ChargerLayout = ReturnType<typeof chargerLayout>;

function check(p: ParamValues): FieldMessage[] {
  const k = chargerLayout(p);
  const out: FieldMessage[] = [];
  const r2 = (x: number) => len(+x.toFixed(2));
  if (num(p, 'openingCornerRadius') > Math.min(num(p, 'openingWidth'), num(p, 'openingLength')) / 2) {
    out.push({ field: 'openingCornerRadius', message: 'Opening corner radius must be at most half the opening width and length' });
  }
  if (k.pocketWall <= 0) {
    const text = lengthText`The device pocket (${r2(k.pw)} × ${r2(k.pl)} with case and clearance) does not fit inside the ${r2(k.W)} × ${r2(k.L)} plate`;
    if (k.pw >= k.W) out.push({ field: 'deviceWidth', ...text });
    if (k.pl >= k.L) out.push({ field: 'deviceLength', ...text });
    if (k.pw < k.W && k.pl < k.L) {
      if (k.notchWall <= 0) out.push({ field: 'notchDiameter', ...lengthText`The finger notch would cut through the plate edge: the side wall is only ${r2(k.sideWall)}` });
      else out.push({ field: 'deviceWidth', ...text });
    }
  }
  if (k.recessWall <= 0) {
    out.push({ field: k.round ? 'padDiameter' : k.rw >= k.W ? 'padWidth' : 'padLength', ...lengthText`The pad recess (${r2(k.rw)} × ${r2(k.rl)}) does not fit inside the ${r2(k.W)} × ${r2(k.L)} plate` });
  }
  if (k.P >= k.T) out.push({ field: 'pocketDepth', message: 'Pocket depth must be less than the plate thickness' });
  else if (k.R <= 0) out.push({ field: 'skinThickness', ...lengthText`Pocket depth + skin (${r2(k.P + k.skin)}) leaves no room for a recess in a ${r2(k.T)} plate` });
  if (k.cd >= k.T) out.push({ field: 'channelDepth', message: 'Channel depth must be less than the plate thickness' });
  if (k.cw >= Math.min(k.rw, k.rl)) out.push({ field: 'plugWidth', message: 'The cord channel must be narrower than the pad recess' });
  if (num(p, 'mcMin') > num(p, 'mcMax')) out.push({ field: 'mcMax', message: 'Highest moisture content must be at least the lowest' });
  if (k.ratedRange && num(p, 'ratedMin') > num(p, 'ratedMax')) out.push({ field: 'ratedMax', message: 'Rated maximum must be at least the rated minimum' });
  return out;
}

/** The warnings for a layout, each exactly when its condition holds (tests rely on that). */
export function chargerWarnings(p: ParamValues, k: ChargerLayout): Warning[] {
  const w: Warning[] = [];
  if (k.skin > k.skinMax + 1e-9) {
    w.push(warn('skin_too_thick', 'caution', k.ratedRange
      ? lengthText`The ${len(k.skin)} skin is thicker than the charger’s rated ${len(k.skinMax)}: it may not charge.`
      : lengthText`The ${len(k.skin)} skin is over ${len(DEFAULT_MAX_SKIN)}: without a range from the charger maker, charging through more than about ${len(DEFAULT_MAX_SKIN)} of wood is unreliable.`,
      k.ratedRange ? ['skinThickness', 'ratedMax'] : ['skinThickness', 'ratedRange']));
  }
  if (k.ratedRange && k.skin < k.skinMin - 1e-9) {
    w.push(warn('skin_too_thin', 'caution', lengthText`The ${len(k.skin)} skin is thinner than the charger’s rated minimum of ${len(k.skinMin)}.`, ['skinThickness', 'ratedMin']));
  }
  if (k.style === 'radius' && num(p, 'pocketCornerRadius') < k.bitR - 1e-9) {
    w.push(warn('pocket_corner_below_bit', 'caution', lengthText`A ${len(2 * k.bitR)} bit cannot cut a ${len(num(p, 'pocketCornerRadius'))} corner radius: use at least ${len(k.bitR)}, a smaller bit, or square corners with reliefs.`, ['pocketCornerRadius', 'bitDiameter', 'cornerStyle']));
  }
  if (num(p, 'openingCornerRadius') < k.bitR - 1e-9) {
    w.push(warn('opening_corner_below_bit', 'caution', lengthText`The opening’s ${len(num(p, 'openingCornerRadius'))} corner radius is tighter than a ${len(2 * k.bitR)} bit can rout.`, ['openingCornerRadius', 'bitDiameter']));
  }
  const minWall = Math.min(k.pocketWall, k.recessWall);
  if (minWall < MIN_WALL - 1e-9) {
    const fields = k.pocketWall <= k.recessWall ? ['openingWidth', 'openingLength', ...DEVICE_FIELDS, ...(k.notch ? ['notchDiameter'] : [])] : ['openingWidth', 'openingLength', k.round ? 'padDiameter' : 'padWidth', ...(k.round ? [] : ['padLength']), 'padClearance'];
    w.push(warn('thin_wall', 'caution', lengthText`The wall between the ${k.pocketWall <= k.recessWall ? 'pocket' : 'recess'} and the plate edge is only ${len(minWall)}; keep at least ${len(MIN_WALL)}.`, fields));
  }
  if (k.floorOverChannel < MIN_FLOOR - 1e-9) {
    w.push(warn('channel_into_pocket', 'danger', k.floorOverChannel <= 0
      ? lengthText`The ${len(k.cd)} channel cuts into the ${len(k.P)} pocket in a ${len(k.T)} plate.`
      : lengthText`Only ${len(k.floorOverChannel)} of wood would remain between the channel and the pocket floor.`,
      ['channelDepth', 'pocketDepth', 'plateThickness']));
  }
  if (k.R < num(p, 'padThickness') - 1e-9) {
    w.push(warn('pad_proud', 'caution', lengthText`The ${len(k.R)} recess is shallower than the ${len(num(p, 'padThickness'))} pad: it will stand ${len(num(p, 'padThickness') - k.R)} proud of the underside.`, ['padThickness', 'skinThickness', 'pocketDepth', 'plateThickness']));
  }
  if (k.P > num(p, 'deviceThickness') + num(p, 'caseAllowance') + 1e-9 && !k.notch) {
    w.push(warn('device_below_surface', 'info', lengthText`The device (${len(num(p, 'deviceThickness') + num(p, 'caseAllowance'))} with its case) sits below the surface of the ${len(k.P)} pocket: add a finger notch to lift it out.`, ['pocketDepth', 'fingerNotch']));
  }
  if (k.movementPerSide > k.c + 1e-9) {
    w.push(warn('movement_exceeds_clearance', 'caution', lengthText`${k.cut === 'plywood' ? 'The plywood' : 'The solid stock'} can grow ${len(k.movementPerSide)} per side across the grain, more than the ${len(k.c)} clearance: it may bind in the opening.`, ['fitClearance', 'stock', 'cut', 'mcMin', 'mcMax']));
  }
  if (k.cut !== 'plywood' && (isOutsideLinearRange(num(p, 'mcMin')) || isOutsideLinearRange(num(p, 'mcMax')))) {
    w.push(warn('mc_outside_linear_range', 'info', 'The Wood Handbook’s movement estimate is linear only between 6 % and 14 % moisture content; outside it, treat the figure as rough.', ['mcMin', 'mcMax']));
  }
  return w;
}

function report(p: ParamValues, k: ChargerLayout): ReportValue[] {
  const v: ReportValue[] = [
    rv('plateWidth', 'Plate width', k.W, 'mm'),
    rv('plateLength', 'Plate length', k.L, 'mm'),
    rv('plateCornerRadius', 'Plate corner radius', k.plateR, 'mm'),
    rv('plateThickness', 'Plate thickness', k.T, 'mm'),
    rv('pocketWidth', 'Pocket width', k.pw, 'mm'),
    rv('pocketLength', 'Pocket length', k.pl, 'mm'),
    rv('pocketDepth', 'Pocket depth', k.P, 'mm'),
    rv('recessWidth', k.round ? 'Recess diameter' : 'Recess width', k.rw, 'mm'),
    rv('recessLength', k.round ? 'Recess diameter' : 'Recess length', k.rl, 'mm'),
    rv('recessDepth', 'Recess depth (from the underside)', k.R, 'mm'),
    rv('skin', 'Skin between pad and device (plate − pocket − recess)', k.T - k.P - k.R, 'mm'),
    rv('chargingGap', 'Wood skin + case back (what the charger must reach through)', k.T - k.P - k.R + num(p, 'caseAllowance'), 'mm'),
    rv('deviceProud', 'Device stands above the surface by', num(p, 'deviceThickness') + num(p, 'caseAllowance') - k.P, 'mm'),
    rv('skinLimit', k.ratedRange ? 'Charger’s rated maximum' : 'Skin guideline without a rated range', k.skinMax, 'mm'),
    rv('channelWidth', 'Channel width', k.cw, 'mm'),
    rv('channelDepth', 'Channel depth', k.cd, 'mm'),
    rv('channelLength', 'Channel length beyond the recess', Math.max(k.channelLengthBeyondRecess, 0), 'mm'),
    rv('floorOverChannel', 'Wood between channel and pocket floor', k.floorOverChannel, 'mm'),
    rv('sideWall', 'Side wall (pocket to plate edge, x)', k.sideWall, 'mm'),
    rv('endWall', 'End wall (pocket to plate edge, y)', k.endWall, 'mm'),
    rv('wallThickness', 'Thinnest wall (pocket, notch, reliefs, recess)', Math.min(k.pocketWall, k.recessWall), 'mm'),
    rv('movementAcross', `Seasonal movement across the grain (${k.stock === 'plywood' ? 'plywood' : k.cut}, ${num(p, 'mcMin')} → ${num(p, 'mcMax')} % MC)`, k.movement, 'mm'),
    rv('movementPerSide', 'Movement allowance per side', k.movementPerSide, 'mm'),
    rv('fitClearance', 'Fit clearance per side', k.c, 'mm'),
    rv('bitRadius', 'Bit radius', k.bitR, 'mm'),
  ];
  if (k.style === 'dogbone') {
    v.push(rv('reliefOffset', 'Dogbone centre from each wall', dogboneCentreOffset(k.bitR), 'mm', 4));
    v.push(rv('reliefOvercut', 'Dogbone overcut into each wall', dogboneOvercut(k.bitR), 'mm', 4));
  } else if (k.style === 'tbone') {
    v.push(rv('reliefOffset', 'T-bone centre from the corner, along the end wall', k.bitR, 'mm', 4));
    v.push(rv('reliefOvercut', 'T-bone overcut into the end walls', k.bitR, 'mm', 4));
  }
  return v;
}

function buildUnderside(k: ChargerLayout): makerjs.IModel {
  const models: makerjs.IModelMap = {
    recess: onLayer('recess', k.round ? { paths: { pad: new makerjs.paths.Circle([k.W / 2, k.L / 2], k.rw / 2) } } : roundRect(k.rx, k.ry, k.rw, k.rl, k.recessR)),
    channel: onLayer('channel', rect(k.channel.x, k.channel.y, k.channel.w, k.channel.h)),
  };
  if (k.recessReliefs.length) models.recessRelief = onLayer('relief', circlesModel(k.recessReliefs));
  return { models };
}

function buildMarks(k: ChargerLayout): makerjs.IModel {
  // Ticks on the long centre line at both ends: they stay put when the plate is turned over
  // about that axis, so the underside job registers on them.
  const t = Math.min(MARK_LENGTH, Math.max(k.L, k.W) / 4);
  const paths: makerjs.IPathMap =
    k.L >= k.W
      ? { near: new makerjs.paths.Line([k.W / 2, 0], [k.W / 2, t]), far: new makerjs.paths.Line([k.W / 2, k.L], [k.W / 2, k.L - t]) }
      : { near: new makerjs.paths.Line([0, k.L / 2], [t, k.L / 2]), far: new makerjs.paths.Line([k.W, k.L / 2], [k.W - t, k.L / 2]) };
  return onLayer('marks', { paths });
}

function generate(p: ParamValues) {
  const k = chargerLayout(p);
  const outline = onLayer('outline', roundRect(0, 0, k.W, k.L, k.plateR));
  const marks = buildMarks(k);
  const under = buildUnderside(k);
  const models: makerjs.IModelMap = {
    outline,
    pocket: onLayer('pocket', roundRect(k.px, k.py, k.pw, k.pl, k.pocketR)),
  };
  if (k.pocketReliefs.length) models.pocketRelief = onLayer('relief', circlesModel(k.pocketReliefs));
  if (k.notch) models.notch = onLayer('pocket', { paths: { notch: new makerjs.paths.Circle(k.notch.c, k.notch.r) } });
  models.underside = under;
  models.marks = marks;
  const model: makerjs.IModel = { models, units: makerjs.unitType.Millimeter };

  const underside = mirrorForUnderside({ models: { outline, under, marks } }, { width: k.W, length: k.L });

  const summary = summarizeModel(model, {
    plate: { width: k.W, height: k.L, depth: k.T },
    pocket: { width: k.pw, height: k.pl, depth: k.P },
    recess: { width: k.rw, height: k.rl, depth: k.R },
    channel: { width: k.channel.w, height: k.channel.h, depth: k.cd },
  });
  return { model, underside, summary, report: { values: report(p, k), warnings: chargerWarnings(p, k) } };
}

export const chargerInsert: GeneratorDef = {
  id: 'charger-insert',
  title: 'Charger insert plate',
  kind: 'insert',
  description:
    'A plate that drops into an opening in a table top: a pocket on top for a phone, a recess underneath for a wireless charger pad, and a cord channel to one edge. Underside work is also given mirrored, for cutting after turning the plate over about its long axis on the alignment marks.',
  params: CHARGER_INSERT_PARAMS,
  deviceParams: ['deviceWidth', 'deviceLength', 'deviceThickness', 'caseAllowance'],
  suggestedClearanceParam: 'pocketClearance',
  check,
  generate,
};
