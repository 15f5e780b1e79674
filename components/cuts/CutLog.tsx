// The cut log on a revision page: what was cut, a form to record a cut, and the shop's fit
// history for this device and material with the clearance to try next.
import { zodResolver } from '@hookform/resolvers/zod';
import { useRef, useState } from 'react';
import { Controller, useForm, type FieldError as RhfFieldError } from 'react-hook-form';
import { Image, Pressable, StyleSheet, Text, View } from 'react-native';
import type { z } from 'zod';
import { CUT_RESULTS, CutLogInput } from '../../shared/schemas/cuts';
import type { RevisionInfo } from '../../shared/schemas/library';
import { formatLength, type LengthUnit } from '../../shared/units';
import { cutPhotoUrl, useCuts, useFitHistory, useLogCut } from '../api/cuts';
import { Segmented } from '../forms/Segmented';
import { Button, FieldError, Notice, TextField } from '../library/controls';
import { colors, radius, space, theme, useBreakpoint } from '../ui';
import { FitPlot } from './FitPlot';
import { LengthBox } from '../library/LengthBox';

/** The device a revision fits, as the server keys the fit history: its name, else W×L×T mm. */
export function deviceKeyOf(fitNotes: RevisionInfo['fitNotes'] | null | undefined): string | null {
  const d = fitNotes?.device;
  if (!d) return null;
  return d.name?.trim() || `${d.width}×${d.length}×${d.thickness} mm`;
}

const today = () => new Date().toISOString().slice(0, 10);
const RESULT_TEXT = { tight: 'Tight', good: 'Good fit', loose: 'Loose' } as const;

type FormIn = z.input<typeof CutLogInput>;
type FormOut = z.output<typeof CutLogInput>;

/** Zod's stock messages for numbers read like code; say it in shop words instead. */
function say(err: RhfFieldError | undefined, what: string, max: number): string | undefined {
  if (!err) return undefined;
  const m = err.message ?? '';
  if (/expected number|NaN/i.test(m)) return `${what} must be a length, like 0.5`;
  if (/too big|<=/i.test(m)) return `${what} must be at most ${max} mm`;
  if (/too small|>=|>0|> 0/i.test(m)) return `${what} must be more than 0 mm`;
  return m;
}

export function CutLog({ revision, shopId, canRecord, units, defaultMaterial }: { revision: RevisionInfo; shopId: string; canRecord: boolean; units: LengthUnit; defaultMaterial?: string }) {
  const cuts = useCuts(revision.id);
  const device = deviceKeyOf(revision.fitNotes);
  const [material, setMaterial] = useState(defaultMaterial ?? revision.fitNotes.stock?.material ?? '');
  const fmt = (mm: number | undefined) => (mm === undefined ? '—' : formatLength(mm, units, { digits: units === 'in' ? 3 : 2 }));
  return (
    <View style={{ gap: space.lg }} testID="cut-log">
      <FitHistoryPanel shopId={shopId} device={device} material={material} units={units} />
      {cuts.isLoading ? <Text style={theme.muted}>Reading the cut log…</Text> : null}
      {cuts.isError ? <Notice title="The cut log could not be loaded">{cuts.error.message}</Notice> : null}
      {cuts.data && cuts.data.length === 0 ? <Text style={theme.muted}>No cuts recorded for this revision yet.</Text> : null}
      {cuts.data && cuts.data.length > 0 ? (
        <View style={{ gap: space.sm }} aria-label="Cuts of this revision" testID="cut-list">
          {cuts.data.map((c) => (
            <View key={c.id} style={styles.cut}>
              <View style={[theme.row, { flexWrap: 'wrap', justifyContent: 'space-between' }]}>
                <Text style={theme.label}>
                  {c.cutOn} · {c.material}
                </Text>
                <Text style={[styles.result, styles[c.result]]}>{RESULT_TEXT[c.result]}</Text>
              </View>
              <Text style={theme.muted}>
                Bit {fmt(c.bitMm)} · clearance {fmt(c.clearanceMm)} per side
                {c.measuredWidthMm !== undefined || c.measuredLengthMm !== undefined ? ` · pocket measured ${fmt(c.measuredWidthMm)} × ${fmt(c.measuredLengthMm)}` : ''}
                {c.author ? ` · ${c.author}` : ''}
              </Text>
              {c.machineNote ? <Text style={theme.body}>{c.machineNote}</Text> : null}
              {c.hasPhoto ? <Image source={{ uri: cutPhotoUrl(c.id) }} style={styles.photo} resizeMode="cover" accessibilityLabel={`Photo of the cut on ${c.cutOn}`} /> : null}
            </View>
          ))}
        </View>
      ) : null}
      {canRecord ? <CutForm revision={revision} units={units} material={material} onMaterial={setMaterial} /> : <Text style={theme.muted}>Viewers see the log; editors record cuts.</Text>}
    </View>
  );
}

