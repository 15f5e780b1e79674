// Generator declarations and previews. Pure computation on the request's parameters: no shop
// data is read or written, so the routes are public.
import { runGenerator, getGenerator, GENERATORS } from '../../shared/generators';
import { renderSvg } from '../../shared/geometry/svg';
import { paramDocs } from '../../shared/params';
import { HttpError, notFound } from '../http/errors';
import type { ApiRouter } from '../http/router';
import { z } from 'zod';

/** The body is { params }; anything else beside it is refused rather than ignored. */
const RunBody = z.strictObject({ params: z.unknown().optional() }, { error: (i) => (i.code === 'unrecognized_keys' ? `Unknown field: ${(i as { keys: string[] }).keys.join(', ')}; send { "params": { … } }` : 'Send the parameters as a JSON object: { "params": { … } }') });

/** Same declarations every time: built once. */
const LISTING = GENERATORS.map((g) => ({
  id: g.id,
  title: g.title,
  kind: g.kind,
  description: g.description,
  params: g.params,
  deviceParams: g.deviceParams ?? [],
  docs: paramDocs(g.params),
}));

export function generatorRoutes(api: ApiRouter): void {
  api.route('get', '/generators', { kind: 'public' }, (_req, res) => {
    res.json({ generators: LISTING });
  });

  api.route('post', '/generators/:id/preview', { kind: 'public' }, (req, res) => {
    const id = req.params.id as string;
    const gen = getGenerator(id);
    if (!gen) throw notFound(`There is no generator "${id}"`);
    const body = RunBody.parse(req.body ?? {});
    const run = runGenerator(id, body.params);
    if (!run.ok) throw new HttpError(400, 'invalid_params', run.message, { fields: run.fields });
    const { model, underside, report, summary } = run.result;
    res.json({
      svg: renderSvg(model, { title: gen.title }),
      ...(underside ? { undersideSvg: renderSvg(underside, { title: `${gen.title}: underside, mirrored` }) } : {}),
      report,
      summary,
      params: run.params,
    });
  });
}
