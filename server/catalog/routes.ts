import { ChargerInput, DeviceInput } from '../../shared/schemas/catalog';
import { conflict, notFound } from '../http/errors';
import { authOf } from '../http/policy';
import type { ApiRouter } from '../http/router';
import { isUuid, shopFromParam } from '../library/locators';
import { insertCharger, insertDevice, listChargers, listDevices } from './repository';

const isUnique = (e: unknown) => (e as { code?: string })?.code === '23505';

export function catalogRoutes(api: ApiRouter): void {
  const { db } = api.deps;
  const viewer = { kind: 'shop' as const, role: 'viewer' as const, shop: shopFromParam };
  const editor = { kind: 'shop' as const, role: 'editor' as const, shop: shopFromParam };

  api.route('get', '/shops/:shopId/devices', viewer, async (req, res) => {
    res.json({ items: await listDevices(db, authOf(req).shopId!) });
  });
  api.route('post', '/shops/:shopId/devices', editor, async (req, res) => {
    const body = DeviceInput.parse(req.body);
    try {
      const { id } = await insertDevice(db, authOf(req).shopId!, body);
      res.status(201).json({ id, ...body });
    } catch (e) {
      if (isUnique(e)) throw conflict(`A device named “${body.name}” is already in the catalog`);
      throw e;
    }
  });
  api.route('delete', '/shops/:shopId/devices/:deviceId', editor, async (req, res) => {
    const id = req.params.deviceId as string;
    if (!isUuid(id)) throw notFound('That device is not in the catalog');
    const r = await db.deleteFrom('devices').where('id', '=', id).where('shop_id', '=', authOf(req).shopId!).executeTakeFirst();
    if (!r.numDeletedRows) throw notFound('That device is not in the catalog');
    res.status(204).end();
  });

  api.route('get', '/shops/:shopId/chargers', viewer, async (req, res) => {
    res.json({ items: await listChargers(db, authOf(req).shopId!) });
  });
  api.route('post', '/shops/:shopId/chargers', editor, async (req, res) => {
    const body = ChargerInput.parse(req.body);
    try {
      const { id } = await insertCharger(db, authOf(req).shopId!, body);
      res.status(201).json({ id, ...body });
    } catch (e) {
      if (isUnique(e)) throw conflict(`A charger named “${body.name}” is already in the catalog`);
      throw e;
    }
  });
  api.route('delete', '/shops/:shopId/chargers/:chargerId', editor, async (req, res) => {
    const id = req.params.chargerId as string;
    if (!isUuid(id)) throw notFound('That charger is not in the catalog');
    const r = await db.deleteFrom('chargers').where('id', '=', id).where('shop_id', '=', authOf(req).shopId!).executeTakeFirst();
    if (!r.numDeletedRows) throw notFound('That charger is not in the catalog');
    res.status(204).end();
  });
}
