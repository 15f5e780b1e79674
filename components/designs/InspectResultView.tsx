import { counted } from '../../shared/words';
import { Image, StyleSheet, Text, View } from 'react-native';
import type { InspectResult } from '../api/revisions';
import { colors, radius, space, theme } from '../ui';
import { GeometrySummaryView } from './FitNotesView';

const UNIT_NAME: Record<string, string> = {
  mm: 'millimetres',
  cm: 'centimetres',
  m: 'metres',
  in: 'inches',
  ft: 'feet',
  px: 'CSS pixels (96 to the inch)',
  pt: 'points (72 to the inch)',
  pc: 'picas (6 to the inch)',
};

// Where the importer learned the units (files/types.ts UnitsFrom); anything new still shows as it is.
const UNITS_FROM: Record<string, string> = {
  header: 'from the file’s $INSUNITS header',
  user: 'as you chose',
  'svg-size': 'from the SVG’s width and height',
  'svg-px': 'because the SVG gives no real-world size; check the extents below',
};

export function unitsText(r: Pick<InspectResult, 'sourceUnits' | 'unitsFrom'>): string {
  return `${UNIT_NAME[r.sourceUnits] ?? r.sourceUnits}, ${UNITS_FROM[r.unitsFrom] ?? r.unitsFrom}`;
}

/** What the server read from the file, shown before anything is saved. */
export function InspectResultView({ result, units, fileName }: { result: InspectResult; units: 'mm' | 'in'; fileName: string }) {
  const counts = Object.entries(result.entityCounts).filter(([, n]) => n > 0);
  const preview = `data:image/svg+xml;charset=utf-8,${encodeURIComponent(result.svg)}`;
  const s = result.summary;
  return (
    <View style={{ gap: space.md }} testID="inspect-result">
      <View style={styles.frame}>
        <Image source={{ uri: preview }} style={styles.preview} resizeMode="contain" accessibilityLabel={`What Jigwright read from ${fileName}`} />
      </View>
      <View style={styles.facts}>
        <Fact label="File">{`${fileName} · ${result.format.toUpperCase()}`}</Fact>
        <Fact label="Drawn in">{unitsText(result)}</Fact>
        <Fact label="Entities">{counts.length ? counts.map(([k, n]) => `${k} ${n}`).join(', ') : 'none found'}</Fact>
      </View>
      {s.openContours > 0 || result.warnings.length ? (
        <View style={styles.warnings} role="alert" testID="inspect-warnings">
          <Text style={theme.label}>Check before saving</Text>
          {s.openContours > 0 ? (
            <Text style={theme.body}>
              • {counted(s.openContours, 'open contour')}: a path that does not close on itself cannot be cut as a pocket or a profile.
            </Text>
          ) : null}
          {result.warnings.map((w) => (
            <Text key={w} style={theme.body}>
              • {w}
            </Text>
          ))}
        </View>
      ) : (
        <Text style={[theme.body, { color: colors.ok }]}>No warnings: every contour is closed.</Text>
      )}
      <GeometrySummaryView summary={s} units={units} />
    </View>
  );
}

function Fact({ label, children }: { label: string; children: string }) {
  return (
    <View style={styles.fact}>
      <Text style={[theme.label, { color: colors.inkMuted, width: 110 }]}>{label}</Text>
      <Text style={[theme.body, { flex: 1, minWidth: 160 }]}>{children}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, backgroundColor: colors.surface, padding: space.sm },
  preview: { width: '100%', height: 260 },
  facts: { gap: space.xs },
  fact: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  warnings: { backgroundColor: colors.cautionSoft, borderLeftWidth: 4, borderLeftColor: colors.caution, borderRadius: radius.sm, padding: space.md, gap: 4 },
});
