import { counted } from '../../shared/words';
import type { ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { LAYER_STYLE } from '../../shared/geometry/layers';
import type { GeometrySummary, LayerName } from '../../shared/schemas/geometry';
import type { FitNotes } from '../../shared/schemas/library';
import { formatLength, fromMm, type LengthUnit } from '../../shared/units';
import { colors, space, theme } from '../ui';

export const GRAIN_LABEL: Record<NonNullable<FitNotes['grain']>, string> = {
  'along-length': 'Runs along the length',
  'along-width': 'Runs across (along the width)',
  none: 'No grain (sheet goods)',
};

function Row({ label, children, testID }: { label: string; children: ReactNode; testID?: string }) {
  return (
    <View style={styles.row} testID={testID}>
      <Text style={[theme.label, styles.key]}>{label}</Text>
      <View style={styles.value}>{typeof children === 'string' ? <Text style={theme.mono}>{children}</Text> : children}</View>
    </View>
  );
}

const len = (mm: number, u: LengthUnit) => formatLength(mm, u, { digits: u === 'in' ? 3 : 2 });
const size3 = (w: number, l: number, t: number, u: LengthUnit) => {
  const bare = (mm: number) => len(mm, u).replace(/ mm$|"$/, '');
  return `${bare(w)} × ${bare(l)} × ${bare(t)}${u === 'in' ? '"' : ' mm'}`;
};

/** What the revision was made to fit: device, clearance, charger pad, stock, bit, grain, notes. */
export function FitNotesView({ notes, units }: { notes: FitNotes; units: LengthUnit }) {
  const n = notes ?? {};
  const empty = !n.device && n.clearancePerSide === undefined && !n.charger && !n.stock && n.bitDiameter === undefined && !n.grain && !n.text;
  if (empty) return <Text style={theme.muted}>No fit notes were saved with this revision.</Text>;
  return (
    <View style={styles.list} testID="fit-notes">
      {n.device ? (
        <Row label="Device">
          <Text style={theme.body}>{n.device.name || 'Unnamed device'}</Text>
          <Text style={theme.mono}>
            {size3(n.device.width, n.device.length, n.device.thickness, units)} (W × L × T)
          </Text>
          <Text style={theme.muted}>{n.device.cased ? 'Measured in its case' : 'Measured bare, without a case'}</Text>
        </Row>
      ) : null}
      {n.clearancePerSide !== undefined ? <Row label="Clearance">{`${len(n.clearancePerSide, units)} per side`}</Row> : null}
      {n.charger ? (
        <Row label="Charger pad">
          <Text style={theme.body}>
            {n.charger.name || 'Unnamed pad'} · {n.charger.shape === 'round' ? 'round' : 'rectangular'}
          </Text>
          <Text style={theme.mono}>
            {n.charger.shape === 'round'
              ? `Ø ${len(n.charger.width, units)}, ${len(n.charger.thickness, units)} thick`
              : `${size3(n.charger.width, n.charger.length, n.charger.thickness, units)} (W × L × T)`}
          </Text>
          {n.charger.rangeMin !== undefined || n.charger.rangeMax !== undefined ? (
            <Text style={theme.muted}>
              Rated charging distance {n.charger.rangeMin !== undefined ? len(n.charger.rangeMin, units) : '?'} to{' '}
              {n.charger.rangeMax !== undefined ? len(n.charger.rangeMax, units) : '?'} (maker’s figure)
            </Text>
          ) : null}
        </Row>
      ) : null}
      {n.stock ? <Row label="Stock">{`${n.stock.material}, ${len(n.stock.thickness, units)} thick`}</Row> : null}
      {n.bitDiameter !== undefined ? <Row label="Bit">{`Ø ${len(n.bitDiameter, units)}`}</Row> : null}
      {n.grain ? (
        <Row label="Grain">
          <Text style={theme.body}>{GRAIN_LABEL[n.grain]}</Text>
        </Row>
      ) : null}
      {n.text ? (
        <Row label="Notes">
          <Text style={theme.body}>{n.text}</Text>
        </Row>
      ) : null}
    </View>
  );
}

/** Extents, area, cut length and contours, read from the stored geometry. */
export function GeometrySummaryView({ summary, units }: { summary: GeometrySummary; units: LengthUnit }) {
  const e = summary.extents;
  const area = units === 'in' ? `${trim(fromMm(fromMm(summary.area, 'in'), 'in'), 2)} in²` : summary.area >= 10000 ? `${trim(summary.area / 100, 1)} cm²` : `${trim(summary.area, 1)} mm²`;
  const layers = Object.entries(summary.layers ?? {}).filter(([, c]) => c > 0);
  return (
    <View style={styles.list} testID="geometry-summary">
      <Row label="Overall">{`${len(e.width, units).replace(/ mm$|"$/, '')} × ${len(e.height, units)}`}</Row>
      <Row label="Area">{area}</Row>
      <Row label="Cut length">{len(summary.perimeter, units)}</Row>
      <Row label="Contours">
        <Text style={theme.body}>
          {summary.closedContours} closed, {summary.openContours} open
        </Text>
        {summary.openContours > 0 ? <Text style={styles.warn}>Open contours cannot be cut as pockets or profiles until they are closed.</Text> : null}
      </Row>
      {layers.length ? (
        <Row label="Operations">
          {layers.map(([l, c]) => (
            <Text key={l} style={theme.body}>
              {LAYER_STYLE[l as LayerName]?.label ?? l}: {counted(c, 'path')}
            </Text>
          ))}
        </Row>
      ) : null}
    </View>
  );
}

function trim(v: number, digits: number) {
  return v.toFixed(digits).replace(/\.?0+$/, '');
}

const styles = StyleSheet.create({
  list: { gap: space.sm },
  row: { flexDirection: 'row', gap: space.md, flexWrap: 'wrap', borderBottomWidth: 1, borderBottomColor: colors.sunk, paddingBottom: space.sm },
  key: { width: 110, color: colors.inkMuted },
  value: { flex: 1, minWidth: 160, gap: 2 },
  warn: { ...theme.muted, color: colors.danger },
});
