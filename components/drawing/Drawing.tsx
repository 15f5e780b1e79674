import { useState, type ReactNode } from 'react';
import { StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';
import Svg, { G, Line, Path, Polygon, Rect, Text as SvgText } from 'react-native-svg';
import { LAYER_STYLE } from '../../shared/geometry/layers';
import { LAYERS, type LayerName } from '../../shared/schemas/geometry';
import { colors, fonts, space, theme } from '../ui';
import { fitViewBox, screenBoxOf, type DrawingExtents, type ViewBox } from './fit';
import { formatDimension, formatFeatureSize, type DimensionUnits } from './format';

export type { DrawingExtents, ViewBox } from './fit';

/** One layer's path data in screen coordinates (y down, top-left at 0,0), millimetres: see modelToLayerPaths. */
export interface LayerPath {
  layer: LayerName | (string & {});
  d: string;
}

export type LayerStyle = (typeof LAYER_STYLE)[LayerName];

// A layer the palette does not know (an imported drawing's own layer name) still draws, plainly.
const UNKNOWN_LAYER: LayerStyle = { label: 'Other', stroke: colors.inkMuted, width: 1 };
const styleOf = (layer: string): LayerStyle => (LAYER_STYLE as Record<string, LayerStyle>)[layer] ?? { ...UNKNOWN_LAYER, label: humanize(layer) };

/** A named size the generator reports (a pocket, a recess), mm. */
export interface FeatureCallout {
  key: string;
  label?: string;
  width: number;
  height: number;
  depth?: number;
}

export interface DrawingOverlayContext {
  /** Screen pixels per model millimetre at the current fit. */
  pxPerMm: number;
  viewBox: ViewBox;
  /** Converts a length in screen pixels to drawing units, for strokes and text that must not scale. */
  px: (pixels: number) => number;
}

export interface DrawingProps {
  paths: LayerPath[];
  /** The drawing's overall size, mm: the geometry summary's `extents` or `previewFrame(model)`. */
  extents: DrawingExtents;
  /** Unit for the dimension callouts and feature sizes. */
  units?: DimensionUnits;
  features?: FeatureCallout[] | Record<string, { width: number; height: number; depth?: number }>;
  /**
   * Which part of the drawing to show, in screen coordinates (mm, y down). Defaults to the model's
   * extents plus room for the dimensions. Pan and zoom drive this.
   */
  viewBox?: ViewBox;
  showDimensions?: boolean;
  showLegend?: boolean;
  /** Tallest the drawing may get, in pixels; wide-and-short parts fill the width instead. */
  maxHeight?: number;
  /** Per-path style override, e.g. a faded earlier revision under a compare overlay. */
  styleFor?: (path: LayerPath, index: number) => Partial<LayerStyle> | undefined;
  /** Extra SVG drawn over the paths, in the same coordinates. */
  overlay?: (ctx: DrawingOverlayContext) => ReactNode;
  /** Extra rows at the end of the legend (e.g. what a compare overlay's colours mean). */
  legendExtra?: ReactNode;
  accessibilityLabel?: string;
  testID?: string;
}

// Room around the part, in screen pixels, for the dimension lines and their figures.
export const PAD = { top: 12, left: 12, right: 46, bottom: 44 };
export const PAD_BARE = { top: 8, left: 8, right: 8, bottom: 8 };
const DIM_COLOR = colors.inkMuted;

/** Draws a model's layer paths to fit the available width, with overall dimensions and a legend. */
export function Drawing({
  paths,
  extents,
  units = 'mm',
  features,
  viewBox: viewBoxOverride,
  showDimensions = true,
  showLegend = true,
  maxHeight = 420,
  styleFor,
  overlay,
  legendExtra,
  accessibilityLabel,
  testID,
}: DrawingProps) {
  const [width, setWidth] = useState(0);
  const onLayout = (e: LayoutChangeEvent) => {
    const w = Math.floor(e.nativeEvent.layout.width);
    if (w !== width) setWidth(w);
  };
  const box = screenBoxOf(extents);
  const widthText = formatDimension(extents.width, units);
  const heightText = formatDimension(extents.height, units);
  const label = accessibilityLabel ?? `Drawing, overall ${widthText} by ${heightText}`;
  const featureList = normalizeFeatures(features);
  const known: string[] = [...LAYERS];
  const present = [...LAYERS.filter((l) => paths.some((p) => p.layer === l)), ...new Set(paths.map((p) => p.layer).filter((l) => !known.includes(l)))];
  const empty = paths.length === 0 || !(box.width > 0) || !(box.height > 0);

  let svg: ReactNode = null;
  if (width > 0 && !empty) {
    const fit = fitViewBox(box, width, { pad: showDimensions ? PAD : PAD_BARE, maxHeight, viewBox: viewBoxOverride });
    const s = fit.pxPerMm;
    const px = (n: number) => n / s;
    const vb = fit.viewBox;
    svg = (
      <Svg width={width} height={fit.heightPx} viewBox={`${vb.x} ${vb.y} ${vb.width} ${vb.height}`} preserveAspectRatio="xMidYMid meet">
        <Rect x={vb.x} y={vb.y} width={vb.width} height={vb.height} fill={colors.surface} />
        <G>
          {paths.map((p, i) => {
            const style = { ...styleOf(p.layer), ...styleFor?.(p, i) };
            return (
              <Path
                key={i}
                d={p.d}
                stroke={style.stroke}
                strokeWidth={px(style.width)}
                strokeDasharray={style.dash ? scaleDash(style.dash, s) : undefined}
                strokeLinecap="round"
                strokeLinejoin="round"
                fill={style.fill ?? 'none'}
                fillRule="evenodd"
              />
            );
          })}
        </G>
        {showDimensions ? <OverallDimensions box={box} px={px} widthText={widthText} heightText={heightText} /> : null}
        {overlay?.({ pxPerMm: s, viewBox: vb, px })}
      </Svg>
    );
  }

  return (
    <View style={styles.wrap} testID={testID}>
      <View onLayout={onLayout} role="img" aria-label={label} style={styles.canvas}>
        {empty ? <Text style={[theme.muted, styles.empty]}>Nothing to draw yet.</Text> : svg}
      </View>
      {showLegend && (present.length > 0 || legendExtra) ? (
        <View style={styles.legend} aria-label="Layers">
          {present.map((l) => (
            <LegendRow key={l} style={styleOf(l)} />
          ))}
          {legendExtra}
        </View>
      ) : null}
      {featureList.length > 0 ? (
        <View style={styles.features} aria-label="Feature sizes">
          {featureList.map((f) => (
            <View key={f.key} style={styles.featureRow}>
              <Text style={theme.label}>{f.label ?? humanize(f.key)}</Text>
              <Text style={theme.mono}>{formatFeatureSize(f, units)}</Text>
            </View>
          ))}
        </View>
      ) : null}
    </View>
  );
}

/** Overall width below the part and height to its right, drawn outside the outline as on a shop drawing. */
function OverallDimensions({ box, px, widthText, heightText }: { box: ViewBox; px: (n: number) => number; widthText: string; heightText: string }) {
  const gap = px(4);
  const offset = px(16);
  const over = px(4);
  const stroke = px(0.8);
  const fontSize = px(12);
  const left = box.x;
  const right = box.x + box.width;
  const top = box.y;
  const bottom = box.y + box.height;
  const dimY = bottom + offset;
  const dimX = right + offset;
  return (
    <G>
      {/* width: extension lines down from the part, dimension line between them */}
      <Line x1={left} y1={bottom + gap} x2={left} y2={dimY + over} stroke={DIM_COLOR} strokeWidth={stroke} />
      <Line x1={right} y1={bottom + gap} x2={right} y2={dimY + over} stroke={DIM_COLOR} strokeWidth={stroke} />
      <Line x1={left} y1={dimY} x2={right} y2={dimY} stroke={DIM_COLOR} strokeWidth={stroke} />
      <Arrow x={left} y={dimY} dir="left" px={px} />
      <Arrow x={right} y={dimY} dir="right" px={px} />
      <SvgText x={(left + right) / 2} y={dimY + px(16)} fontSize={fontSize} fontFamily={fonts.mono} fill={colors.ink} textAnchor="middle">
        {widthText}
      </SvgText>
      {/* height: extension lines right of the part */}
      <Line x1={right + gap} y1={top} x2={dimX + over} y2={top} stroke={DIM_COLOR} strokeWidth={stroke} />
      <Line x1={right + gap} y1={bottom} x2={dimX + over} y2={bottom} stroke={DIM_COLOR} strokeWidth={stroke} />
      <Line x1={dimX} y1={top} x2={dimX} y2={bottom} stroke={DIM_COLOR} strokeWidth={stroke} />
      <Arrow x={dimX} y={top} dir="up" px={px} />
      <Arrow x={dimX} y={bottom} dir="down" px={px} />
      <SvgText
        x={dimX + px(14)}
        y={(top + bottom) / 2}
        fontSize={fontSize}
        fontFamily={fonts.mono}
        fill={colors.ink}
        textAnchor="middle"
        transform={`rotate(90 ${dimX + px(14)} ${(top + bottom) / 2})`}
      >
        {heightText}
      </SvgText>
    </G>
  );
}

/** A filled arrowhead whose tip sits on (x, y), sized in screen pixels. */
function Arrow({ x, y, dir, px }: { x: number; y: number; dir: 'left' | 'right' | 'up' | 'down'; px: (n: number) => number }) {
  const len = px(7);
  const half = px(2.5);
  const pts =
    dir === 'left'
      ? [[x, y], [x + len, y - half], [x + len, y + half]]
      : dir === 'right'
        ? [[x, y], [x - len, y - half], [x - len, y + half]]
        : dir === 'up'
          ? [[x, y], [x - half, y + len], [x + half, y + len]]
          : [[x, y], [x - half, y - len], [x + half, y - len]];
  return <Polygon points={pts.map((p) => p.join(',')).join(' ')} fill={DIM_COLOR} />;
}

/** A short sample of the layer's line beside its name, drawn at screen scale so it matches the drawing. */
function LegendRow({ style }: { style: LayerStyle }) {
  return (
    <View style={styles.legendRow}>
      <Svg width={32} height={14} viewBox="0 0 32 14">
        {style.fill ? <Rect x={1} y={2} width={30} height={10} fill={style.fill} /> : null}
        <Line x1={1} y1={7} x2={31} y2={7} stroke={style.stroke} strokeWidth={Math.max(style.width, 1)} strokeDasharray={style.dash} />
      </Svg>
      <Text style={theme.muted}>{style.label}</Text>
    </View>
  );
}

function scaleDash(dash: string, pxPerMm: number): string {
  return dash
    .trim()
    .split(/[\s,]+/)
    .map((n) => String(Number(n) / pxPerMm))
    .join(' ');
}

function normalizeFeatures(features: DrawingProps['features']): FeatureCallout[] {
  if (!features) return [];
  if (Array.isArray(features)) return features;
  return Object.entries(features).map(([key, f]) => ({ key, ...f }));
}

/** "phonePocket" or "phone_pocket" → "Phone pocket"; "lapA" → "Lap A". */
export function humanize(key: string): string {
  const words = key
    .replace(/([a-z0-9])([A-Z])/g, '$1 $2')
    .replace(/[_\-.]+/g, ' ')
    .trim()
    .split(/\s+/)
    // A lone capital is a name (piece A, side B); keep it.
    .map((w, i) => (i > 0 && /^[A-Z]$/.test(w) ? w : w.toLowerCase()));
  const text = words.join(' ');
  return text.charAt(0).toUpperCase() + text.slice(1);
}

const styles = StyleSheet.create({
  wrap: { gap: space.sm },
  canvas: { width: '100%', backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderRadius: 4, overflow: 'hidden', minHeight: 120 },
  empty: { padding: space.lg, textAlign: 'center' },
  legend: { flexDirection: 'row', flexWrap: 'wrap', columnGap: space.lg, rowGap: space.xs },
  legendRow: { flexDirection: 'row', alignItems: 'center', gap: space.xs },
  features: { gap: 2 },
  featureRow: { flexDirection: 'row', justifyContent: 'space-between', gap: space.md, flexWrap: 'wrap' },
});
