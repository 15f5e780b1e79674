import { router, useLocalSearchParams } from 'expo-router';
import { useRef, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { Text, View } from 'react-native';
import { useChargers, useDevices } from '@/components/api/catalog';
import { ApiError } from '@/components/api/client';
import { useDesign } from '@/components/api/designs';
import { useInspectUpload, useSaveUpload, type InspectResult, type LengthUnits } from '@/components/api/revisions';
import type { UploadProgress } from '@/components/api/upload';
import { placeServerErrors } from '@/components/forms/serverErrors';
import { FilePicker } from '@/components/designs/FilePicker';
import { FitNotesForm } from '@/components/designs/FitNotesForm';
import { InspectResultView } from '@/components/designs/InspectResultView';
import { formFromFitNotes, revisionFormResolver, type RevisionFormOutput, type RevisionFormValues } from '@/components/designs/revisionForm';
import { Segmented } from '@/components/forms/Segmented';
import { useDisplayUnits } from '@/components/forms/useDisplayUnits';
import { AppFrame } from '@/components/layout/AppFrame';
import { Button, FieldError, LinkButton, Loading, Notice, Section, TextField } from '@/components/library/controls';
import { canEdit, useRoleIn } from '@/components/library/shopAccess';
import { useShopOfScreen } from '@/components/shop/CurrentShop';
import { colors, radius, space, theme, useBreakpoint } from '@/components/ui';
import { REVISION_STATUSES, STATUS_HELP, STATUS_LABEL, type DesignDetail } from '@/shared/schemas/library';

export default function UploadScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const design = useDesign(id);
  const role = useRoleIn(design.data?.shopId);
  useShopOfScreen(design.data?.shopId);
  if (design.isLoading) {
    return (
      <AppFrame title="Upload a revision">
        <Loading label="Fetching the design…" />
      </AppFrame>
    );
  }
  if (!design.data) {
    return (
      <AppFrame title="Upload a revision">
        <Notice title="The design could not be loaded" action={<LinkButton href="/library" tone="secondary" label="Back to the library" />}>
          {design.error?.message ?? 'Unknown error'}
        </Notice>
      </AppFrame>
    );
  }
  return (
    <AppFrame title={`New revision of ${design.data.title}`}>
      {canEdit(role) ? (
        <UploadFlow design={design.data} />
      ) : (
        <Notice tone="info" title="Editors and owners upload revisions" action={<LinkButton href={`/designs/${design.data.id}`} tone="secondary" label="Back to the design" />}>
          You can view and download this design, but saving a revision needs an editor or owner of {design.data.shopName}.
        </Notice>
      )}
    </AppFrame>
  );
}

type Check =
  | { state: 'idle' }
  | { state: 'sending'; progress: UploadProgress | null }
  | { state: 'unitsNeeded'; message: string }
  | { state: 'failed'; message: string }
  | { state: 'read'; result: InspectResult };

const MAX_HINT = 'DXF (text, R12 or later) or SVG';

function Progress({ progress, label }: { progress: UploadProgress | null; label: string }) {
  const f = progress?.fraction;
  const done = f !== null && f !== undefined && f >= 1;
  return (
    <View style={{ gap: 4 }} role="progressbar" aria-valuenow={f == null ? undefined : Math.round(f * 100)} aria-valuemin={0} aria-valuemax={100} aria-label={label}>
      <Text style={theme.muted}>{done ? 'Sent; reading the file…' : f == null ? `${label}…` : `${label}… ${Math.round(f * 100)}%`}</Text>
      <View style={{ height: 6, borderRadius: radius.sm, backgroundColor: colors.sunk, overflow: 'hidden' }}>
        <View style={{ height: 6, width: `${Math.round((f ?? 0.05) * 100)}%`, backgroundColor: colors.pine }} />
      </View>
    </View>
  );
}

