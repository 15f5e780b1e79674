// Add-forms for the shop's catalog, checked with the shared DeviceInput and ChargerInput schemas.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm, useWatch, type Control, type FieldPath, type FieldValues } from 'react-hook-form';
import { Text, View } from 'react-native';
import type { z } from 'zod';
import { ChargerInput, DeviceInput } from '../../shared/schemas/catalog';
import { useCreateCharger, useCreateDevice } from '../api/catalog';
import { placeServerErrors } from '../forms/serverErrors';
import { Segmented } from '../forms/Segmented';
import { space, theme } from '../ui';
import { Button, Notice, TextField } from './controls';
import { LengthBox, type Length } from './LengthBox';

function NameField<T extends FieldValues>({ control, name, label, placeholder, testID }: { control: Control<T, any, any>; name: FieldPath<T>; label: string; placeholder: string; testID?: string }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <TextField label={label} value={(field.value as string) ?? ''} onChangeText={field.onChange} onBlur={field.onBlur} placeholder={placeholder} error={fieldState.error?.message} testID={testID} />
      )}
    />
  );
}

function LengthInput<T extends FieldValues>({ control, name, label, hint, testID }: { control: Control<T, any, any>; name: FieldPath<T>; label: string; hint?: string; testID?: string }) {
  return (
    <Controller
      control={control}
      name={name}
      render={({ field, fieldState }) => (
        <LengthBox value={field.value as Length} onChange={field.onChange} onBlur={field.onBlur} label={label} hint={hint} error={fieldState.error?.message} testID={testID} />
      )}
    />
  );
}

type DeviceValues = { name: string; widthMm: Length; lengthMm: Length; thicknessMm: Length; caseAllowanceMm: Length };
const emptyDevice: DeviceValues = { name: '', widthMm: undefined, lengthMm: undefined, thicknessMm: undefined, caseAllowanceMm: 0 };

export function DeviceForm({ shopId, onDone }: { shopId: string; onDone: () => void }) {
  const create = useCreateDevice(shopId);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, formState } = useForm<DeviceValues, unknown, z.output<typeof DeviceInput>>({
    resolver: zodResolver(DeviceInput as unknown as z.ZodType<z.output<typeof DeviceInput>, DeviceValues>),
    defaultValues: emptyDevice,
  });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await create.mutateAsync(values);
      reset(emptyDevice);
      onDone();
    } catch (e) {
      setFormError(placeServerErrors(e, setError, Object.keys(emptyDevice)));
    }
  });
  return (
    <View style={{ gap: space.md }} testID="device-form">
      <NameField control={control} name="name" label="Name" placeholder="e.g. Slate phone, 6.1 in screen" testID="device-name" />
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        <LengthInput control={control} name="widthMm" label="Width" testID="device-width" />
        <LengthInput control={control} name="lengthMm" label="Length" testID="device-length" />
        <LengthInput control={control} name="thicknessMm" label="Thickness" testID="device-thickness" />
        <LengthInput control={control} name="caseAllowanceMm" label="Case adds, per side" hint="0 for a bare device" />
      </View>
      <Text style={theme.muted}>Measure the bare device with calipers. Lengths in mm; add “in” to type inches.</Text>
      {formError ? <Notice title="Not added">{formError}</Notice> : null}
      <View style={[theme.row, { flexWrap: 'wrap' }]}>
        <Button label="Add device" onPress={submit} busy={formState.isSubmitting} testID="device-submit" />
        <Button tone="quiet" label="Cancel" onPress={onDone} />
      </View>
    </View>
  );
}

type ChargerValues = { name: string; shape: 'round' | 'rect'; widthMm: Length; lengthMm: Length; thicknessMm: Length; rangeMinMm: Length; rangeMaxMm: Length };
const emptyCharger: ChargerValues = { name: '', shape: 'round', widthMm: undefined, lengthMm: undefined, thicknessMm: undefined, rangeMinMm: undefined, rangeMaxMm: undefined };

export function ChargerForm({ shopId, onDone }: { shopId: string; onDone: () => void }) {
  const create = useCreateCharger(shopId);
  const [formError, setFormError] = useState<string | null>(null);
  const { control, handleSubmit, setError, reset, setValue, formState } = useForm<ChargerValues, unknown, z.output<typeof ChargerInput>>({
    resolver: zodResolver(ChargerInput as unknown as z.ZodType<z.output<typeof ChargerInput>, ChargerValues>),
    defaultValues: emptyCharger,
  });
  const shape = useWatch({ control, name: 'shape' });
  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      // A round pad has no separate length; the server stores the diameter for both.
      await create.mutateAsync(values.shape === 'round' ? { ...values, lengthMm: undefined } : values);
      reset(emptyCharger);
      onDone();
    } catch (e) {
      setFormError(placeServerErrors(e, setError, Object.keys(emptyCharger)));
    }
  });
  return (
    <View style={{ gap: space.md }} testID="charger-form">
      <NameField control={control} name="name" label="Name" placeholder="e.g. Round pad, 10 W" testID="charger-name" />
      <Controller
        control={control}
        name="shape"
        render={({ field }) => (
          <View style={{ gap: 4 }}>
            <Text style={theme.label}>Shape</Text>
            <Segmented label="Shape" options={[{ value: 'round', label: 'Round' }, { value: 'rect', label: 'Rectangular' }]} value={field.value}
              onChange={(v) => {
                field.onChange(v);
                // A hidden length box must not hold up the form with an old typo.
                if (v === 'round') setValue('lengthMm', undefined);
              }}
            />
          </View>
        )}
      />
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        <LengthInput control={control} name="widthMm" label={shape === 'round' ? 'Diameter' : 'Width'} testID="charger-width" />
        {shape === 'rect' ? <LengthInput control={control} name="lengthMm" label="Length" /> : null}
        <LengthInput control={control} name="thicknessMm" label="Thickness" testID="charger-thickness" />
      </View>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: space.md }}>
        <LengthInput control={control} name="rangeMinMm" label="Rated distance from" />
        <LengthInput control={control} name="rangeMaxMm" label="to" />
      </View>
      <Text style={theme.muted}>Take the charging distance from the pad maker’s sheet; leave it empty when the sheet does not say.</Text>
      {formError ? <Notice title="Not added">{formError}</Notice> : null}
      <View style={[theme.row, { flexWrap: 'wrap' }]}>
        <Button label="Add charger pad" onPress={submit} busy={formState.isSubmitting} testID="charger-submit" />
        <Button tone="quiet" label="Cancel" onPress={onDone} />
      </View>
    </View>
  );
}
