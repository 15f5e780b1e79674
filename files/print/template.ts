// Printable 1:1 templates for hand routing and layout: a cover sheet with the title block, a
// 100 mm and a 4 in calibration bar and the cautions, then the part tiled over as many pages as it
// needs, each tile overlapping its neighbours with marks to line them up.
import makerjs from 'makerjs';
import PDFDocument from 'pdfkit';
import { LAYER_STYLE } from '../../shared/geometry/layers';
import { modelToLayerPaths, previewFrame } from '../../shared/geometry/paths';
import type { LayerName } from '../../shared/schemas/geometry';
import { CAUTIONS } from '../../shared/safety';

export const PT_PER_MM = 72 / 25.4; // PDF user space: 1/72 in (ISO 32000-1 §8.3.2.3)
export const PAPERS = {
  a4: { label: 'A4', width: 210, height: 297 }, // ISO 216
  letter: { label: 'Letter', width: 215.9, height: 279.4 }, // 8.5 × 11 in
} as const;
export type Paper = keyof typeof PAPERS;

const MARGIN_MM = 12;
export const OVERLAP_MM = 10;

export interface TemplateInfo {
  designTitle: string;
  revisionNumber: number;
  units: 'mm' | 'in';
  date: string;
  paper: Paper;
}

export interface TilePlan {
  cols: number;
  rows: number;
  /** Printable area per page, mm. */
  areaW: number;
  areaH: number;
  /** Tile origins in part coordinates (from the drawing's top-left), mm. */
  tiles: { col: number; row: number; x: number; y: number }[];
}

/** How many pages a part needs: tiles step by the printable size less the overlap. */
export function planTiles(partW: number, partH: number, paper: Paper): TilePlan {
  const p = PAPERS[paper];
  const areaW = p.width - 2 * MARGIN_MM;
  const areaH = p.height - 2 * MARGIN_MM - 10; // a strip at the bottom for the tile label
  const stepW = areaW - OVERLAP_MM;
  const stepH = areaH - OVERLAP_MM;
  const cols = partW <= areaW ? 1 : Math.ceil((partW - OVERLAP_MM) / stepW);
  const rows = partH <= areaH ? 1 : Math.ceil((partH - OVERLAP_MM) / stepH);
  const tiles = [];
  for (let row = 0; row < rows; row++) for (let col = 0; col < cols; col++) tiles.push({ col, row, x: col * stepW, y: row * stepH });
  return { cols, rows, areaW, areaH, tiles };
}

function fmt(mm: number, units: 'mm' | 'in') {
  return units === 'in' ? `${(mm / 25.4).toFixed(3)} in` : `${mm.toFixed(1)} mm`;
}

function drawLayers(doc: PDFKit.PDFDocument, model: makerjs.IModel) {
  for (const { layer, d } of modelToLayerPaths(model)) {
    const style = LAYER_STYLE[layer as LayerName] ?? LAYER_STYLE.outline;
    doc.save();
    doc.lineWidth(style.width * 0.25); // style widths are screen px; 0.25 mm reads well on paper
    doc.strokeColor(style.stroke);
    if (style.dash) {
      const [on, off] = style.dash.split(' ').map(Number);
      doc.dash(on * 0.6, { space: (off ?? on) * 0.6 });
    }
    doc.path(d).stroke();
    doc.restore();
  }
}

/** A calibration bar: a filled bar exactly `lengthMm` long, with end ticks and a label. */
function calibrationBar(doc: PDFKit.PDFDocument, xMm: number, yMm: number, lengthMm: number, label: string) {
  doc.save();
  doc.rect(xMm * PT_PER_MM, yMm * PT_PER_MM, lengthMm * PT_PER_MM, 3 * PT_PER_MM).fill('#1F2421');
  doc.restore();
  doc.fontSize(9).fillColor('#1F2421').text(label, xMm * PT_PER_MM, (yMm + 4.5) * PT_PER_MM, { lineBreak: false });
}

