import { Text, View } from 'react-native';
import { usePendingInvites, useWithdrawInvite } from '../api/shops';
import { Button, FieldError, Loading, formatWhen } from '../library/controls';
import { colors, space, theme } from '../ui';
import { ROLE_LABEL } from '../../shared/schemas/auth';

export function PendingInvites({ shopId }: { shopId: string }) {
  const invites = usePendingInvites(shopId, true);
  const withdraw = useWithdrawInvite(shopId);
  if (invites.isLoading) return <Loading label="Loading open invites…" />;
  if (invites.isError) return <FieldError message={invites.error.message} />;
  if (!invites.data?.length) return <Text style={theme.muted}>No open invites.</Text>;
  return (
    <View style={{ gap: space.sm }}>
      {withdraw.error ? <FieldError message={withdraw.error.message} /> : null}
      {invites.data.map((i) => (
        <View key={i.id} style={[theme.row, { flexWrap: 'wrap', justifyContent: 'space-between', borderTopWidth: 1, borderTopColor: colors.line, paddingTop: space.sm }]}>
          <View style={{ gap: 2, flexShrink: 1 }}>
            <Text style={theme.body}>{i.email}</Text>
            <Text style={theme.muted}>
              {ROLE_LABEL[i.role]} · until {formatWhen(i.expiresAt)}
              {i.invitedBy ? ` · from ${i.invitedBy}` : ''}
            </Text>
          </View>
          <Button tone="quiet" label="Withdraw" accessibilityLabel={`Withdraw the invite to ${i.email}`} busy={withdraw.isPending && withdraw.variables === i.id} onPress={() => withdraw.mutate(i.id)} />
        </View>
      ))}
    </View>
  );
}