function UploadFlow({ design }: { design: DesignDetail }) {
  const { isWide } = useBreakpoint();
  const [displayUnits] = useDisplayUnits();
  const inspect = useInspectUpload(design.id);
  const save = useSaveUpload(design.id);
  const devices = useDevices(design.shopId);
  const chargers = useChargers(design.shopId);
  const [file, setFile] = useState<File | null>(null);
  const [units, setUnits] = useState<LengthUnits | undefined>(undefined);
  const [askUnits, setAskUnits] = useState<LengthUnits>('mm');
  const [check, setCheck] = useState<Check>({ state: 'idle' });
  const [saveProgress, setSaveProgress] = useState<UploadProgress | null>(null);
  const [saveError, setSaveError] = useState<string | null>(null);
  const abort = useRef<AbortController | null>(null);

  const latest = design.revisions[0];
  const form = useForm<RevisionFormValues, unknown, RevisionFormOutput>({
    resolver: revisionFormResolver,
    defaultValues: formFromFitNotes(latest?.fitNotes),
  });

  const read = (f: File, u: LengthUnits | undefined) => {
    abort.current?.abort();
    const ctrl = new AbortController();
    abort.current = ctrl;
    setCheck({ state: 'sending', progress: null });
    setSaveError(null);
    inspect.mutate(
      { file: f, units: u, signal: ctrl.signal, onProgress: (p) => setCheck({ state: 'sending', progress: p }) },
      {
        onSuccess: (result) => setCheck({ state: 'read', result }),
        onError: (e) => {
          if (e instanceof ApiError && e.code === 'aborted') return;
          if (e instanceof ApiError && e.code === 'units_needed') setCheck({ state: 'unitsNeeded', message: e.message });
          else setCheck({ state: 'failed', message: e.message });
        },
      },
    );
  };

  const pick = (f: File) => {
    setFile(f);
    setUnits(undefined);
    read(f, undefined);
  };

  const submit = form.handleSubmit(async (values) => {
    if (!file || check.state !== 'read') return;
    setSaveError(null);
    setSaveProgress(null);
    try {
      const saved = await save.mutateAsync({ file, units, message: values.message, status: values.status, fitNotes: values.fitNotes, onProgress: setSaveProgress });
      router.replace(`/designs/${design.id}?r=${saved.number}` as never);
    } catch (e) {
      if (e instanceof ApiError && e.code === 'units_needed') {
        setCheck({ state: 'unitsNeeded', message: e.message });
        return;
      }
      setSaveError(placeServerErrors(e, form.setError, ['message', 'status', 'fitNotes']));
    }
  });

  const fileStep = (
    <Section title="1 · The cut file">
      <FilePicker
        accept=".dxf,.svg,application/dxf,image/svg+xml"
        onPick={pick}
        label={file ? 'Choose another file' : 'Choose a DXF or SVG file'}
        hint={file ? `Chosen: ${file.name} (${formatBytes(file.size)}). Or drop another here.` : `${MAX_HINT}; or drop it here.`}
        disabled={save.isPending}
      />
      {check.state === 'sending' ? <Progress progress={check.progress} label={`Sending ${file?.name ?? 'the file'}`} /> : null}
      {check.state === 'failed' ? (
        <Notice title="Jigwright could not use this file" action={file ? <Button tone="secondary" label="Try the same file again" onPress={() => read(file, units)} /> : undefined}>
          {check.message}
        </Notice>
      ) : null}
      {check.state === 'unitsNeeded' ? (
        <Notice tone="info" title="Which units is it drawn in?">
          <Text style={theme.body}>{check.message}</Text>
          <Segmented label="Units of the file" options={[{ value: 'mm', label: 'Millimetres' }, { value: 'in', label: 'Inches' }]} value={askUnits} onChange={setAskUnits} />
          <Button
            label={`Read it as ${askUnits === 'mm' ? 'millimetres' : 'inches'}`}
            onPress={() => {
              setUnits(askUnits);
              if (file) read(file, askUnits);
            }}
            testID="units-confirm"
          />
        </Notice>
      ) : null}
    </Section>
  );

  const resultStep =
    check.state === 'read' && file ? (
      <Section
        title="2 · What Jigwright read"
        right={units ? <Button tone="quiet" label={`Read as ${units === 'mm' ? 'inches' : 'millimetres'} instead`} onPress={() => { const u = units === 'mm' ? 'in' : 'mm'; setUnits(u); read(file, u); }} /> : undefined}
      >
        <InspectResultView result={check.result} units={displayUnits} fileName={file.name} />
        <Text style={theme.muted}>Nothing is saved yet. If this is not what you drew, fix the file and choose it again.</Text>
      </Section>
    ) : null;

  const errors = form.formState.errors;
  const formStep = (
    <Section title="3 · Fit notes and what changed">
      {latest ? <Text style={theme.muted}>Filled in from r{latest.number}; change whatever differs.</Text> : null}
      <Controller
        control={form.control}
        name="message"
        render={({ field }) => (
          <TextField
            label="What changed"
            value={field.value}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            placeholder={latest ? 'e.g. Pocket 0.5 mm wider after the trial cut' : 'e.g. First cut file'}
            error={errors.message?.message}
            testID="revision-message"
          />
        )}
      />
      <Controller
        control={form.control}
        name="status"
        render={({ field }) => (
          <View style={{ gap: 4 }}>
            <Text style={theme.label}>Status</Text>
            <Segmented label="Status" options={REVISION_STATUSES.map((s) => ({ value: s, label: STATUS_LABEL[s] }))} value={field.value} onChange={field.onChange} />
            <Text style={theme.muted}>{STATUS_HELP[field.value]}</Text>
            {errors.status?.message ? <FieldError message={errors.status.message} /> : null}
          </View>
        )}
      />
      <FitNotesForm control={form.control} setValue={form.setValue} devices={devices.data ?? []} chargers={chargers.data ?? []} />
      {Object.keys(errors).length ? <FieldError message="Some boxes above need a look; nothing was sent." /> : null}
      {save.isPending ? <Progress progress={saveProgress} label="Saving" /> : null}
      {saveError ? <Notice title="Not saved">{saveError}</Notice> : null}
      <View style={[theme.row, { flexWrap: 'wrap' }]}>
        <Button
          label={`Save as r${(latest?.number ?? 0) + 1}`}
          onPress={submit}
          busy={save.isPending}
          disabled={check.state !== 'read'}
          testID="revision-save"
        />
        <LinkButton href={`/designs/${design.id}`} tone="quiet" label="Cancel" />
      </View>
      {check.state !== 'read' ? <Text style={theme.muted}>Saving opens once the file has been read and looks right.</Text> : null}
    </Section>
  );

  if (isWide) {
    return (
      <View style={{ flexDirection: 'row', gap: space.lg, alignItems: 'flex-start' }}>
        <View style={{ flex: 1, gap: space.lg, minWidth: 0 }}>
          {fileStep}
          {resultStep}
        </View>
        <View style={{ flex: 1, minWidth: 0 }}>{formStep}</View>
      </View>
    );
  }
  return (
    <View style={{ gap: space.lg }}>
      {fileStep}
      {resultStep}
      {formStep}
    </View>
  );
}

function formatBytes(n: number): string {
  return n < 1024 ? `${n} bytes` : n < 1024 * 1024 ? `${(n / 1024).toFixed(1)} KB` : `${(n / 1024 / 1024).toFixed(1)} MB`;
}
