import { useState, type ReactNode } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { ReportValue, Warning } from '../../shared/generators/types';
import type { FlagSeverity } from '../forms/ParamForm';
import type { DisplayUnits } from '../forms/useDisplayUnits';
import { colors, fonts, radius, space, theme } from '../ui';
import { formatReportValue } from './formatValue';
import { textInUnits } from '../../shared/units';

const SEVERITY_ORDER: Warning['severity'][] = ['danger', 'caution', 'info'];
// The word leads each warning so it reads without colour.
const SEVERITY_WORD: Record<Warning['severity'], string> = { danger: 'Danger', caution: 'Caution', info: 'Note' };
const SEVERITY_TONE: Record<Warning['severity'], { line: string; soft: string; ink: string }> = {
  danger: { line: colors.danger, soft: colors.dangerSoft, ink: colors.danger },
  caution: { line: colors.caution, soft: colors.cautionSoft, ink: colors.caution },
  info: { line: colors.pine, soft: colors.pineSoft, ink: colors.pineDark },
};

const RANK: Record<Warning['severity'], number> = { info: 0, caution: 1, danger: 2 };

/** The worst warning severity per param, for outlining the fields a warning concerns. */
export function flaggedFields(warnings: Warning[]): Record<string, FlagSeverity> {
  const out: Record<string, FlagSeverity> = {};
  for (const w of warnings) for (const f of w.fields) if (!out[f] || RANK[w.severity] > RANK[out[f]]) out[f] = w.severity;
  return out;
}

export interface FitReportProps {
  values: ReportValue[];
  warnings: Warning[];
  units: DisplayUnits;
  /** Param name → label, to name the fields each warning concerns. */
  fieldLabels?: Record<string, string>;
  title?: string;
  /** Shown when the form holds an unreadable value and these numbers are from the last good one. */
  stale?: boolean;
  /** Under the table: sources, actions. */
  footer?: ReactNode;
  /** Show this many values until asked for the rest (phones); warnings are always shown in full. */
  initialRows?: number;
}

/** Warnings first (worst first), then every computed value with its unit. Used by generators and calculators. */
export function FitReport({ values, warnings, units, fieldLabels, title = 'Fit report', stale = false, footer, initialRows }: FitReportProps) {
  const [showAll, setShowAll] = useState(false);
  // A row saying exactly what the one before it said (a round recess's width and length) adds nothing.
  const rows = values.filter((v, i) => !values.slice(0, i).some((u) => u.label === v.label && u.value === v.value && u.unit === v.unit));
  const sorted = [...warnings].sort((a, b) => SEVERITY_ORDER.indexOf(a.severity) - SEVERITY_ORDER.indexOf(b.severity));
  return (
    <View style={styles.box} aria-label={title}>
      <Text role="heading" style={theme.heading}>
        {title}
      </Text>
      {stale ? <Text style={styles.stale}>Showing the last valid values: fix the marked fields to update.</Text> : null}
      {sorted.length === 0 ? (
        <Text style={theme.muted} testID="no-warnings">
          No warnings for these values.
        </Text>
      ) : (
        <View style={styles.warnings} aria-label="Warnings">
          {sorted.map((w) => {
            const tone = SEVERITY_TONE[w.severity];
            const concerns = w.fields.map((f) => fieldLabels?.[f] ?? f);
            return (
              <View key={w.code} style={[styles.warning, { borderLeftColor: tone.line, backgroundColor: tone.soft }]} testID={`warning-${w.code}`}>
                <Text style={[styles.severity, { color: tone.ink }]}>{SEVERITY_WORD[w.severity]}</Text>
                <Text style={theme.body}>{textInUnits(w, units)}</Text>
                {concerns.length ? <Text style={theme.muted}>Concerns: {concerns.join(' · ')}</Text> : null}
              </View>
            );
          })}
        </View>
      )}
      <View style={styles.table} aria-label="Values">
        {(showAll || !initialRows ? rows : rows.slice(0, initialRows)).map((v, i) => (
          <View key={v.key} style={[styles.row, i % 2 === 1 && styles.rowAlt]} testID={`value-${v.key}`}>
            <Text style={[theme.body, styles.cellLabel]}>{v.label}</Text>
            <Text style={[theme.mono, styles.cellValue]}>{formatReportValue(v.value, v.unit, units)}</Text>
          </View>
        ))}
      </View>
      {initialRows && rows.length > initialRows ? (
        <Pressable accessibilityRole="button" onPress={() => setShowAll(!showAll)} style={styles.more}>
          <Text style={theme.link}>{showAll ? 'Show fewer values' : `Show all ${rows.length} values`}</Text>
        </Pressable>
      ) : null}
      {footer}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.sm },
  stale: { fontFamily: fonts.medium, fontSize: 13, color: colors.caution },
  warnings: { gap: space.sm },
  warning: { borderLeftWidth: 4, borderRadius: radius.sm, padding: space.sm, gap: 2 },
  severity: { fontFamily: fonts.bold, fontSize: 12, letterSpacing: 0.6, textTransform: 'uppercase' },
  table: { borderTopWidth: 1, borderTopColor: colors.line },
  row: { flexDirection: 'row', justifyContent: 'space-between', alignItems: 'baseline', gap: space.md, paddingVertical: 5, paddingHorizontal: space.xs, borderBottomWidth: 1, borderBottomColor: colors.line },
  rowAlt: { backgroundColor: colors.paper },
  cellLabel: { flex: 1, fontSize: 14 },
  cellValue: { fontSize: 14, textAlign: 'right' },
  more: { paddingVertical: space.xs, alignSelf: 'flex-start' },
});
