import { Link, usePathname } from 'expo-router';
import type { ReactNode } from 'react';
import { Text } from 'react-native';
import { theme } from '../ui';
import { Loading, Notice } from './controls';
import { useCurrentShop, useMyShops, type CurrentShop } from './shopAccess';

/**
 * Waits for the signed-in person and their current shop (switched in the top bar), then renders
 * `children` with it. Signed-out visitors and people without a shop get a plain explanation.
 */
export function WithCurrentShop({ children, what }: { children: (shop: CurrentShop) => ReactNode; what: string }) {
  const here = usePathname();
  const mine = useMyShops();
  const shop = useCurrentShop();
  if (mine.isLoading) return <Loading label="Checking who is signed in…" />;
  if (mine.signedOut) {
    return (
      <Notice tone="info" title="Sign in first">
        <Text style={theme.body}>
          {what} belongs to a shop.{' '}
          <Link href={`/sign-in?next=${encodeURIComponent(here)}` as never} style={theme.link}>
            Sign in
          </Link>{' '}
          to see yours.
        </Text>
      </Notice>
    );
  }
  if (mine.error) {
    return (
      <Notice title="Could not check your sign-in" action={<Text style={theme.link} onPress={() => mine.refetch()}>Try again</Text>}>
        {mine.error.message}
      </Notice>
    );
  }
  if (!shop) {
    return (
      <Notice tone="info" title="No shop yet">
        <Text style={theme.body}>
          You are not a member of any shop. Ask a shop owner for an invitation, or{' '}
          <Link href={'/shop/new' as never} style={theme.link}>
            start a shop
          </Link>
          .
        </Text>
      </Notice>
    );
  }
  return <>{children(shop)}</>;
}
