// Which shop the library shows and what the signed-in person may do in each of their shops. The
// current shop and the person's shops come from the accounts work (components/shop/CurrentShop).
import type { Role } from '../../shared/schemas/auth';
import { useMyShops } from '../shop/CurrentShop';

export { useChooseShop, useCurrentShop, useMyShops, type CurrentShop } from '../shop/CurrentShop';

export const canEdit = (role: Role | null | undefined) => role === 'editor' || role === 'owner';

/** The caller's role in a shop, or null when they are not a member (or not known yet). */
export function useRoleIn(shopId: string | null | undefined): Role | null {
  const { shops } = useMyShops();
  return shops.find((s) => s.id === shopId)?.role ?? null;
}
