import { Controller, useWatch, type FieldPath } from 'react-hook-form';
import { StyleSheet, Text, View } from 'react-native';
import type { Charger, Device } from '../../shared/schemas/catalog';
import { Segmented } from '../forms/Segmented';
import { Checkbox, FieldError, TextField } from '../library/controls';
import { LengthBox } from '../library/LengthBox';
import { colors, radius, space, theme } from '../ui';
import { GRAIN_LABEL } from './FitNotesView';
import type { Length, RevisionFormControl, RevisionFormSetValue, RevisionFormValues } from './revisionForm';

type Path = FieldPath<RevisionFormValues>;

function LengthField({ control, name, label, hint, testID }: { control: RevisionFormControl; name: Path; label: string; hint?: string; testID?: string }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <LengthBox value={field.value as Length} onChange={field.onChange} onBlur={field.onBlur} label={label} error={fieldState.error?.message} hint={hint} testID={testID} />
      )}
    />
  );
}

function Words({ control, name, label, placeholder, multiline, testID }: { control: RevisionFormControl; name: Path; label: string; placeholder?: string; multiline?: boolean; testID?: string }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <TextField label={label} value={(field.value as string) ?? ''} onChangeText={field.onChange} onBlur={field.onBlur} placeholder={placeholder} multiline={multiline} error={fieldState.error?.message} testID={testID} />
      )}
    />
  );
}

function Part({ control, name, label, children, testID }: { control: RevisionFormControl; name: 'include.device' | 'include.charger' | 'include.stock'; label: string; children: React.ReactNode; testID?: string }) {
  const on = useWatch({ control, name });
  return (
    <View style={[styles.part, on && styles.partOn]}>
      <Controller control={control} name={name} render={({ field }) => <Checkbox label={label} checked={!!field.value} onChange={field.onChange} testID={testID} />} />
      {on ? <View style={styles.partBody}>{children}</View> : null}
    </View>
  );
}

/** Quick fills from the shop's catalog; the numbers can still be changed afterwards. */
function CatalogPicks<T extends { id: string; name: string }>({ items, label, onPick }: { items: T[]; label: string; onPick: (item: T) => void }) {
  if (items.length === 0) return null;
  return (
    <View style={{ gap: 4 }}>
      <Text style={theme.muted}>{label}</Text>
      <Segmented label={label} options={items.map((i) => ({ value: i.id, label: i.name }))} value={undefined} onChange={(id) => onPick(items.find((i) => i.id === id)!)} />
    </View>
  );
}

export function FitNotesForm({
  control,
  setValue,
  devices,
  chargers,
}: {
  control: RevisionFormControl;
  setValue: RevisionFormSetValue;
  devices: Device[];
  chargers: Charger[];
}) {
  const shape = useWatch({ control, name: 'fitNotes.charger.shape' });
  const set = (name: Path, v: unknown) => setValue(name, v as never, { shouldDirty: true, shouldValidate: false });
  return (
    <View style={{ gap: space.md }}>
      <Text style={theme.muted}>All lengths in millimetres. To enter inches, add the unit: 3/4 in, 1-1/2".</Text>
      <Part control={control} name="include.device" label="It fits a device" testID="include-device">
        <CatalogPicks
          items={devices}
          label="Fill in from the catalog"
          onPick={(d) => {
            set('fitNotes.device.name', d.name);
            set('fitNotes.device.width', d.widthMm);
            set('fitNotes.device.length', d.lengthMm);
            set('fitNotes.device.thickness', d.thicknessMm);
          }}
        />
        <Words control={control} name="fitNotes.device.name" label="Device" placeholder="e.g. Slate phone, 6.1 in screen" />
        <View style={styles.row}>
          <LengthField control={control} name="fitNotes.device.width" label="Width" testID="device-width" />
          <LengthField control={control} name="fitNotes.device.length" label="Length" testID="device-length" />
          <LengthField control={control} name="fitNotes.device.thickness" label="Thickness" testID="device-thickness" />
        </View>
        <Controller control={control} name="fitNotes.device.cased" render={({ field }) => <Checkbox label="Measured in its case" checked={!!field.value} onChange={field.onChange} />} />
      </Part>
      <LengthField control={control} name="fitNotes.clearancePerSide" label="Clearance per side" hint="Gap left around the device on each side" testID="clearance" />
      <Part control={control} name="include.charger" label="It holds a charger pad" testID="include-charger">
        <CatalogPicks
          items={chargers}
          label="Fill in from the catalog"
          onPick={(c) => {
            set('fitNotes.charger.name', c.name);
            set('fitNotes.charger.shape', c.shape);
            set('fitNotes.charger.width', c.widthMm);
            set('fitNotes.charger.length', c.lengthMm);
            set('fitNotes.charger.thickness', c.thicknessMm);
            set('fitNotes.charger.rangeMin', c.rangeMinMm ?? undefined);
            set('fitNotes.charger.rangeMax', c.rangeMaxMm ?? undefined);
          }}
        />
        <Words control={control} name="fitNotes.charger.name" label="Charger pad" placeholder="e.g. Round pad, 10 W" />
        <Controller
          control={control}
          name="fitNotes.charger.shape"
          render={({ field }) => (
            <Segmented label="Pad shape" options={[{ value: 'round', label: 'Round' }, { value: 'rect', label: 'Rectangular' }]} value={field.value} onChange={field.onChange} />
          )}
        />
        <View style={styles.row}>
          <LengthField control={control} name="fitNotes.charger.width" label={shape === 'round' ? 'Diameter' : 'Width'} />
          {shape === 'rect' ? <LengthField control={control} name="fitNotes.charger.length" label="Length" /> : null}
          <LengthField control={control} name="fitNotes.charger.thickness" label="Thickness" />
        </View>
        <View style={styles.row}>
          <LengthField control={control} name="fitNotes.charger.rangeMin" label="Rated distance from" />
          <LengthField control={control} name="fitNotes.charger.rangeMax" label="to" />
        </View>
        <Text style={theme.muted}>The charging distance the pad’s maker states, through wood to the device.</Text>
      </Part>
      <Part control={control} name="include.stock" label="It is cut from known stock" testID="include-stock">
        <View style={styles.row}>
          <View style={{ flexGrow: 1, minWidth: 180 }}>
            <Words control={control} name="fitNotes.stock.material" label="Material" placeholder="e.g. walnut" />
          </View>
          <LengthField control={control} name="fitNotes.stock.thickness" label="Thickness" />
        </View>
      </Part>
      <LengthField control={control} name="fitNotes.bitDiameter" label="Bit diameter" testID="bit-diameter" />
      <Controller
        control={control}
        name="fitNotes.grain"
        render={({ field, fieldState }) => (
          <View style={{ gap: 4 }}>
            <Text style={theme.label}>Grain</Text>
            <Segmented
              label="Grain"
              options={[{ value: '', label: 'Not noted' }, ...(Object.keys(GRAIN_LABEL) as (keyof typeof GRAIN_LABEL)[]).map((g) => ({ value: g, label: GRAIN_LABEL[g] }))]}
              value={field.value}
              onChange={field.onChange}
            />
            {fieldState.error?.message ? <FieldError message={fieldState.error.message} /> : null}
          </View>
        )}
      />
      <Words control={control} name="fitNotes.text" label="Other notes" multiline placeholder="Anything about the fit: tight spots, test results, what to try next" testID="fit-text" />
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.md },
  part: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, padding: space.md, gap: space.sm },
  partOn: { borderColor: colors.pine, backgroundColor: colors.surface },
  partBody: { gap: space.md },
});
