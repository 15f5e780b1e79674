import { Text, View } from 'react-native';
import Svg, { Circle, G, Line, Path, Rect, Text as SvgText } from 'react-native-svg';
import type { CutResult } from '../../shared/fit/clearance';
import { formatLength, type LengthUnit } from '../../shared/units';
import { colors, fonts, theme } from '../ui';

const ROWS: CutResult['result'][] = ['loose', 'good', 'tight'];
// Our own marks per result, told apart by shape as well as colour: hollow ring, filled disc, cross.
const MARK = { tight: colors.danger, good: colors.pine, loose: colors.copper } as const;

/** Clearance per side (x) against how each cut fitted (three rows), with the suggestion as a line. */
export function FitPlot({ cuts, suggestion, units, width = 320 }: { cuts: CutResult[]; suggestion: number | null; units: LengthUnit; width?: number }) {
  const left = 52;
  const right = 16;
  const rowH = 26;
  const top = 14;
  const height = top + rowH * 3 + 34;
  const xs = [...cuts.map((c) => c.clearanceMm), ...(suggestion !== null ? [suggestion] : [])];
  if (xs.length === 0) return <Text style={theme.muted}>No cuts with a clearance recorded yet.</Text>;
  let lo = Math.min(...xs);
  let hi = Math.max(...xs);
  if (hi - lo < 0.2) {
    lo -= 0.1;
    hi += 0.1;
  }
  const padX = (hi - lo) * 0.08;
  lo = Math.max(0, lo - padX);
  hi += padX;
  const x = (v: number) => left + ((v - lo) / (hi - lo)) * (width - left - right);
  const y = (r: CutResult['result']) => top + rowH * ROWS.indexOf(r) + rowH / 2;
  const fmt = (mm: number) => formatLength(mm, units, { digits: units === 'in' ? 3 : 2 });
  const seen = new Map<string, number>();
  return (
    <View aria-label={`Fit history plot: ${cuts.length} cuts${suggestion !== null ? `, suggestion ${fmt(suggestion)}` : ''}`} role="img">
      <Svg width={width} height={height}>
        <Rect x={0} y={0} width={width} height={height} fill={colors.surface} />
        {ROWS.map((r) => (
          <G key={r}>
            <Line x1={left} x2={width - right} y1={y(r)} y2={y(r)} stroke={colors.line} strokeWidth={1} />
            <SvgText x={left - 6} y={y(r) + 4} fontSize={12} fontFamily={fonts.regular} fill={colors.ink} textAnchor="end">
              {r}
            </SvgText>
          </G>
        ))}
        <Line x1={left} x2={width - right} y1={top + rowH * 3 + 4} y2={top + rowH * 3 + 4} stroke={colors.inkMuted} strokeWidth={1} />
        <SvgText x={left} y={height - 14} fontSize={11} fontFamily={fonts.mono} fill={colors.inkMuted} textAnchor="start">
          {fmt(lo)}
        </SvgText>
        <SvgText x={width - right} y={height - 14} fontSize={11} fontFamily={fonts.mono} fill={colors.inkMuted} textAnchor="end">
          {fmt(hi)}
        </SvgText>
        <SvgText x={(left + width - right) / 2} y={height - 2} fontSize={11} fontFamily={fonts.regular} fill={colors.inkMuted} textAnchor="middle">
          clearance per side
        </SvgText>
        {suggestion !== null ? (
          <G>
            <Line x1={x(suggestion)} x2={x(suggestion)} y1={top - 6} y2={top + rowH * 3 + 4} stroke={colors.ink} strokeWidth={1.5} strokeDasharray="5 3" />
            <SvgText x={x(suggestion)} y={top - 2} fontSize={10} fontFamily={fonts.medium} fill={colors.ink} textAnchor={x(suggestion) > width - 70 ? 'end' : 'start'} dx={x(suggestion) > width - 70 ? -4 : 4}>
              next
            </SvgText>
          </G>
        ) : null}
        {cuts.map((c, i) => {
          // Stack repeats at the same spot a little apart so each cut is visible.
          const k = `${c.result}|${c.clearanceMm.toFixed(3)}`;
          const n = seen.get(k) ?? 0;
          seen.set(k, n + 1);
          const cx = x(c.clearanceMm);
          const cy = y(c.result) + (n % 2 ? 1 : -1) * Math.ceil(n / 2) * 5;
          if (c.result === 'tight') return <Path key={i} d={`M${cx - 4} ${cy - 4}L${cx + 4} ${cy + 4}M${cx - 4} ${cy + 4}L${cx + 4} ${cy - 4}`} stroke={MARK.tight} strokeWidth={2} />;
          if (c.result === 'good') return <Circle key={i} cx={cx} cy={cy} r={4.5} fill={MARK.good} />;
          return <Circle key={i} cx={cx} cy={cy} r={4} fill="none" stroke={MARK.loose} strokeWidth={2} />;
        })}
      </Svg>
    </View>
  );
}
