import { Link } from 'expo-router';
import { useEffect, useMemo, useRef, useState } from 'react';
import { ActivityIndicator, Pressable, ScrollView, StyleSheet, Text, View, useWindowDimensions, type ViewStyle } from 'react-native';
import { modelToLayerPaths, previewFrame } from '../../shared/geometry/paths';
import { runGenerator } from '../../shared/generators';
import type { GeneratorDef, GeneratorResult } from '../../shared/generators/types';
import { fitNotesDeviceName } from '../../shared/generators/catalogDevice';
import { fitNotesFromParams } from '../../shared/generators/fitNotes';
import { defaultParams, type FieldText, type ParamValues } from '../../shared/params';
import { textInUnits } from '../../shared/units';
import { SafetyNotes } from '../SafetyNotes';
import { ApiError } from '../api/client';
import { Drawing } from '../drawing/Drawing';
import { SuggestedClearance } from '../cuts/SuggestedClearance';
import { ParamForm, type ParamFormHandle } from '../forms/ParamForm';
import { Segmented } from '../forms/Segmented';
import { UnitsToggle } from '../forms/UnitsToggle';
import { useDisplayUnits } from '../forms/useDisplayUnits';
import { colors, fonts, radius, space, theme, useBreakpoint } from '../ui';
import { FitReport, flaggedFields } from './FitReport';
import { cautionsForGenerator } from './cautions';
import { DevicePicker, useDeviceChoice } from './DeviceFill';

const FACE_OPTIONS: { value: 'top' | 'underside'; label: string }[] = [
  { value: 'top', label: 'Top' },
  { value: 'underside', label: 'Underside' },
];

/** Typing pauses this long before the preview is recomputed. */
export const PREVIEW_DEBOUNCE_MS = 250;

export interface GeneratorWorkbenchProps {
  generator: GeneratorDef;
  /** Values to start from (mm), e.g. a saved revision's params; missing ones take the defaults. */
  initialParams?: Partial<ParamValues>;
  /** Show only these params, e.g. `generator.deviceParams` to regenerate a revision for another device. */
  onlyFields?: string[];
  /**
   * SLOT for "Save as new revision" (wired by the library screens). When given, a button under the
   * report calls it with the last valid params and their result; throw an ApiError to show its
   * message, and its `fields` inline in the form. Without it no save button is shown.
   */
  onSave?: (params: ParamValues, result: GeneratorResult, context: WorkbenchSaveContext) => void | Promise<void>;
  saveLabel?: string;
  /**
   * The catalog device the starting values were made for (a saved revision's fit notes name); with a
   * signed-in shop it starts out chosen in "Fill from a saved device" when the catalog has it.
   */
  initialDevice?: string;
}

/** What the workbench knows beside the params when saving. */
export interface WorkbenchSaveContext {
  /** The device chosen from the shop's catalog, as fit notes should name it ("… (edited)" once typed over). */
  deviceName?: string;
}

type Preview =
  | { ok: true; params: ParamValues; result: GeneratorResult }
  | { ok: false; fields: Record<string, string>; message: string; fieldTexts?: Record<string, FieldText> };

function preview(id: string, values: Partial<ParamValues>): Preview {
  try {
    const r = runGenerator(id, values);
    return r.ok ? { ok: true, params: r.params, result: r.result } : { ok: false, fields: r.fields, message: r.message, fieldTexts: r.fieldTexts };
  } catch (e) {
    // A generator that throws is a bug, but the form must stay usable and say so.
    return { ok: false, fields: {}, message: `These values could not be drawn: ${(e as Error).message}` };
  }
}

/**
 * A generator's form beside its live drawing and fit report. The preview is computed here, with the
 * same shared generator code the server runs, so typing never waits on the network.
 */