function FitHistoryPanel({ shopId, device, material, units }: { shopId: string; device: string | null; material: string; units: LengthUnit }) {
  const history = useFitHistory(shopId, device, material);
  const { isWide } = useBreakpoint();
  const fmt = (mm: number) => formatLength(mm, units, { digits: units === 'in' ? 3 : 2 });
  if (!device) return <Text style={theme.muted}>This revision’s fit notes name no device, so there is no fit history to draw on.</Text>;
  if (!material.trim()) return <Text style={theme.muted}>Say which material below to see the fit history for {device}.</Text>;
  return (
    <View style={styles.history} testID="fit-history">
      <Text style={theme.label}>
        Fit history: {device} in {material.trim()}
      </Text>
      {history.isLoading ? <Text style={theme.muted}>Reading the fit history…</Text> : null}
      {history.isError ? <Notice title="No fit history">{history.error.message}</Notice> : null}
      {history.data ? (
        <>
          {history.data.suggestion ? (
            <View style={styles.suggestion} testID="suggested-clearance">
              <Text style={theme.muted}>Clearance to try next, per side</Text>
              <Text style={styles.suggestionValue}>{fmt(history.data.suggestion.clearanceMm)}</Text>
              <Text style={theme.muted}>
                From {history.data.suggestion.cuts} cut(s): {history.data.suggestion.basis}. Sneak up on the fit with a test piece before the good stock.
              </Text>
            </View>
          ) : (
            <Text style={theme.muted}>No cuts with a clearance recorded for this device and material yet.</Text>
          )}
          <FitPlot
            cuts={history.data.cuts.filter((c) => c.clearanceMm !== undefined).map((c) => ({ clearanceMm: c.clearanceMm!, result: c.result }))}
            suggestion={history.data.suggestion?.clearanceMm ?? null}
            units={units}
            width={isWide ? 420 : 300}
          />
          <Text style={theme.muted}>✕ tight · ● good · ○ loose · dashed line: the suggestion</Text>
        </>
      ) : null}
    </View>
  );
}

