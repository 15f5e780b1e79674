import type { ReactNode } from 'react';
import { Text } from 'react-native';
import type { Me } from '../../shared/schemas/auth';
import { LinkButton, Loading, Notice } from '../library/controls';
import { useShopContext } from '../shop/CurrentShop';
import { theme } from '../ui';

/** Renders `children` for a signed-in person; otherwise a way to sign in that comes back here. */
export function SignedInOnly({ here, children }: { here: string; children: (me: Me) => ReactNode }) {
  const { me, isLoading, error, refetch } = useShopContext();
  if (isLoading) return <Loading label="Checking who is signed in…" />;
  if (error) return <Notice title="Could not check your sign-in" action={<Text style={theme.link} onPress={refetch}>Try again</Text>}>{error.message}</Notice>;
  if (!me) {
    return (
      <Notice tone="info" title="Sign in first">
        <Text style={theme.body}>This page belongs to your account.</Text>
        <LinkButton href={`/sign-in?next=${encodeURIComponent(here)}`} label="Sign in" />
      </Notice>
    );
  }
  return <>{children(me)}</>;
}
