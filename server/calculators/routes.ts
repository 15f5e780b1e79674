// Shop calculators: pure computation, public.
import { CALCULATORS, getCalculator, runCalculator } from '../../shared/calculators';
import { paramDocs } from '../../shared/params';
import { HttpError, notFound } from '../http/errors';
import type { ApiRouter } from '../http/router';
import { z } from 'zod';

/** The body is { params }; anything else beside it is refused rather than ignored. */
const RunBody = z.strictObject({ params: z.unknown().optional() }, { error: (i) => (i.code === 'unrecognized_keys' ? `Unknown field: ${(i as { keys: string[] }).keys.join(', ')}; send { "params": { … } }` : 'Send the parameters as a JSON object: { "params": { … } }') });

const LISTING = CALCULATORS.map((c) => ({ id: c.id, title: c.title, description: c.description, params: c.params, docs: paramDocs(c.params) }));

export function calculatorRoutes(api: ApiRouter): void {
  api.route('get', '/calculators', { kind: 'public' }, (_req, res) => {
    res.json({ calculators: LISTING });
  });

  api.route('post', '/calculators/:name', { kind: 'public' }, (req, res) => {
    const name = req.params.name as string;
    if (!getCalculator(name)) throw notFound(`There is no calculator "${name}"`);
    const body = RunBody.parse(req.body ?? {});
    const run = runCalculator(name, body.params);
    if (!run.ok) throw new HttpError(400, 'invalid_params', run.message, { fields: run.fields });
    res.json({ ...run.result, params: run.params });
  });
}
