import { router, useLocalSearchParams } from 'expo-router';
import { Text, View } from 'react-native';
import { useSignOut } from '@/components/api/auth';
import { ApiError } from '@/components/api/client';
import { useAcceptInvite, useInvitePreview } from '@/components/api/shops';
import { AuthPanel } from '@/components/account/AuthPanel';
import { Button, LinkButton, Loading, Notice, formatWhen } from '@/components/library/controls';
import { useShopContext } from '@/components/shop/CurrentShop';
import { space, theme } from '@/components/ui';
import { ROLE_HELP, ROLE_WITH_ARTICLE } from '@/shared/schemas/auth';

export default function InviteScreen() {
  const { token: raw } = useLocalSearchParams<{ token: string }>();
  const token = typeof raw === 'string' ? raw : '';
  const preview = useInvitePreview(token);
  const { me, choose, isLoading: meLoading } = useShopContext();
  const accept = useAcceptInvite(token);
  const signOut = useSignOut();

  if (preview.isLoading || meLoading) {
    return (
      <AuthPanel title="Shop invite">
        <Loading label="Reading the invite…" />
      </AuthPanel>
    );
  }
  if (preview.isError || !preview.data) {
    const gone = preview.error instanceof ApiError && [404, 410].includes(preview.error.status);
    return (
      <AuthPanel title="Shop invite">
        <Notice title={gone ? 'This invite cannot be used' : 'The invite could not be read'}>{preview.error?.message ?? 'Unknown error'}</Notice>
        <LinkButton href="/" tone="secondary" label="Go to the home page" />
      </AuthPanel>
    );
  }

  const invite = preview.data;
  const here = `/invite/${token}`;
  const query = `?next=${encodeURIComponent(here)}&email=${encodeURIComponent(invite.email)}`;
  const join = async () => {
    try {
      const shop = await accept.mutateAsync();
      choose(shop.id);
      router.replace('/');
    } catch {
      // shown below from accept.error
    }
  };

  return (
    <AuthPanel title={`Join ${invite.shopName}`}>
      <Text style={theme.body}>
        You are invited to {invite.shopName} as {ROLE_WITH_ARTICLE[invite.role]}. You will be able to {ROLE_HELP[invite.role]}.
      </Text>
      <Text style={theme.muted}>
        For {invite.email}. The link works once, until {formatWhen(invite.expiresAt, true)}.
      </Text>
      {!me ? (
        <View style={{ gap: space.sm }}>
          <Text style={theme.body}>Sign in with that address to accept, or create an account with it first.</Text>
          <View style={[theme.row, { flexWrap: 'wrap' }]}>
            <LinkButton href={`/sign-in${query}`} label="Sign in to accept" />
            <LinkButton href={`/sign-up${query}`} tone="secondary" label="Create an account" />
          </View>
        </View>
      ) : me.user.email.toLowerCase() !== invite.email.toLowerCase() ? (
        <Notice title="Signed in with another address">
          <Text style={theme.body}>
            You are signed in as {me.user.email}, but this invite is for {invite.email}. Sign out, then sign in with the invited address.
          </Text>
          <Button tone="secondary" label="Sign out" busy={signOut.isPending} onPress={() => signOut.mutate()} />
        </Notice>
      ) : (
        <View style={{ gap: space.sm }}>
          {accept.error ? <Notice title="Not joined">{accept.error.message}</Notice> : null}
          <Button label={`Join ${invite.shopName}`} busy={accept.isPending} onPress={join} testID="accept-invite" />
        </View>
      )}
    </AuthPanel>
  );
}
