import { counted } from '../../shared/words';
import { Text, View } from 'react-native';
import { STATUS_LABEL, type DesignDetail, type RevisionStatus } from '../../shared/schemas/library';
import { formatWhen } from '../library/controls';
import { colors, space, theme } from '../ui';

type Entry = DesignDetail['activity'][number];

const str = (v: unknown) => (typeof v === 'string' || typeof v === 'number' ? String(v) : '');
const status = (v: unknown) => STATUS_LABEL[v as RevisionStatus] ?? str(v);

/** One line of the log in plain words; unknown actions still show their name. */
export function describeActivity(a: Entry): string {
  const d = a.detail ?? {};
  switch (a.action) {
    case 'design.created':
      return 'started the design';
    case 'design.updated': {
      const fields = Array.isArray(d.fields) ? (d.fields as string[]).join(', ') : '';
      return fields ? `changed the ${fields}` : 'changed the details';
    }
    case 'revision.uploaded': {
      const fmt = str(d.format).toUpperCase() || 'a';
      const units = str(d.sourceUnits);
      const warnings = Number(d.warnings ?? 0);
      return `uploaded ${fmt === 'a' ? 'a file' : `a ${fmt} file`}${units ? ` drawn in ${units}` : ''}${warnings ? ` (${counted(warnings, 'warning')})` : ''}`;
    }
    case 'revision.generated':
      return `saved a revision from the ${str(d.generatorId) || 'a'} generator`;
    case 'revision.regenerated':
      return `remade r${str(d.fromNumber)} for ${typeof d.device === 'string' ? d.device : 'another device'}`;
    case 'revision.status':
      return `moved r${str(d.number)} from ${status(d.from)} to ${status(d.to)}`;
    case 'design.forked':
      return `forked r${str(d.number)} into ${str(d.into) || 'another shop'}`;
    case 'design.created-as-fork':
      return `started this design as a fork of ${str(d.from)} r${str(d.fromNumber)} (${str(d.fromShop)})`;
    default:
      return a.action;
  }
}

export function ActivityLog({ activity }: { activity: Entry[] }) {
  if (activity.length === 0) return <Text style={theme.muted}>Nothing has happened to this design yet.</Text>;
  return (
    <View style={{ gap: space.sm }} role="list" aria-label="Activity" testID="activity-log">
      {activity.map((a) => (
        <View key={a.id} role="listitem" style={{ borderLeftWidth: 2, borderLeftColor: colors.line, paddingLeft: space.md, gap: 2 }}>
          <Text style={theme.body}>
            <Text style={theme.label}>{a.actor ?? 'Someone no longer in the shop'}</Text> {describeActivity(a)}
          </Text>
          <Text style={theme.muted}>{formatWhen(a.createdAt, true)}</Text>
        </View>
      ))}
    </View>
  );
}
