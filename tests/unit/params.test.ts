import { describe, expect, it } from 'vitest';
import { defaultParams, paramDocs, paramsSchema, parseParams, type ParamDecl } from '../../shared/params';

const DECLS: ParamDecl[] = [
  { type: 'number', name: 'plateWidth', label: 'Plate width', unit: 'mm', min: 40, max: 600, default: 120, help: 'Across the plate.' },
  { type: 'number', name: 'sides', label: 'Sides', unit: 'count', min: 3, max: 12, default: 4, help: 'Number of sides.' },
  { type: 'number', name: 'splay', label: 'Splay', unit: 'deg', min: 0, max: 60, default: 15, help: 'From vertical.' },
  { type: 'choice', name: 'stock', label: 'Stock', choices: [{ value: 'plywood', label: 'Plywood' }, { value: 'oak', label: 'Oak' }], default: 'plywood', help: 'Material | kind.' },
  { type: 'boolean', name: 'notch', label: 'Finger notch', default: true, help: 'Lift-out notch.' },
];

describe('parameter declarations', () => {
  it('fills defaults for missing keys', () => {
    expect(paramsSchema(DECLS).parse({})).toEqual({ plateWidth: 120, sides: 4, splay: 15, stock: 'plywood', notch: true });
    expect(defaultParams(DECLS)).toEqual({ plateWidth: 120, sides: 4, splay: 15, stock: 'plywood', notch: true });
    expect(parseParams(DECLS, undefined)).toEqual({ ok: true, params: defaultParams(DECLS) });
  });

  it('words range messages with the label and unit', () => {
    const r = parseParams(DECLS, { plateWidth: 30, splay: 61 });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.fields.plateWidth).toBe('Plate width must be at least 40 mm');
    expect(r.fields.splay).toBe('Splay must be at most 60°');
    expect(r.message).toBe('Plate width must be at least 40 mm (and 1 more)');
  });

  it('refuses unknown keys, wrong types, fractions of a count and unknown choices, field by field', () => {
    const r = parseParams(DECLS, { plateWidth: '120', sides: 4.5, stock: 'steel', notch: 'yes', colour: 'red' });
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.fields).toEqual({
      plateWidth: 'Plate width must be a number',
      sides: 'Sides must be a whole number',
      stock: 'Stock must be one of: Plywood, Oak',
      notch: 'Finger notch must be true or false',
      colour: 'Unknown parameter "colour"',
    });
  });

  it('refuses NaN, Infinity and a non-object body', () => {
    expect(parseParams(DECLS, { plateWidth: Number.NaN }).ok).toBe(false);
    expect(parseParams(DECLS, { plateWidth: Number.POSITIVE_INFINITY }).ok).toBe(false);
    const r = parseParams(DECLS, [1, 2]);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fields._).toMatch(/object/);
  });

  it('documents every parameter as a markdown table row', () => {
    const md = paramDocs(DECLS);
    const lines = md.split('\n');
    expect(lines[0]).toBe('| Parameter | Name | Range | Default | Notes |');
    expect(lines).toHaveLength(2 + DECLS.length);
    expect(md).toContain('| Plate width | `plateWidth` | 40 mm – 600 mm | 120 mm | Across the plate. |');
    expect(md).toContain('Material \\| kind.'); // pipes in text are escaped
  });
});
