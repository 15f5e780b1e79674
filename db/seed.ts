import bcrypt from 'bcryptjs';
import type { DB } from './connect';
import type { Role } from './schema';

// The demo shop is invented: no real shop, person, product or brand.
export const DEMO_SHOP = { name: 'Larchmere Workshop', slug: 'larchmere' };
export const DEMO_ACCOUNTS: { email: string; name: string; password: string; role: Role }[] = [
  { email: 'owner@larchmere.example', name: 'Maren Holt', password: 'larchmere-owner', role: 'owner' },
  { email: 'editor@larchmere.example', name: 'Teodor Quill', password: 'larchmere-editor', role: 'editor' },
  { email: 'viewer@larchmere.example', name: 'Ines Farrow', password: 'larchmere-viewer', role: 'viewer' },
];
// A second invented shop, so forks across shops can be tried from the demo.
export const SECOND_SHOP = { name: 'Otterbrook Makerspace', slug: 'otterbrook' };
export const SECOND_ACCOUNT = { email: 'lead@otterbrook.example', name: 'Pim Varga', password: 'otterbrook-lead', role: 'owner' as Role };

export interface SeedResult {
  shopId: string;
  secondShopId: string;
  users: Record<string, string>;
}

/** Idempotent: running it again changes nothing that is already there. */
export async function seedDemo(db: DB, opts: { bcryptCost?: number } = {}): Promise<SeedResult> {
  const cost = opts.bcryptCost ?? 10;
  const shopId = await upsertShop(db, DEMO_SHOP);
  const secondShopId = await upsertShop(db, SECOND_SHOP);
  const users: Record<string, string> = {};
  for (const a of DEMO_ACCOUNTS) users[a.email] = await upsertMember(db, shopId, a, cost);
  users[SECOND_ACCOUNT.email] = await upsertMember(db, secondShopId, SECOND_ACCOUNT, cost);
  // The demo editor also belongs to the second shop, so a fork between shops can be shown.
  await db
    .insertInto('memberships')
    .values({ shop_id: secondShopId, user_id: users['editor@larchmere.example'], role: 'editor' })
    .onConflict((oc) => oc.doNothing())
    .execute();
  await seedCatalog(db, shopId);
  return { shopId, secondShopId, users };
}

// Invented devices and charger pads with invented dimensions (mm).
export const DEMO_DEVICES = [
  { name: 'Demo phone S', width_mm: 68.4, length_mm: 142.0, thickness_mm: 7.9, case_allowance_mm: 1.2 },
  { name: 'Demo phone L', width_mm: 77.6, length_mm: 161.2, thickness_mm: 8.4, case_allowance_mm: 1.6 },
  { name: 'Demo phone L, rugged case', width_mm: 77.6, length_mm: 161.2, thickness_mm: 8.4, case_allowance_mm: 3.0 },
  { name: 'Demo tablet 8', width_mm: 126.0, length_mm: 203.0, thickness_mm: 6.6, case_allowance_mm: 2.0 },
];
export const DEMO_CHARGERS = [
  { name: 'Round pad 56', shape: 'round' as const, width_mm: 56, length_mm: 56, thickness_mm: 5.8, range_min_mm: 0, range_max_mm: 4 },
  { name: 'Square pad 72', shape: 'rect' as const, width_mm: 72, length_mm: 72, thickness_mm: 7.5, range_min_mm: 1, range_max_mm: 5 },
];

async function seedCatalog(db: DB, shopId: string) {
  await db.insertInto('devices').values(DEMO_DEVICES.map((d) => ({ ...d, shop_id: shopId }))).onConflict((oc) => oc.columns(['shop_id', 'name']).doNothing()).execute();
  await db.insertInto('chargers').values(DEMO_CHARGERS.map((c) => ({ ...c, shop_id: shopId }))).onConflict((oc) => oc.columns(['shop_id', 'name']).doNothing()).execute();
}

async function upsertShop(db: DB, shop: { name: string; slug: string }): Promise<string> {
  await db.insertInto('shops').values(shop).onConflict((oc) => oc.column('slug').doNothing()).execute();
  return (await db.selectFrom('shops').select('id').where('slug', '=', shop.slug).executeTakeFirstOrThrow()).id;
}

async function upsertMember(db: DB, shopId: string, a: { email: string; name: string; password: string; role: Role }, cost: number) {
  let user = await db.selectFrom('users').select('id').where('email', '=', a.email).executeTakeFirst();
  if (!user) {
    user = await db
      .insertInto('users')
      .values({ email: a.email, name: a.name, password_hash: await bcrypt.hash(a.password, cost) })
      .returning('id')
      .executeTakeFirstOrThrow();
  }
  await db
    .insertInto('memberships')
    .values({ shop_id: shopId, user_id: user.id, role: a.role })
    .onConflict((oc) => oc.doNothing())
    .execute();
  return user.id;
}
