// The shop the app is working in: one of the signed-in person's shops, remembered on this browser
// (localStorage on web) and shared by every screen through a small context. A screen that shows
// one shop's design or revision makes that shop the current one while it is on show
// (useShopOfScreen), so the top bar, the role and the library link match what is on screen.
import { useFocusEffect } from 'expo-router';
import { createContext, useCallback, useContext, useMemo, useState, type Dispatch, type ReactNode, type SetStateAction } from 'react';
import type { Me, Role, ShopSummary } from '../../shared/schemas/auth';
import { useMe } from '../api/auth';

const STORAGE_KEY = 'jigwright.currentShop';

function readStored(): string | null {
  try {
    return typeof localStorage !== 'undefined' ? localStorage.getItem(STORAGE_KEY) : null;
  } catch {
    return null; // storage blocked (private mode, policy): fall back to the first shop
  }
}

function writeStored(id: string): void {
  try {
    if (typeof localStorage !== 'undefined') localStorage.setItem(STORAGE_KEY, id);
  } catch {
    // The choice still holds for this visit.
  }
}

/** The chosen shop if the person still belongs to it, else their first shop, else none. */
export function pickShop(shops: ShopSummary[], chosen: string | null): ShopSummary | null {
  return shops.find((s) => s.id === chosen) ?? shops[0] ?? null;
}

interface ShopContextValue {
  /** undefined while loading, null when signed out. */
  me: Me | null | undefined;
  shops: ShopSummary[];
  current: ShopSummary | null;
  choose: (shopId: string) => void;
  /** The shop the screen on show belongs to (a design's, a revision's), or null on other screens. */
  screenShopId: string | null;
  setScreenShopId: Dispatch<SetStateAction<string | null>>;
  isLoading: boolean;
  error: Error | null;
  refetch: () => void;
}

const ShopContext = createContext<ShopContextValue | null>(null);

export function CurrentShopProvider({ children }: { children: ReactNode }) {
  const me = useMe();
  const [chosen, setChosen] = useState<string | null>(readStored);
  const [screenShopId, setScreenShopId] = useState<string | null>(null);
  const choose = useCallback((shopId: string) => {
    setChosen(shopId);
    writeStored(shopId);
  }, []);
  const value = useMemo<ShopContextValue>(() => {
    const shops = me.data?.shops ?? [];
    return { me: me.data, shops, current: pickShop(shops, chosen), choose, screenShopId, setScreenShopId, isLoading: me.isLoading, error: me.error, refetch: () => void me.refetch() };
  }, [me.data, me.isLoading, me.error, me.refetch, chosen, choose, screenShopId]);
  return <ShopContext.Provider value={value}>{children}</ShopContext.Provider>;
}

export function useShopContext(): ShopContextValue {
  const v = useContext(ShopContext);
  if (!v) throw new Error('useShopContext() needs <CurrentShopProvider> around the app (app/_layout.tsx)');
  return v;
}

// The small interface other screens use (the library reads these three).

export interface CurrentShop {
  shopId: string;
  role: Role;
  shopName: string;
}

export function useCurrentShop(): CurrentShop | null {
  const { current } = useShopContext();
  return current ? { shopId: current.id, role: current.role, shopName: current.name } : null;
}

export function useChooseShop(): (shopId: string) => void {
  return useShopContext().choose;
}

/**
 * For a screen that shows one shop's design or revision: while the screen is in focus, that shop is
 * the current one — the same as choosing it in the switcher — when the person belongs to it. Runs on
 * focus only: Expo Router keeps earlier screens of the stack mounted but hidden, and they must not
 * pull the current shop back; going back to one of them focuses it again and switches back. A shop
 * the person is not a member of changes nothing (the API answers 404 for its designs anyway).
 */
export function useShopOfScreen(shopId: string | null | undefined): void {
  const { shops, choose, setScreenShopId } = useShopContext();
  const member = !!shopId && shops.some((s) => s.id === shopId);
  useFocusEffect(
    useCallback(() => {
      if (!shopId || !member) return undefined;
      choose(shopId);
      setScreenShopId(shopId);
      // On leaving, forget it unless the next screen has already put its own shop there.
      return () => setScreenShopId((cur) => (cur === shopId ? null : cur));
    }, [shopId, member, choose, setScreenShopId]),
  );
}

export function useMyShops() {
  const { me, shops, isLoading, error, refetch } = useShopContext();
  return { me: me ?? null, shops, isLoading, error, signedOut: me === null, refetch };
}