export function GeneratorWorkbench({ generator, initialParams, onlyFields, onSave, saveLabel = 'Save as new revision', initialDevice }: GeneratorWorkbenchProps) {
  const { isWide, isDesktop } = useBreakpoint();
  const { height: windowHeight } = useWindowDimensions();
  // On wide screens the preview column is one screen tall and stays put while the form scrolls.
  const columnHeight = Math.max(480, windowHeight - FRAME_BAR_HEIGHT - 2 * STICKY_GAP);
  const [units, setUnits] = useDisplayUnits();
  const startValues = useMemo(() => ({ ...defaultParams(generator.params), ...initialParams }), [generator, initialParams]);
  const [current, setCurrent] = useState<Preview>(() => preview(generator.id, startValues));
  const [lastGood, setLastGood] = useState<Extract<Preview, { ok: true }> | null>(() => (current.ok ? current : null));
  const [formValid, setFormValid] = useState(true);
  const [saveState, setSaveState] = useState<{ busy: boolean; error?: string; fields?: Record<string, string>; savedAt?: number }>({ busy: false });
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  useEffect(() => () => clearTimeout(timer.current), []);
  const formHandle = useRef<ParamFormHandle | null>(null);
  const device = useDeviceChoice(generator, formHandle, startValues, initialDevice);

  const onValues = (values: ParamValues) => {
    clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      const next = preview(generator.id, values);
      setCurrent(next);
      if (next.ok) setLastGood(next);
      setSaveState((s) => (s.busy ? s : { busy: false }));
    }, PREVIEW_DEBOUNCE_MS);
  };

  const shown = lastGood;
  // Underside work is also given mirrored, as it is cut after turning the part over.
  const [face, setFace] = useState<'top' | 'underside'>('top');
  const viewModel = shown ? (face === 'underside' && shown.result.underside ? shown.result.underside : shown.result.model) : null;
  const paths = useMemo(() => (viewModel ? modelToLayerPaths(viewModel) : []), [viewModel]);
  const frame = useMemo(() => (viewModel ? previewFrame(viewModel) : { width: 0, height: 0 }), [viewModel]);
  const flagged = useMemo(() => flaggedFields(shown && current.ok ? shown.result.report.warnings : []), [shown, current]);
  const fieldLabels = useMemo(() => Object.fromEntries(generator.params.map((d) => [d.name, d.label])), [generator]);
  const stale = !formValid || !current.ok;
  // Check messages with lengths in them follow the units toggle, as the range messages do.
  const checkErrors = useMemo(() => (current.ok ? {} : Object.fromEntries(Object.entries(current.fields).map(([k, m]) => [k, textInUnits(current.fieldTexts?.[k] ?? { message: m }, units)]))), [current, units]);
  const externalErrors = useMemo(() => ({ ...checkErrors, ...saveState.fields }), [checkErrors, saveState.fields]);

  const save = async () => {
    if (!onSave || !current.ok || stale) return;
    setSaveState({ busy: true });
    try {
      await onSave(current.params, current.result, { deviceName: device.chosen ? fitNotesDeviceName(device.chosen) : undefined });
      setSaveState({ busy: false, savedAt: Date.now() });
    } catch (e) {
      const fields = e instanceof ApiError ? e.fields : undefined;
      setSaveState({ busy: false, error: (e as Error).message || 'Saving failed', fields });
    }
  };

  const drawing = (
    <View style={theme.card}>
      <View style={styles.cardHead}>
        <Text role="heading" style={theme.heading}>
          Preview
        </Text>
        {shown?.result.underside ? (
          <Segmented label="Face shown" options={FACE_OPTIONS} value={face} onChange={setFace} />
        ) : (
          <Text style={theme.muted}>as seen from the top</Text>
        )}
      </View>
      {face === 'underside' && shown?.result.underside ? (
        <Text style={theme.muted}>Underside, mirrored: as it lies on the machine after turning the part over about its long axis on the alignment marks.</Text>
      ) : null}
      {!current.ok ? (
        <Text style={styles.problem} testID="preview-problem">
          {current.message}
        </Text>
      ) : null}
      {shown ? (
        <Drawing
          testID="generator-drawing"
          paths={paths}
          extents={frame}
          units={units}
          features={face === 'top' ? shown.result.summary.features : undefined}
          maxHeight={isDesktop ? columnHeight - 240 : isWide ? Math.round(columnHeight * 0.42) : 340}
          accessibilityLabel={`Preview of ${generator.title}, overall ${frameText(frame, units)}`}
        />
      ) : (
        <Text style={theme.muted}>Nothing drawn yet: fix the marked fields.</Text>
      )}
    </View>
  );

  const report = (
    <View style={theme.card}>
      {shown ? (
        <FitReport
          values={shown.result.report.values}
          warnings={shown.result.report.warnings}
          units={units}
          fieldLabels={fieldLabels}
          stale={stale}
          initialRows={isWide ? undefined : 8}
          footer={
            onSave ? (
              <View style={styles.saveRow}>
                <Pressable
                  accessibilityRole="button"
                  aria-label={saveLabel}
                  disabled={stale || saveState.busy}
                  onPress={save}
                  style={[styles.saveButton, (stale || saveState.busy) && styles.saveDisabled]}
                >
                  {saveState.busy ? <ActivityIndicator color={colors.paper} /> : <Text style={styles.saveText}>{saveLabel}</Text>}
                </Pressable>
                {stale ? <Text style={theme.muted}>Fix the marked fields before saving.</Text> : null}
                {saveState.error ? <Text style={styles.problem}>{saveState.error}</Text> : null}
                {saveState.savedAt ? <Text style={[theme.muted, { color: colors.ok }]}>Saved.</Text> : null}
              </View>
            ) : null
          }
        />
      ) : null}
    </View>
  );

  // "Fill from a saved device" sits above the first device field shown; the fit history's
  // suggestion beside the clearance it is for, or in the picker when that field is not shown.
  const shownField = (name: string | undefined) => !!name && generator.params.some((d) => d.name === name) && (!onlyFields || onlyFields.includes(name));
  const firstDeviceField = (generator.deviceParams ?? []).find((k) => shownField(k));
  const clearanceParam = shownField(generator.suggestedClearanceParam) ? generator.suggestedClearanceParam : undefined;
  const material = shown ? fitNotesFromParams(generator.id, shown.params).stock?.material : undefined;
  const clearanceNow = current.ok && clearanceParam && typeof current.params[clearanceParam] === 'number' ? (current.params[clearanceParam] as number) : undefined;
  const suggestion = device.chosen ? (
    <SuggestedClearance
      shopId={device.shopId}
      device={device.chosen.name}
      material={material}
      units={units}
      sayWhenNone
      testID="workbench-suggested-clearance"
      currentMm={clearanceNow}
      onUse={clearanceParam ? (mm) => formHandle.current?.setValues({ [clearanceParam]: mm }) : undefined}
    />
  ) : null;
  const picker = firstDeviceField && device.available ? <DevicePicker choice={device} units={units}>{clearanceParam ? null : suggestion}</DevicePicker> : null;
  const beforeField = picker && firstDeviceField ? { [firstDeviceField]: picker } : undefined;
  // Indented like the fields (their flag border and padding), so it reads as the clearance field's note.
  const afterField = suggestion && clearanceParam ? { [clearanceParam]: <View style={styles.fieldNote}>{suggestion}</View> } : undefined;

  const form = (
    <View style={theme.card}>
      <View style={styles.cardHead}>
        <Text role="heading" style={theme.heading}>
          Parameters
        </Text>
      </View>
      {onlyFields ? <Text style={theme.muted}>Only these fields change; every other value is kept as it was.</Text> : null}
      <ParamForm
        key={generator.id}
        decls={generator.params}
        initialValues={startValues}
        units={units}
        onChange={onValues}
        onValidityChange={setFormValid}
        externalErrors={externalErrors}
        flagged={flagged}
        onlyFields={onlyFields}
        collapsible
        openSections={isWide ? 'all' : 'first'}
        handle={formHandle}
        onFieldEdit={device.onFieldEdit}
        beforeField={beforeField}
        afterField={afterField}
      />
    </View>
  );

  const cautions = (
    <View style={{ gap: space.xs }}>
      <SafetyNotes only={cautionsForGenerator(generator.id)} compact />
      <Link href="/help/safety" style={[theme.link, styles.small]}>
        All shop safety notes
      </Link>
    </View>
  );

  const toolbar = <UnitsToggle units={units} onChange={setUnits} />;

  if (!isWide) {
    // Phone: what the values make comes first, then the values themselves.
    return (
      <View style={styles.stack}>
        {toolbar}
        {drawing}
        {report}
        {form}
        {cautions}
      </View>
    );
  }
  const reportAndCautions = (
    <>
      {report}
      {cautions}
    </>
  );
  return (
    <View style={styles.columns}>
      <View style={styles.formColumn}>
        {toolbar}
        {form}
      </View>
      <View style={[styles.previewColumn, STICKY, { height: columnHeight }]}>
        {isDesktop ? (
          <View style={styles.previewRow}>
            <ScrollView style={styles.drawingCell} contentContainerStyle={styles.cellContent}>
              {drawing}
            </ScrollView>
            <ScrollView style={styles.reportCell} contentContainerStyle={styles.cellContent} aria-label="Fit report and cautions">
              {reportAndCautions}
            </ScrollView>
          </View>
        ) : (
          <>
            {drawing}
            <ScrollView style={styles.fill} contentContainerStyle={styles.cellContent}>
              {reportAndCautions}
            </ScrollView>
          </>
        )}
      </View>
    </View>
  );
}

