// Home's first card: who is signed in and where, or the way in for visitors.
import { Text, View } from 'react-native';
import { LinkButton, Loading, Notice } from '../library/controls';
import { space, theme } from '../ui';
import { useShopContext } from './CurrentShop';
import { ROLE_HELP, ROLE_WITH_ARTICLE } from '../../shared/schemas/auth';

export function YourShopCard() {
  const { me, current, isLoading, error, refetch } = useShopContext();
  if (isLoading) return <Loading label="Checking who is signed in…" />;
  if (error) return <Notice title="Could not check your sign-in" action={<Text style={theme.link} onPress={refetch}>Try again</Text>}>{error.message}</Notice>;
  if (!me) {
    return (
      <View style={theme.card} testID="signed-out-card">
        <Text style={theme.heading}>Your shop's library</Text>
        <Text style={theme.body}>Sign in to see your shop's designs, or create an account and start a shop.</Text>
        <View style={[theme.row, { flexWrap: 'wrap' }]}>
          <LinkButton href="/sign-in" label="Sign in" />
          <LinkButton href="/sign-up" tone="secondary" label="Create an account" />
        </View>
      </View>
    );
  }
  if (!current) {
    return (
      <View style={theme.card} testID="no-shop-card">
        <Text style={theme.heading}>Welcome, {me.user.name}</Text>
        <Text style={theme.body}>You are not in a shop yet. Open the invite link a shop owner mailed you, or start a shop of your own.</Text>
        <LinkButton href="/shop/new" label="Start a shop" />
      </View>
    );
  }
  return (
    <View style={theme.card} testID="current-shop-card">
      <Text style={theme.muted}>Signed in as {me.user.name}</Text>
      <Text accessibilityRole="header" aria-level={2} style={theme.title}>
        {current.name}
      </Text>
      <Text style={theme.body} testID="current-role">
        You are {ROLE_WITH_ARTICLE[current.role]} here, so you can {ROLE_HELP[current.role]}.
      </Text>
      <View style={[theme.row, { flexWrap: 'wrap', gap: space.sm }]}>
        <LinkButton href="/shop/members" tone="secondary" label="Members" />
      </View>
    </View>
  );
}
