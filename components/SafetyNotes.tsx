import { StyleSheet, Text, View } from 'react-native';
import { CAUTIONS, type Caution } from '../shared/safety';
import { colors, radius, space, theme } from './ui';

/** The usual cautions, in view wherever the work can hurt someone. */
export function SafetyNotes({ only, compact = false }: { only?: Caution['id'][]; compact?: boolean }) {
  const list = only ? CAUTIONS.filter((c) => only.includes(c.id)) : CAUTIONS;
  return (
    <View style={styles.box} accessibilityRole="summary" aria-label="Safety cautions">
      <Text style={theme.label}>Before you cut or wire anything</Text>
      {list.map((c) => (
        <View key={c.id} style={styles.group}>
          <Text style={[theme.label, styles.title]}>{c.title}</Text>
          {(compact ? c.points.slice(0, 2) : c.points).map((p) => (
            <Text key={p} style={theme.muted}>
              • {p}
            </Text>
          ))}
        </View>
      ))}
      <Text style={theme.muted}>These notes do not replace the manufacturers’ instructions, local codes or licensed practice.</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  box: {
    backgroundColor: colors.cautionSoft,
    borderLeftWidth: 4,
    borderLeftColor: colors.caution,
    borderRadius: radius.sm,
    padding: space.md,
    gap: space.sm,
  },
  group: { gap: 2 },
  title: { color: colors.caution },
});