export function templatePdf(model: makerjs.IModel, info: TemplateInfo): Promise<Buffer> {
  const paper = PAPERS[info.paper];
  const frame = previewFrame(model);
  const plan = planTiles(frame.width, frame.height, info.paper);
  // Uncompressed content streams: the tests (and a curious user) can read the coordinates.
  const doc = new PDFDocument({ size: [paper.width * PT_PER_MM, paper.height * PT_PER_MM], margin: 0, compress: false, autoFirstPage: false, info: { Title: `${info.designTitle} r${info.revisionNumber}`, Creator: 'Jigwright' } });
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));

  // Cover sheet.
  doc.addPage();
  const m = MARGIN_MM * PT_PER_MM;
  doc.fontSize(18).fillColor('#1F2421').text(info.designTitle, m, m);
  doc.fontSize(11).fillColor('#5A625D').text(
    `Revision r${info.revisionNumber}  ·  ${info.date}  ·  units ${info.units}  ·  ${paper.label}  ·  part ${fmt(frame.width, info.units)} × ${fmt(frame.height, info.units)}`,
  );
  doc.moveDown(0.5).text(`Print at 100 % ("actual size"), then measure both bars. ${plan.cols * plan.rows} tile page(s): ${plan.cols} across × ${plan.rows} down, overlapping ${OVERLAP_MM} mm; line up the crosses.`);
  calibrationBar(doc, MARGIN_MM, 60, 100, '100 mm: measure this bar before cutting to the template');
  calibrationBar(doc, MARGIN_MM, 75, 101.6, '4 in');
  doc.fontSize(12).fillColor('#8A6A00').text('Before you cut or wire anything', m, 95 * PT_PER_MM);
  doc.fontSize(9).fillColor('#1F2421');
  for (const c of CAUTIONS) {
    doc.moveDown(0.3).font('Helvetica-Bold').text(c.title).font('Helvetica');
    for (const p of c.points) doc.text(`•  ${p}`, { width: (paper.width - 2 * MARGIN_MM) * PT_PER_MM });
  }
  doc.moveDown(0.5).text('These notes do not replace the manufacturers’ instructions, local codes or licensed practice.');

  // Tiles: the drawing at 1:1, clipped to the printable area, shifted to each tile's origin.
  for (const t of plan.tiles) {
    doc.addPage();
    doc.save();
    doc.rect(m, m, plan.areaW * PT_PER_MM, plan.areaH * PT_PER_MM).clip();
    doc.translate(m - t.x * PT_PER_MM, m - t.y * PT_PER_MM).scale(PT_PER_MM);
    drawLayers(doc, model);
    doc.restore();
    // Overlap marks: crosses at the corners of the overlap band shared with the next tile.
    doc.save().lineWidth(0.5).strokeColor('#B8652A');
    const cross = (xMm: number, yMm: number) => {
      const x = m + xMm * PT_PER_MM;
      const y = m + yMm * PT_PER_MM;
      doc.moveTo(x - 8, y).lineTo(x + 8, y).moveTo(x, y - 8).lineTo(x, y + 8).stroke();
    };
    if (t.col < plan.cols - 1) {
      const x = plan.areaW - OVERLAP_MM;
      cross(x, 5); cross(x, plan.areaH - 5); cross(plan.areaW, 5); cross(plan.areaW, plan.areaH - 5);
    }
    if (t.row < plan.rows - 1) {
      const y = plan.areaH - OVERLAP_MM;
      cross(5, y); cross(plan.areaW - 5, y); cross(5, plan.areaH); cross(plan.areaW - 5, plan.areaH);
    }
    doc.restore();
    doc.rect(m, m, plan.areaW * PT_PER_MM, plan.areaH * PT_PER_MM).lineWidth(0.3).dash(3, { space: 3 }).strokeColor('#8C8C8C').stroke().undash();
    doc.fontSize(8).fillColor('#5A625D').text(
      `${info.designTitle} r${info.revisionNumber} — tile column ${t.col + 1} of ${plan.cols}, row ${t.row + 1} of ${plan.rows} — 1:1`,
      m, (MARGIN_MM + plan.areaH + 3) * PT_PER_MM, { lineBreak: false },
    );
  }
  doc.end();
  return done;
}
