import type makerjs from 'makerjs';
import {
  CreateDesign,
  CreateGeneratedRevision,
  ForkDesign,
  LibraryQuery,
  UpdateDesign,
} from '../../shared/schemas/library';
import { runGenerator } from '../../shared/generators';
import { authOf, ROLE_RANK } from '../http/policy';
import { HttpError, notFound } from '../http/errors';
import type { ApiRouter } from '../http/router';
import { shopFromParam, shopOfDesign } from '../library/locators';
import { saveRevision } from '../revisions/store';
import { loadRevisionForCopy } from '../revisions/repository';
import { getDesignDetail, insertDesign, listDesigns, logActivity, updateDesign } from './repository';

export function designRoutes(api: ApiRouter): void {
  const { db } = api.deps;
  const viewer = (shop = shopOfDesign) => ({ kind: 'shop' as const, role: 'viewer' as const, shop });
  const editor = (shop = shopOfDesign) => ({ kind: 'shop' as const, role: 'editor' as const, shop });

  api.route('get', '/shops/:shopId/designs', viewer(shopFromParam), async (req, res) => {
    const q = LibraryQuery.parse(req.query);
    res.json(await listDesigns(db, authOf(req).shopId!, q));
  });

  api.route('post', '/shops/:shopId/designs', editor(shopFromParam), async (req, res) => {
    const body = CreateDesign.parse(req.body);
    const { user, shopId } = authOf(req);
    const created = await db.transaction().execute(async (tx) => {
      const d = await insertDesign(tx, shopId!, user.id, body);
      await logActivity(tx, { shopId: shopId!, designId: d.id, actorId: user.id, action: 'design.created', detail: { title: body.title } });
      return d;
    });
    res.status(201).json(await getDesignDetail(db, created.id));
  });

  api.route('get', '/designs/:designId', viewer(), async (req, res) => {
    const detail = await getDesignDetail(db, req.params.designId as string);
    if (!detail) throw notFound('That design does not exist');
    res.json(detail);
  });

  api.route('patch', '/designs/:designId', editor(), async (req, res) => {
    const patch = UpdateDesign.parse(req.body);
    const { user, shopId } = authOf(req);
    const designId = req.params.designId as string;
    await db.transaction().execute(async (tx) => {
      await updateDesign(tx, designId, patch);
      await logActivity(tx, { shopId: shopId!, designId, actorId: user.id, action: 'design.updated', detail: { fields: Object.keys(patch) } });
    });
    res.json(await getDesignDetail(db, designId));
  });

  // A generated revision: the server regenerates from the parameters (the client's preview is
  // not trusted), so what is stored is exactly what the generator makes of these parameters.
  api.route('post', '/designs/:designId/revisions', editor(), async (req, res) => {
    const body = CreateGeneratedRevision.parse(req.body);
    const { user } = authOf(req);
    const designId = req.params.designId as string;
    const run = runGenerator(body.generatorId, body.params);
    if (!run.ok) throw new HttpError(400, 'invalid_params', run.message, { fields: run.fields });
    const design = await db.selectFrom('designs').select('title').where('id', '=', designId).executeTakeFirstOrThrow();
    const saved = await saveRevision(api.deps, designId, {
      authorId: user.id,
      source: 'generated',
      generatorId: body.generatorId,
      params: run.params,
      message: body.message,
      status: body.status,
      fitNotes: body.fitNotes,
      model: run.result.model,
      summary: run.result.summary,
      title: design.title,
      activity: { action: 'revision.generated', detail: { generatorId: body.generatorId } },
    });
    res.status(201).json(saved);
  });

  // Fork a chosen revision into a shop where the caller is editor or owner; the fork starts at r1.
  api.route('post', '/designs/:designId/forks', viewer(), async (req, res) => {
    const body = ForkDesign.parse(req.body);
    const { user, shopId: sourceShopId } = authOf(req);
    const sourceId = req.params.designId as string;
    const target = await db
      .selectFrom('memberships')
      .innerJoin('shops', 'shops.id', 'memberships.shop_id')
      .select(['memberships.role', 'shops.name'])
      .where('memberships.shop_id', '=', body.targetShopId)
      .where('memberships.user_id', '=', user.id)
      .executeTakeFirst();
    if (!target) throw new HttpError(404, 'not_found', 'You are not a member of that shop');
    if (ROLE_RANK[target.role] < ROLE_RANK.editor) throw new HttpError(403, 'forbidden', `You are a viewer in ${target.name}; forking needs editor or owner`);
    const source = await getDesignDetail(db, sourceId);
    if (!source) throw notFound('That design does not exist');
    const rev = await loadRevisionForCopy(api.deps, body.revisionId);
    if (!rev || rev.designId !== sourceId) throw new HttpError(404, 'not_found', 'That revision is not part of this design');
    const title = body.title ?? source.title;
    const saved = await saveRevision(
      api.deps,
      async (tx) => {
        const d = await insertDesign(
          tx,
          body.targetShopId,
          user.id,
          { kind: source.kind, title, description: source.description, tags: source.tags, material: source.material },
          { designId: sourceId, revisionId: rev.id },
        );
        await logActivity(tx, {
          shopId: sourceShopId!,
          designId: sourceId,
          revisionId: rev.id,
          actorId: user.id,
          action: 'design.forked',
          detail: { into: target.name, number: rev.number, forkId: d.id },
        });
        return d.id;
      },
      {
        authorId: user.id,
        source: rev.source,
        generatorId: rev.generatorId,
        params: rev.params,
        message: `Forked from ${source.title} r${rev.number} (${source.shopName})`,
        status: 'draft',
        fitNotes: rev.fitNotes,
        model: rev.model as makerjs.IModel,
        summary: rev.summary,
        title,
        original: rev.original,
        activity: { action: 'design.created-as-fork', detail: { from: source.title, fromNumber: rev.number, fromShop: source.shopName } },
      },
    );
    res.status(201).json(saved);
  });
}