function frameText(f: { width: number; height: number }, units: 'mm' | 'in') {
  const k = units === 'in' ? 25.4 : 1;
  const u = units === 'in' ? ' in' : ' mm';
  return `${+(f.width / k).toFixed(units === 'in' ? 3 : 1)} by ${+(f.height / k).toFixed(units === 'in' ? 3 : 1)}${u}`;
}

// The app frame's brand bar on wide screens sits above the scrolling content; the preview column
// is sized to what is left. Slightly off only leaves a little slack; nothing is cut off, as both
// cells scroll.
const FRAME_BAR_HEIGHT = 56;
const STICKY_GAP = space.sm;
// react-native-web passes `position: sticky` through; the native style types do not list it.
const STICKY = { position: 'sticky', top: STICKY_GAP } as unknown as ViewStyle;

const styles = StyleSheet.create({
  stack: { gap: space.lg },
  columns: { flexDirection: 'row', alignItems: 'flex-start', gap: space.lg },
  formColumn: { width: 380, flexShrink: 0, gap: space.md },
  previewColumn: { flex: 1, minWidth: 0, gap: space.lg, alignSelf: 'flex-start' },
  previewRow: { flex: 1, flexDirection: 'row', gap: space.lg },
  // Explicit grow and basis: a ScrollView's own defaults override a plain `flex` ratio on web.
  drawingCell: { flexGrow: 5, flexShrink: 1, flexBasis: 0, minWidth: 0 },
  reportCell: { flexGrow: 4, flexShrink: 1, flexBasis: 0, minWidth: 0 },
  fill: { flex: 1 },
  cellContent: { gap: space.lg },
  cardHead: { flexDirection: 'row', alignItems: 'baseline', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm },
  problem: { fontFamily: fonts.medium, fontSize: 14, lineHeight: 20, color: colors.danger },
  saveRow: { gap: space.xs, marginTop: space.sm },
  saveButton: { backgroundColor: colors.pine, borderRadius: radius.sm, paddingVertical: 10, paddingHorizontal: space.lg, alignSelf: 'flex-start', minHeight: 40, justifyContent: 'center' },
  saveDisabled: { opacity: 0.5 },
  saveText: { fontFamily: fonts.bold, fontSize: 15, color: colors.paper },
  small: { fontSize: 13 },
  fieldNote: { paddingLeft: 3 + space.sm },
});
