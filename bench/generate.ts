// Row 1: the charger insert generated and exported as DXF, in this process.
// Measured: runGenerator('charger-insert', params) (validation, checks, layout, fit report, summary,
// underside) + modelToDxf(model, 'mm'). Baseline: the same outline drawn straight with makerjs —
// plate rounded rectangle, device pocket, pad recess and cord channel — and makerjs's own toDXF,
// with no validation, checks, summary or header of ours.
import makerjs from 'makerjs';
import { modelToDxf } from '../files/dxf/export';
import { runGenerator } from '../shared/generators';
import { percentile, ms, ratio } from './lib/stats';
import { judge, type Row } from './lib/report';

export const RUNS = 300;
const WARMUP = 200;

/** An invented phone and pad in an invented opening (mm). */
export const BENCH_PARAMS = {
  openingWidth: 124,
  openingLength: 204,
  openingCornerRadius: 6.35,
  fitClearance: 0.4,
  plateThickness: 18,
  deviceWidth: 74.2,
  deviceLength: 152.6,
  deviceThickness: 8.1,
  caseAllowance: 1.4,
  pocketClearance: 1,
  pocketDepth: 3,
  pocketCornerRadius: 6.35,
  padShape: 'round',
  padDiameter: 68,
  padClearance: 0.5,
  skinThickness: 2,
  channelEdge: 'right',
  plugWidth: 12,
  channelClearance: 0.5,
  channelDepth: 6,
  bitDiameter: 6.35,
};

function measured(): string {
  const run = runGenerator('charger-insert', BENCH_PARAMS);
  if (!run.ok) throw new Error(`the bench parameters were refused: ${run.message}`);
  return modelToDxf(run.result.model, 'mm');
}

// The baseline's dimensions, worked out once from the same inputs (outside the timed part).
const p = BENCH_PARAMS;
const W = p.openingWidth - 2 * p.fitClearance;
const L = p.openingLength - 2 * p.fitClearance;
const plateR = p.openingCornerRadius - p.fitClearance;
const pw = p.deviceWidth + 2 * (p.caseAllowance + p.pocketClearance);
const pl = p.deviceLength + 2 * (p.caseAllowance + p.pocketClearance);
const rw = p.padDiameter + 2 * p.padClearance;
const cw = p.plugWidth + 2 * p.channelClearance;

function rectModel(x: number, y: number, w: number, h: number): makerjs.IModel {
  return {
    paths: {
      bottom: new makerjs.paths.Line([x, y], [x + w, y]),
      right: new makerjs.paths.Line([x + w, y], [x + w, y + h]),
      top: new makerjs.paths.Line([x + w, y + h], [x, y + h]),
      left: new makerjs.paths.Line([x, y + h], [x, y]),
    },
  };
}

function baseline(): string {
  const plate: makerjs.IModel = new makerjs.models.RoundRectangle(W, L, plateR);
  plate.layer = 'outline';
  const pocket: makerjs.IModel = new makerjs.models.RoundRectangle(pw, pl, p.pocketCornerRadius);
  pocket.origin = [(W - pw) / 2, (L - pl) / 2];
  pocket.layer = 'pocket';
  const recess: makerjs.IModel = { paths: { pad: new makerjs.paths.Circle([W / 2, L / 2], rw / 2) }, layer: 'recess' };
  const channel = rectModel(W / 2, L / 2 - cw / 2, W / 2, cw);
  channel.layer = 'channel';
  const model: makerjs.IModel = { models: { plate, pocket, recess, channel }, units: makerjs.unitType.Millimeter };
  return makerjs.exporter.toDXF(model, { units: makerjs.unitType.Millimeter });
}

export async function benchGenerate(): Promise<{ rows: Row[]; notes: string[] }> {
  // Both must really produce a drawing: the measured DXF has at least the baseline's entities.
  const count = (dxf: string) => (dxf.match(/\n0\n(LINE|ARC|CIRCLE)\n/g) ?? []).length;
  const a = measured();
  const b = baseline();
  if (count(b) < 4 || count(a) < count(b)) throw new Error(`unexpected DXF output: ${count(a)} entities measured, ${count(b)} baseline`);

  for (let i = 0; i < WARMUP; i++) {
    measured();
    baseline();
  }
  const tm: number[] = [];
  const tb: number[] = [];
  // Interleaved, alternating which goes first, so both see the same machine noise.
  for (let i = 0; i < RUNS; i++) {
    const order = i % 2 === 0 ? [0, 1] : [1, 0];
    for (const which of order) {
      const t0 = performance.now();
      if (which === 0) measured();
      else baseline();
      const dt = performance.now() - t0;
      (which === 0 ? tm : tb).push(dt);
    }
  }
  // Where the measured time goes: the two halves timed on their own (same count).
  const run = runGenerator('charger-insert', BENCH_PARAMS);
  if (!run.ok) throw new Error(run.message);
  const tg: number[] = [];
  const td: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    let t0 = performance.now();
    runGenerator('charger-insert', BENCH_PARAMS);
    tg.push(performance.now() - t0);
    t0 = performance.now();
    modelToDxf(run.result.model, 'mm');
    td.push(performance.now() - t0);
  }
  const m50 = percentile(tm, 50);
  const m95 = percentile(tm, 95);
  const b50 = percentile(tb, 50);
  const b95 = percentile(tb, 95);
  const j = judge([
    { ok: m50 <= 5, label: `p50 ${ms(m50)} > 5 ms` },
    { ok: m50 <= 2 * b50, label: `p50 ${ratio(m50, b50)} baseline > 2×` },
  ]);
  return {
    rows: [
      {
        id: '1',
        what: `Charger insert: generate + DXF export, in process (${RUNS} runs)`,
        measured: `p50 ${ms(m50)}, p95 ${ms(m95)}`,
        baseline: `p50 ${ms(b50)}, p95 ${ms(b95)}`,
        ratio: `p50 ${ratio(m50, b50)}, p95 ${ratio(m95, b95)}`,
        target: 'p50 ≤ 5 ms and ≤ 2× baseline',
        ...j,
      },
    ],
    notes: [
      `Row 1: ${RUNS} timed runs each after ${WARMUP} warm-up runs, measured and baseline interleaved. Measured DXF ${a.length} bytes (${count(a)} entities, with finger notch and alignment marks; the underside model is generated but not exported); baseline DXF ${b.length} bytes (${count(b)} entities). The halves on their own: runGenerator p50 ${ms(percentile(tg, 50))}, modelToDxf p50 ${ms(percentile(td, 50))}.`,
    ],
  };
}