function CutForm({ revision, units, material, onMaterial }: { revision: RevisionInfo; units: LengthUnit; material: string; onMaterial: (m: string) => void }) {
  const log = useLogCut(revision.id);
  const [photo, setPhoto] = useState<File | null>(null);
  const [photoError, setPhotoError] = useState<string | null>(null);
  const [saved, setSaved] = useState(false);
  const fileInput = useRef<HTMLInputElement>(null);
  const defaults: FormIn = {
    cutOn: today(),
    material,
    bitMm: revision.fitNotes.bitDiameter ?? (typeof revision.params?.bitDiameter === 'number' ? revision.params.bitDiameter : (undefined as unknown as number)),
    machineNote: '',
    clearanceMm: revision.fitNotes.clearancePerSide,
    measuredWidthMm: undefined,
    measuredLengthMm: undefined,
    result: undefined as unknown as FormIn['result'],
  };
  const { control, handleSubmit, reset, formState } = useForm<FormIn, unknown, FormOut>({ resolver: zodResolver(CutLogInput), defaultValues: defaults });
  const errors = formState.errors;
  const submit = handleSubmit((values) => {
    setSaved(false);
    log.mutate(
      { input: values, photo },
      {
        onSuccess: () => {
          setSaved(true);
          setPhoto(null);
          reset({ ...defaults, material: values.material, bitMm: values.bitMm });
        },
      },
    );
  });
  return (
    <View style={styles.form} testID="cut-form">
      <Text style={theme.heading}>Record a cut</Text>
      <View style={styles.fields}>
        <Controller control={control} name="cutOn" render={({ field }) => <TextField label="Cut on" value={field.value} onChangeText={field.onChange} onBlur={field.onBlur} error={errors.cutOn?.message} hint="YYYY-MM-DD" width={160} testID="cut-date" />} />
        <Controller
          control={control}
          name="material"
          render={({ field }) => (
            <TextField
              label="Material"
              value={field.value}
              onChangeText={(t) => {
                field.onChange(t);
              }}
              onBlur={() => {
                field.onBlur();
                onMaterial(field.value ?? '');
              }}
              error={errors.material?.message}
              width={220}
              testID="cut-material"
            />
          )}
        />
        <Controller control={control} name="bitMm" render={({ field }) => <LengthBox label="Bit diameter" units={units} value={field.value} onChange={(v) => field.onChange(v)} onBlur={field.onBlur} error={say(errors.bitMm, 'Bit diameter', 50)} testID="cut-bit" />} />
        <Controller
          control={control}
          name="clearanceMm"
          render={({ field }) => (
            <LengthBox
              label="Clearance per side"
              units={units}
              value={field.value}
              onChange={(v) => field.onChange(v)}
              onBlur={field.onBlur}
              error={say(errors.clearanceMm, 'Clearance', 20)}
              hint={revision.fitNotes.clearancePerSide !== undefined ? 'From the revision’s fit notes' : undefined}
              testID="cut-clearance"
            />
          )}
        />
        <Controller control={control} name="measuredWidthMm" render={({ field }) => <LengthBox label="Pocket measured, width" units={units} value={field.value} onChange={(v) => field.onChange(v)} onBlur={field.onBlur} error={say(errors.measuredWidthMm, 'Measured width', 2000)} testID="cut-measured-width" />} />
        <Controller control={control} name="measuredLengthMm" render={({ field }) => <LengthBox label="Pocket measured, length" units={units} value={field.value} onChange={(v) => field.onChange(v)} onBlur={field.onBlur} error={say(errors.measuredLengthMm, 'Measured length', 2000)} testID="cut-measured-length" />} />
      </View>
      <Controller
        control={control}
        name="result"
        render={({ field }) => (
          <View style={{ gap: space.xs }}>
            <Text style={theme.label}>How did it fit?</Text>
            <Segmented label="Fit result" options={CUT_RESULTS.map((r) => ({ value: r, label: RESULT_TEXT[r] }))} value={field.value ?? ''} onChange={field.onChange} />
            {errors.result ? <FieldError message="Say whether it came out tight, good or loose" /> : null}
          </View>
        )}
      />
      <Controller control={control} name="machineNote" render={({ field }) => <TextField label="Machine note" value={field.value ?? ''} onChangeText={field.onChange} onBlur={field.onBlur} error={errors.machineNote?.message} multiline placeholder="Feed, passes, hold-down…" testID="cut-note" />} />
      <View style={{ gap: space.xs }}>
        <Text style={theme.label}>Photo (optional, JPEG or PNG, up to 8 MB)</Text>
        <input
          ref={fileInput}
          type="file"
          accept="image/jpeg,image/png"
          aria-label="Photo of the cut"
          data-testid="cut-photo"
          style={{ display: 'none' }}
          onChange={(e) => {
            const f = e.target.files?.[0] ?? null;
            e.target.value = '';
            if (!f) return;
            if (!/^image\/(jpeg|png)$/.test(f.type) && !/\.(jpe?g|png)$/i.test(f.name)) {
              setPhotoError('The photo must be a JPEG or PNG image');
              setPhoto(null);
            } else if (f.size > 8 * 1024 * 1024) {
              setPhotoError('The photo is larger than 8 MB');
              setPhoto(null);
            } else {
              setPhotoError(null);
              setPhoto(f);
            }
          }}
        />
        <View style={theme.row}>
          <Button tone="secondary" label={photo ? 'Choose another photo' : 'Choose a photo'} onPress={() => fileInput.current?.click()} />
          {photo ? (
            <Pressable onPress={() => setPhoto(null)} accessibilityRole="button">
              <Text style={theme.link}>Remove {photo.name}</Text>
            </Pressable>
          ) : null}
        </View>
        {photoError ? <FieldError message={photoError} /> : null}
      </View>
      <Button label="Save the cut" onPress={submit} busy={log.isPending} testID="cut-submit" />
      {log.isError ? <Notice title="The cut was not saved">{log.error.message}</Notice> : null}
      {saved ? <Notice tone="ok">Cut recorded.</Notice> : null}
    </View>
  );
}

const styles = StyleSheet.create({
  cut: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, padding: space.md, gap: 4, backgroundColor: colors.surface },
  result: { fontFamily: 'IBMPlexSans_500Medium', fontSize: 13, paddingHorizontal: space.sm, paddingVertical: 2, borderRadius: radius.sm },
  tight: { backgroundColor: colors.dangerSoft, color: colors.danger },
  good: { backgroundColor: colors.pineSoft, color: colors.pineDark },
  loose: { backgroundColor: colors.copperSoft, color: colors.copper },
  photo: { width: 160, height: 120, borderRadius: radius.sm, backgroundColor: colors.sunk },
  history: { gap: space.sm },
  suggestion: { borderLeftWidth: 4, borderLeftColor: colors.pine, backgroundColor: colors.pineSoft, padding: space.md, borderRadius: radius.sm, gap: 2 },
  suggestionValue: { fontFamily: 'IBMPlexMono_400Regular', fontSize: 28, lineHeight: 34, color: colors.pineDark },
  form: { gap: space.md },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
});
