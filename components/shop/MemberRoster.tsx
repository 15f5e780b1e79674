// The members of a shop: a table on wide screens, a list of cards on phones. Owners change roles
// and remove people here; the server keeps at least one owner and says so when refused.
import { useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { ROLE_LABEL, type Member, type Role } from '../../shared/schemas/auth';
import { useChangeRole, useRemoveMember } from '../api/shops';
import { Button, FieldError, formatWhen } from '../library/controls';
import { colors, space, theme, useBreakpoint } from '../ui';
import { RolePicker } from './RolePicker';

interface RosterProps {
  shopId: string;
  members: Member[];
  canManage: boolean;
  myUserId: string;
}

export function MemberRoster({ shopId, members, canManage, myUserId }: RosterProps) {
  const { isWide } = useBreakpoint();
  const changeRole = useChangeRole(shopId);
  const remove = useRemoveMember(shopId);
  const [problem, setProblem] = useState<{ userId: string; message: string } | null>(null);
  const [confirming, setConfirming] = useState<string | null>(null);

  const setRole = (m: Member, role: Role) => {
    if (role === m.role) return;
    setProblem(null);
    changeRole.mutate({ userId: m.userId, role }, { onError: (e) => setProblem({ userId: m.userId, message: e.message }) });
  };
  const removeNow = (m: Member) => {
    setProblem(null);
    remove.mutate(m.userId, {
      onError: (e) => setProblem({ userId: m.userId, message: e.message }),
      onSettled: () => setConfirming(null),
    });
  };

  const roleCell = (m: Member) =>
    canManage ? (
      <RolePicker label={`Role of ${m.name}`} value={m.role} onChange={(r) => setRole(m, r)} disabled={changeRole.isPending} />
    ) : (
      <Text style={theme.body}>{ROLE_LABEL[m.role]}</Text>
    );
  const actions = (m: Member) =>
    !canManage ? null : confirming === m.userId ? (
      <View style={[theme.row, { flexWrap: 'wrap' }]}>
        <Button tone="danger" label={m.userId === myUserId ? 'Leave the shop' : `Remove ${m.name}`} busy={remove.isPending} onPress={() => removeNow(m)} />
        <Button tone="quiet" label="Keep" onPress={() => setConfirming(null)} />
      </View>
    ) : (
      <Button tone="secondary" label="Remove" accessibilityLabel={`Remove ${m.name}`} onPress={() => setConfirming(m.userId)} />
    );
  const note = (m: Member) => (problem?.userId === m.userId ? <FieldError message={problem.message} /> : null);
  const who = (m: Member) => (
    <Text style={theme.label}>
      {m.name}
      {m.userId === myUserId ? ' (you)' : ''}
    </Text>
  );

  if (!isWide) {
    return (
      <View style={{ gap: space.sm }} testID="member-list">
        {members.map((m) => (
          <View key={m.userId} style={styles.card} aria-label={`${m.name}, ${ROLE_LABEL[m.role]}`}>
            {who(m)}
            <Text style={theme.muted}>{m.email}</Text>
            {roleCell(m)}
            {note(m)}
            <Text style={theme.muted}>Joined {formatWhen(m.joinedAt)}</Text>
            {actions(m)}
          </View>
        ))}
      </View>
    );
  }
  return (
    <View role="table" aria-label="Members" style={styles.table} testID="member-table">
      <View role="row" style={[styles.row, styles.head]}>
        {['Name', 'E-mail', 'Role', 'Joined', canManage ? '' : null].filter((h) => h !== null).map((h, i) => (
          <Text key={i} role="columnheader" style={[theme.label, cellStyle[i]]}>
            {h}
          </Text>
        ))}
      </View>
      {members.map((m) => (
        <View key={m.userId} role="row" style={styles.row}>
          <View role="cell" style={cellStyle[0]}>
            {who(m)}
          </View>
          <Text role="cell" style={[theme.body, cellStyle[1]]} numberOfLines={1}>
            {m.email}
          </Text>
          <View role="cell" style={[cellStyle[2], { gap: space.xs }]}>
            {roleCell(m)}
            {note(m)}
          </View>
          <Text role="cell" style={[theme.muted, cellStyle[3]]}>
            {formatWhen(m.joinedAt)}
          </Text>
          {canManage ? (
            <View role="cell" style={cellStyle[4]}>
              {actions(m)}
            </View>
          ) : null}
        </View>
      ))}
    </View>
  );
}

const cellStyle = [{ flex: 2 }, { flex: 3 }, { flex: 3 }, { flex: 1.5 }, { flex: 2.5 }];

const styles = StyleSheet.create({
  table: { borderWidth: 1, borderColor: colors.line, borderRadius: 6, overflow: 'hidden' },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.md, paddingHorizontal: space.md, paddingVertical: space.sm, borderTopWidth: 1, borderTopColor: colors.line },
  head: { backgroundColor: colors.sunk, borderTopWidth: 0 },
  card: { borderWidth: 1, borderColor: colors.line, borderRadius: 6, padding: space.md, gap: space.xs, backgroundColor: colors.surface },
});
