// The one bridge between stored files and the internal geometry (a makerjs model in mm).
import type makerjs from 'makerjs';
import { modelToDxf } from '../../files/dxf/export';
import { importDxf } from '../../files/dxf/import';
import { sniffUpload } from '../../files/sniff';
import { importSvg } from '../../files/svg/import';
import { modelToSvg } from '../../files/svg/render';
import { summarizeModel } from '../../shared/geometry/summary';
import type { GeometrySummary } from '../../shared/schemas/geometry';
import type { FileRole } from '../../db/schema';

export interface ImportedUpload {
  format: 'dxf' | 'svg';
  model: makerjs.IModel;
  summary: GeometrySummary;
  sourceUnits: string;
  unitsFrom: string;
  entityCounts: Record<string, number>;
  warnings: string[];
}

/** Sniffs and imports an uploaded file; throws the files/ errors (rejected, units needed). */
export function importUpload(body: Buffer, units?: 'mm' | 'in'): ImportedUpload {
  const format = sniffUpload(body);
  const text = body.toString('utf8');
  const imported = format === 'dxf' ? importDxf(text, { units }) : importSvg(text);
  return {
    format,
    model: imported.model,
    summary: summarizeModel(imported.model),
    sourceUnits: String(imported.sourceUnits),
    unitsFrom: String(imported.unitsFrom),
    entityCounts: imported.entityCounts,
    warnings: imported.warnings,
  };
}

export interface RenderedFile {
  role: FileRole;
  body: Buffer;
  contentType: string;
  ext: string;
}

/** The files every revision keeps beside its row: DXF in mm and in inches, an SVG preview, the model. */
export function renderRevisionFiles(model: makerjs.IModel, title: string): RenderedFile[] {
  return [
    { role: 'dxf', body: Buffer.from(modelToDxf(model, 'mm')), contentType: 'application/dxf', ext: 'dxf' },
    { role: 'dxf_in', body: Buffer.from(modelToDxf(model, 'in')), contentType: 'application/dxf', ext: 'dxf' },
    { role: 'svg', body: Buffer.from(modelToSvg(model, { title })), contentType: 'image/svg+xml', ext: 'svg' },
    { role: 'model', body: Buffer.from(JSON.stringify(model)), contentType: 'application/json', ext: 'json' },
  ];
}
