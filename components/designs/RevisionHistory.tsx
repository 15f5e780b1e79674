import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { REVISION_STATUSES, STATUS_HELP, STATUS_LABEL, type RevisionInfo, type RevisionStatus } from '../../shared/schemas/library';
import { useChangeStatus } from '../api/revisions';
import { Segmented } from '../forms/Segmented';
import { Link } from 'expo-router';
import { Button, formatWhen, Notice, StatusBadge } from '../library/controls';
import { colors, fonts, radius, space, theme } from '../ui';

export function sourceText(r: RevisionInfo): string {
  return r.source === 'generated' ? `Generated${r.generatorId ? ` (${r.generatorId})` : ''}` : 'Uploaded file';
}

function StatusChanger({ designId, revision, onDone }: { designId: string; revision: RevisionInfo; onDone: () => void }) {
  const change = useChangeStatus(designId);
  const [picked, setPicked] = useState<RevisionStatus>(revision.status);
  return (
    <View style={styles.changer}>
      <Segmented label={`Status of r${revision.number}`} options={REVISION_STATUSES.map((s) => ({ value: s, label: STATUS_LABEL[s] }))} value={picked} onChange={setPicked} disabled={change.isPending} />
      <Text style={theme.muted}>{STATUS_HELP[picked]}</Text>
      {change.isError ? <Notice title="Status not changed">{change.error.message}</Notice> : null}
      <View style={[theme.row, { flexWrap: 'wrap' }]}>
        <Button
          label={`Mark r${revision.number} ${STATUS_LABEL[picked]}`}
          disabled={picked === revision.status}
          busy={change.isPending}
          onPress={() => change.mutate({ revisionId: revision.id, status: picked }, { onSuccess: onDone })}
          testID={`status-save-${revision.number}`}
        />
        <Button tone="quiet" label="Cancel" onPress={onDone} />
      </View>
    </View>
  );
}

/** Every revision, newest first; pressing one shows it above. Editors can move its status. */
export function RevisionHistory({
  designId,
  revisions,
  selectedId,
  onSelect,
  editable,
}: {
  designId: string;
  revisions: RevisionInfo[];
  selectedId: string | undefined;
  onSelect: (r: RevisionInfo) => void;
  editable: boolean;
}) {
  const [changing, setChanging] = useState<string | null>(null);
  return (
    <View style={styles.list} role="list" aria-label="Revisions" testID="revision-history">
      {revisions.map((r) => {
        const selected = r.id === selectedId;
        return (
          <View key={r.id} role="listitem" style={[styles.item, selected && styles.selected]} testID={`revision-${r.number}`}>
            <Pressable accessibilityRole="button" aria-pressed={selected} aria-label={`Show r${r.number}`} onPress={() => onSelect(r)} style={styles.main}>
              <View style={[theme.row, { flexWrap: 'wrap' }]}>
                <Text style={styles.number}>r{r.number}</Text>
                <StatusBadge status={r.status} />
                {selected ? <Text style={theme.muted}>shown above</Text> : null}
              </View>
              <Text style={theme.body}>{r.message}</Text>
              <Text style={theme.muted}>
                {r.author?.name ?? 'Someone no longer in the shop'} · {formatWhen(r.createdAt, true)} · {sourceText(r)}
              </Text>
            </Pressable>
            <View style={[theme.row, { flexWrap: 'wrap', gap: space.lg }]}>
              <Link href={`/revisions/${r.id}` as never} style={theme.link} aria-label={`Open r${r.number}: zoom, compare, cut log`}>
                Open r{r.number}: zoom, compare, cut log
              </Link>
              {editable && r.source === 'generated' && r.generatorId ? (
                <Link href={`/generators/${r.generatorId}?revision=${r.id}` as never} style={theme.link} aria-label={`New revision from r${r.number}'s parameters`}>
                  New revision from these parameters
                </Link>
              ) : null}
            </View>
            {editable ? (
              changing === r.id ? (
                <StatusChanger designId={designId} revision={r} onDone={() => setChanging(null)} />
              ) : (
                <Button tone="quiet" label="Change status" onPress={() => setChanging(r.id)} accessibilityLabel={`Change the status of r${r.number}`} testID={`status-change-${r.number}`} />
              )
            ) : null}
          </View>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  item: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, padding: space.md, gap: space.sm, backgroundColor: colors.surface },
  selected: { borderColor: colors.pine, borderLeftWidth: 4, backgroundColor: '#FBFDFB' },
  main: { gap: 4 },
  number: { fontFamily: fonts.mono, fontSize: 15, color: colors.ink },
  changer: { gap: space.sm, paddingTop: space.xs },
});
