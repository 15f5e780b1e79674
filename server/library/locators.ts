import type { Request } from 'express';
import type { Deps } from '../deps';
import type { ShopLocator } from '../http/policy';

const UUID = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
export const isUuid = (s: unknown): s is string => typeof s === 'string' && UUID.test(s);

/** Shop from `:shopId` in the path (null when it is not a uuid). */
export const shopFromParam: ShopLocator = async (req: Request) => (isUuid(req.params.shopId) ? req.params.shopId : null);

/** Shop that owns `:designId`. */
export const shopOfDesign: ShopLocator = async (req: Request, deps: Deps) => {
  if (!isUuid(req.params.designId)) return null;
  const row = await deps.db.selectFrom('designs').select('shop_id').where('id', '=', req.params.designId).executeTakeFirst();
  return row?.shop_id ?? null;
};

/** Shop that owns the design of `:revisionId`. */
export const shopOfRevision: ShopLocator = async (req: Request, deps: Deps) => {
  if (!isUuid(req.params.revisionId)) return null;
  const row = await deps.db
    .selectFrom('revisions')
    .innerJoin('designs', 'designs.id', 'revisions.design_id')
    .select('designs.shop_id')
    .where('revisions.id', '=', req.params.revisionId)
    .executeTakeFirst();
  return row?.shop_id ?? null;
};

/** Shop that owns the cut log entry `:cutId`. */
export const shopOfCut: ShopLocator = async (req: Request, deps: Deps) => {
  if (!isUuid(req.params.cutId)) return null;
  const row = await deps.db.selectFrom('cut_logs').select('shop_id').where('id', '=', req.params.cutId).executeTakeFirst();
  return row?.shop_id ?? null;
};
