// Parameter declarations: each generator and calculator declares its inputs once, in the spirit of
// makerjs's metaParameters. The same list drives validation (paramsSchema), defaults, the client's
// form and the documentation table. All lengths are millimetres; the client converts for display.
import { z } from 'zod';

export type ParamUnit = 'mm' | 'deg' | 'percent' | 'count';

interface ParamBase {
  name: string;
  label: string;
  help: string;
  /** Form section, e.g. "Plate", "Device". */
  group?: string;
}
export interface NumberParam extends ParamBase {
  type: 'number';
  unit: ParamUnit;
  min: number;
  max: number;
  default: number;
  step?: number;
}
export interface ChoiceParam extends ParamBase {
  type: 'choice';
  choices: { value: string; label: string }[];
  default: string;
}
export interface BoolParam extends ParamBase {
  type: 'boolean';
  default: boolean;
}
export type ParamDecl = NumberParam | ChoiceParam | BoolParam;
export type ParamValues = Record<string, number | string | boolean>;

const UNIT_TEXT: Record<ParamUnit, string> = { mm: ' mm', deg: '°', percent: ' %', count: '' };

/** "40 mm", "15°", "6 %", "4". */
export function withUnit(value: number, unit: ParamUnit): string {
  return `${value}${UNIT_TEXT[unit]}`;
}

function numberSchema(d: NumberParam) {
  let s = z
    .number({ error: `${d.label} must be a number` })
    .min(d.min, `${d.label} must be at least ${withUnit(d.min, d.unit)}`)
    .max(d.max, `${d.label} must be at most ${withUnit(d.max, d.unit)}`);
  if (d.unit === 'count') s = s.int(`${d.label} must be a whole number`);
  return s.default(d.default);
}

function choiceSchema(d: ChoiceParam) {
  const values = d.choices.map((c) => c.value) as [string, ...string[]];
  const names = d.choices.map((c) => c.label).join(', ');
  return z.enum(values, { error: `${d.label} must be one of: ${names}` }).default(d.default);
}

const schemaCache = new WeakMap<ParamDecl[], z.ZodType<ParamValues>>();

/**
 * A strict object schema for the declarations: unknown keys are refused, missing keys take their
 * defaults, and messages name the field in words ("Plate width must be at least 40 mm").
 * Cached per declaration array, so calling it on every request costs nothing.
 */
export function paramsSchema(decls: ParamDecl[]): z.ZodType<ParamValues> {
  const hit = schemaCache.get(decls);
  if (hit) return hit;
  const shape: Record<string, z.ZodType> = {};
  for (const d of decls) {
    shape[d.name] = d.type === 'number' ? numberSchema(d) : d.type === 'choice' ? choiceSchema(d) : z.boolean({ error: `${d.label} must be true or false` }).default(d.default);
  }
  const schema = z.strictObject(shape) as unknown as z.ZodType<ParamValues>;
  schemaCache.set(decls, schema);
  return schema;
}

export function defaultParams(decls: ParamDecl[]): ParamValues {
  const out: ParamValues = {};
  for (const d of decls) out[d.name] = d.default;
  return out;
}

/** A field message with lengths in it, so that a form can show it in inches (`textInUnits`). */
export type FieldText = { message: string; template?: string; lengthsMm?: number[] };

/** `fields` are in millimetres; `fieldTexts`, where given, hold the same messages as templates. */
export type ParseParamsResult = { ok: true; params: ParamValues } | { ok: false; fields: Record<string, string>; message: string; fieldTexts?: Record<string, FieldText> };

/** One message per field; unknown keys get their own field entry. */
export function issuesToFields(issues: z.core.$ZodIssue[]): Record<string, string> {
  const fields: Record<string, string> = {};
  for (const issue of issues) {
    if (issue.code === 'unrecognized_keys') {
      for (const k of issue.keys) fields[k] ??= `Unknown parameter "${k}"`;
      continue;
    }
    const key = issue.path.map(String).join('.') || '_';
    fields[key] ??= issue.message;
  }
  return fields;
}

/** "Plate width must be at least 40 mm" or "… (and 2 more)". */
export function summarizeFields(fields: Record<string, string>): string {
  const msgs = Object.values(fields);
  if (msgs.length === 0) return 'Invalid parameters';
  return msgs.length === 1 ? msgs[0] : `${msgs[0]} (and ${msgs.length - 1} more)`;
}

/** Validates raw input (undefined counts as {}), filling defaults. */
export function parseParams(decls: ParamDecl[], raw: unknown): ParseParamsResult {
  const r = paramsSchema(decls).safeParse(raw === undefined || raw === null ? {} : raw);
  if (r.success) return { ok: true, params: r.data };
  const fields = issuesToFields(r.error.issues);
  if (fields._ && Object.keys(fields).length === 1) fields._ = 'Parameters must be an object of name → value';
  return { ok: false, fields, message: summarizeFields(fields) };
}

/**
 * parseParams, then a declaration's own consistency check (combinations no single range can
 * catch); check messages go on their fields, the first one as the summary.
 */
export function validateParams(decls: ParamDecl[], raw: unknown, check?: (p: ParamValues) => ({ field: string } & FieldText)[]): ParseParamsResult {
  const parsed = parseParams(decls, raw);
  if (!parsed.ok) return parsed;
  const problems = check?.(parsed.params) ?? [];
  if (problems.length === 0) return parsed;
  const fields: Record<string, string> = {};
  const fieldTexts: Record<string, FieldText> = {};
  for (const { field, message, template, lengthsMm } of problems) {
    if (field in fields) continue;
    fields[field] = message;
    if (template !== undefined && lengthsMm) fieldTexts[field] = { message, template, lengthsMm };
  }
  return { ok: false, fields, message: problems[0].message, ...(Object.keys(fieldTexts).length ? { fieldTexts } : {}) };
}

function fmtDefault(d: ParamDecl): string {
  if (d.type === 'number') return withUnit(d.default, d.unit);
  if (d.type === 'choice') return d.choices.find((c) => c.value === d.default)?.label ?? d.default;
  return d.default ? 'yes' : 'no';
}

function fmtRange(d: ParamDecl): string {
  if (d.type === 'number') return `${withUnit(d.min, d.unit)} – ${withUnit(d.max, d.unit)}`;
  if (d.type === 'choice') return d.choices.map((c) => `\`${c.value}\` (${c.label})`).join(', ');
  return 'yes / no';
}

const cell = (s: string) => s.replace(/\|/g, '\\|').replace(/\n/g, ' ');

/** A markdown table of the declarations, for the documentation and the API listing. */
export function paramDocs(decls: ParamDecl[]): string {
  const rows = decls.map((d) => `| ${cell(d.label)} | \`${d.name}\` | ${cell(fmtRange(d))} | ${cell(fmtDefault(d))} | ${cell(d.help)} |`);
  return ['| Parameter | Name | Range | Default | Notes |', '|---|---|---|---|---|', ...rows].join('\n');
}

/** Typed getters for validated values (the schema guarantees the type). */
export const num = (p: ParamValues, k: string) => p[k] as number;
export const str = (p: ParamValues, k: string) => p[k] as string;
export const bool = (p: ParamValues, k: string) => p[k] as boolean;
