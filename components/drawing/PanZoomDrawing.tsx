// The Drawing with pan and zoom: wheel zooms about the pointer, a drag pans, two fingers pinch
// and pan, and the keyboard works once the drawing has focus (+ / − zoom, arrows pan, 0 resets).
// Plain DOM pointer events: the app is web only.
import { useCallback, useEffect, useRef, useState } from 'react';
import { Pressable, StyleSheet, Text, View, type LayoutChangeEvent } from 'react-native';
import { colors, radius, space, theme } from '../ui';
import { Drawing, PAD, PAD_BARE, type DrawingProps } from './Drawing';
import { fitViewBox, screenBoxOf, type ViewBox } from './fit';
import { panBy, zoomAbout, zoomOf } from './panzoom';

const KEY_STEP_PX = 40;
const KEY_ZOOM = 1.25;

export function PanZoomDrawing(props: Omit<DrawingProps, 'viewBox'> & { label?: string }) {
  const { extents, maxHeight = 420, showDimensions = true } = props;
  const [width, setWidth] = useState(0);
  const [view, setView] = useState<ViewBox | null>(null);
  const [focused, setFocused] = useState(false);
  const host = useRef<View>(null);
  const home = width > 0 ? fitViewBox(screenBoxOf(extents), width, { pad: showDimensions ? PAD : PAD_BARE, maxHeight }).viewBox : null;
  const state = useRef({ view, home, width });
  state.current = { view, home, width };

  // A different drawing (or size) starts from the fitted view again.
  useEffect(() => setView(null), [extents.width, extents.height]);

  const onLayout = (e: LayoutChangeEvent) => {
    const w = Math.floor(e.nativeEvent.layout.width);
    if (w !== width) {
      setWidth(w);
      setView(null);
    }
  };

  const apply = useCallback((f: (vb: ViewBox, home: ViewBox) => ViewBox) => {
    const { view: v, home: h } = state.current;
    if (!h) return;
    setView(f(v ?? h, h));
  }, []);

  useEffect(() => {
    const el = host.current as unknown as HTMLElement | null;
    if (!el || typeof el.addEventListener !== 'function') return;
    el.tabIndex = 0;
    const canvas = () => el.querySelector('svg') as SVGSVGElement | null;
    const inCanvas = (t: EventTarget | null) => {
      const c = canvas();
      return !!c && t instanceof Node && c.contains(t);
    };
    const frac = (clientX: number, clientY: number) => {
      const r = canvas()!.getBoundingClientRect();
      return { fx: (clientX - r.left) / r.width, fy: (clientY - r.top) / r.height, w: r.width };
    };
    const onWheel = (e: WheelEvent) => {
      if (!inCanvas(e.target)) return;
      e.preventDefault();
      const { fx, fy } = frac(e.clientX, e.clientY);
      const factor = Math.exp(-e.deltaY * (e.deltaMode === 1 ? 0.05 : 0.0015));
      apply((vb, h) => zoomAbout(vb, h, factor, fx, fy));
    };
    const pointers = new Map<number, { x: number; y: number }>();
    const onDown = (e: PointerEvent) => {
      if (!inCanvas(e.target)) return;
      pointers.set(e.pointerId, { x: e.clientX, y: e.clientY });
      el.setPointerCapture?.(e.pointerId);
      el.focus({ preventScroll: true });
    };
    const onMove = (e: PointerEvent) => {
      const prev = pointers.get(e.pointerId);
      if (!prev) return;
      e.preventDefault();
      if (pointers.size === 1) {
        const { w } = frac(e.clientX, e.clientY);
        const dx = e.clientX - prev.x;
        const dy = e.clientY - prev.y;
        pointers.set(e.pointerId, { x: e.clientX, y: e.clientY });
        apply((vb) => panBy(vb, dx, dy, w));
        return;
      }
      // Two fingers: zoom by the change in their spread, about their midpoint, and pan with it.
      const others = [...pointers.entries()].filter(([id]) => id !== e.pointerId).map(([, p]) => p);
      const o = others[0];
      const before = Math.hypot(prev.x - o.x, prev.y - o.y);
      const after = Math.hypot(e.clientX - o.x, e.clientY - o.y);
      pointers.set(e.pointerId, { x: e.clientX, y: e.clientY });
      if (before < 1) return;
      const mid = frac((e.clientX + o.x) / 2, (e.clientY + o.y) / 2);
      const dx = (e.clientX - prev.x) / 2;
      const dy = (e.clientY - prev.y) / 2;
      apply((vb, h) => panBy(zoomAbout(vb, h, after / before, mid.fx, mid.fy), dx, dy, mid.w));
    };
    const onUp = (e: PointerEvent) => {
      pointers.delete(e.pointerId);
    };
    const onKey = (e: KeyboardEvent) => {
      const w = state.current.width || 1;
      const moves: Record<string, [number, number]> = { ArrowLeft: [KEY_STEP_PX, 0], ArrowRight: [-KEY_STEP_PX, 0], ArrowUp: [0, KEY_STEP_PX], ArrowDown: [0, -KEY_STEP_PX] };
      if (e.key === '+' || e.key === '=') apply((vb, h) => zoomAbout(vb, h, KEY_ZOOM));
      else if (e.key === '-' || e.key === '_' || e.key === '−') apply((vb, h) => zoomAbout(vb, h, 1 / KEY_ZOOM));
      else if (e.key === '0') setView(null);
      else if (moves[e.key]) apply((vb) => panBy(vb, moves[e.key][0], moves[e.key][1], w));
      else return;
      e.preventDefault();
    };
    const onFocus = () => setFocused(true);
    const onBlur = () => setFocused(false);
    const listeners: [string, EventListener, AddEventListenerOptions?][] = [
      ['wheel', onWheel as EventListener, { passive: false }],
      ['pointerdown', onDown as EventListener],
      ['pointermove', onMove as EventListener],
      ['pointerup', onUp as EventListener],
      ['pointercancel', onUp as EventListener],
      ['keydown', onKey as EventListener],
      ['focus', onFocus],
      ['blur', onBlur],
    ];
    for (const [type, fn, opts] of listeners) el.addEventListener(type, fn, opts);
    const svg = canvas();
    if (svg) svg.style.touchAction = 'none';
    return () => {
      for (const [type, fn] of listeners) el.removeEventListener(type, fn);
    };
  }, [apply, width]);

  const zoom = view && home ? zoomOf(view, home) : 1;
  return (
    <View style={{ gap: space.xs }}>
      <View style={[theme.row, { flexWrap: 'wrap', justifyContent: 'space-between' }]}>
        <Text style={theme.muted}>Wheel or pinch to zoom, drag to move; with the drawing selected: + − arrows, 0 to fit.</Text>
        <View style={theme.row}>
          <ZoomButton label="−" a11y="Zoom out" onPress={() => apply((vb, h) => zoomAbout(vb, h, 1 / KEY_ZOOM))} testID="zoom-out" />
          <Text style={[theme.mono, { minWidth: 48, textAlign: 'center' }]} testID="zoom-level" aria-live="polite">
            {Math.round(zoom * 100)}%
          </Text>
          <ZoomButton label="+" a11y="Zoom in" onPress={() => apply((vb, h) => zoomAbout(vb, h, KEY_ZOOM))} testID="zoom-in" />
          <ZoomButton label="Fit" a11y="Fit the drawing" onPress={() => setView(null)} testID="zoom-fit" />
        </View>
      </View>
      <View
        ref={host}
        onLayout={onLayout}
        style={[styles.host, focused && styles.focused]}
        aria-label={`${props.label ?? 'Drawing'}: pan and zoom`}
        testID={props.testID ? `${props.testID}-pan` : undefined}
      >
        <Drawing {...props} viewBox={view ?? undefined} />
      </View>
    </View>
  );
}

function ZoomButton({ label, a11y, onPress, testID }: { label: string; a11y: string; onPress: () => void; testID: string }) {
  return (
    <Pressable onPress={onPress} accessibilityRole="button" aria-label={a11y} style={styles.zoomButton} testID={testID}>
      <Text style={theme.label}>{label}</Text>
    </Pressable>
  );
}

const styles = StyleSheet.create({
  host: { borderRadius: radius.sm, borderWidth: 2, borderColor: 'transparent', outlineStyle: 'none' } as object,
  focused: { borderColor: colors.pine },
  zoomButton: { minWidth: 36, minHeight: 32, paddingHorizontal: space.sm, borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.surface },
});
