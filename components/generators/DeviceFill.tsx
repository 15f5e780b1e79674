// "Fill from a saved device": for generators that declare device parameters, pick one of the
// shop's catalog devices to fill those fields, and remember which device the design fits, so the
// shop's fit history can suggest a clearance and the saved revision can name the device.
import { Link } from 'expo-router';
import { useCallback, useEffect, useRef, useState, type ReactNode, type RefObject } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { deviceParamValues, EDITED_SUFFIX, fitNotesDeviceName } from '../../shared/generators/catalogDevice';
import type { GeneratorDef } from '../../shared/generators/types';
import type { ParamValues } from '../../shared/params';
import type { Device } from '../../shared/schemas/catalog';
import { useDevices } from '../api/catalog';
import { formatDimension } from '../drawing/format';
import type { ParamFormHandle } from '../forms/ParamForm';
import { Segmented } from '../forms/Segmented';
import type { DisplayUnits } from '../forms/useDisplayUnits';
import { useCurrentShop } from '../library/shopAccess';
import { colors, radius, space, theme } from '../ui';

export interface ChosenDevice {
  shopId: string;
  id: string;
  name: string;
  /** A filled field was typed over since. */
  edited: boolean;
}

const NO_KEYS: string[] = [];
const sameMm = (a: unknown, b: number) => typeof a === 'number' && Math.abs(a - b) < 1e-9;

/**
 * The device picked for a workbench. Without a signed-in shop, or for a generator without device
 * params, `available` is false and nothing is looked up. `initialName` (a saved revision's fit
 * notes device) is looked up in the catalog once it loads; sizes that differ from the catalog's
 * mark it edited.
 */
export function useDeviceChoice(generator: GeneratorDef, form: RefObject<ParamFormHandle | null>, startValues: Partial<ParamValues>, initialName?: string) {
  const shop = useCurrentShop();
  const keys = generator.deviceParams ?? NO_KEYS;
  const available = !!shop && keys.length > 0;
  const devices = useDevices(available ? shop.shopId : undefined);
  const [chosen, setChosen] = useState<ChosenDevice | null>(null);
  // Device fields typed in before the catalog arrived count as edits of the initial device.
  const typedEarly = useRef(false);
  const initialDone = useRef(!initialName);

  useEffect(() => {
    if (initialDone.current || !shop || !devices.data) return;
    initialDone.current = true;
    const base = initialName!.endsWith(EDITED_SUFFIX) ? initialName!.slice(0, -EDITED_SUFFIX.length) : initialName!;
    const d = devices.data.find((x) => x.name === base);
    if (!d) return;
    const values = deviceParamValues(keys, d);
    const differs = Object.entries(values).some(([k, v]) => !sameMm(startValues[k], v));
    setChosen({ shopId: shop.shopId, id: d.id, name: d.name, edited: typedEarly.current || differs });
  }, [devices.data, shop, initialName, keys, startValues]);

  const choose = useCallback(
    (d: Device | null) => {
      if (!shop || !d) {
        setChosen(null);
        return;
      }
      form.current?.setValues(deviceParamValues(keys, d));
      setChosen({ shopId: shop.shopId, id: d.id, name: d.name, edited: false });
    },
    [shop, keys, form],
  );

  /** For ParamForm's onFieldEdit: typing over a filled device field marks the device edited. */
  const onFieldEdit = useCallback(
    (name: string) => {
      if (!keys.includes(name)) return;
      typedEarly.current = true;
      setChosen((c) => (c && !c.edited ? { ...c, edited: true } : c));
    },
    [keys],
  );

  // A device from another shop's catalog no longer applies once the shop is switched.
  const active = available && chosen && chosen.shopId === shop.shopId ? chosen : null;
  return { available, shopId: shop?.shopId, shopName: shop?.shopName, devices, chosen: active, choose, onFieldEdit };
}

export type DeviceChoice = ReturnType<typeof useDeviceChoice>;

const deviceLabel = (d: Device, units: DisplayUnits) => `${d.name} · ${formatDimension(d.widthMm, units)} × ${formatDimension(d.lengthMm, units)}`;

/** The picker, shown above the device fields. Renders nothing without a shop. */
export function DevicePicker({ choice, units, children }: { choice: DeviceChoice; units: DisplayUnits; children?: ReactNode }) {
  if (!choice.available) return null;
  const { devices, chosen } = choice;
  const list = devices.data ?? [];
  let body: ReactNode;
  if (devices.isPending) body = <Text style={theme.muted}>Reading the shop’s devices…</Text>;
  else if (devices.isError) body = <Text style={[theme.muted, { color: colors.danger }]}>The shop’s devices could not be loaded ({devices.error.message}); type the sizes below.</Text>;
  else if (list.length === 0)
    body = (
      <Text style={theme.muted}>
        {choice.shopName ?? 'This shop'} has no saved devices yet; type the sizes below, or add one under{' '}
        <Link href="/catalog" style={theme.link}>
          Catalog
        </Link>
        .
      </Text>
    );
  else
    body = (
      <Segmented
        label="Fill from a saved device"
        options={[{ value: '', label: 'None: typed by hand' }, ...list.map((d) => ({ value: d.id, label: deviceLabel(d, units) }))]}
        value={chosen?.id ?? ''}
        onChange={(id) => choice.choose(list.find((d) => d.id === id) ?? null)}
      />
    );
  const saved = chosen ? list.find((d) => d.id === chosen.id) : undefined;
  return (
    <View style={styles.box} testID="device-fill">
      <Text style={theme.label}>Fill from a saved device</Text>
      {body}
      {chosen ? (
        <Text style={[theme.muted, chosen.edited && { color: colors.caution }]} testID="device-fill-status">
          {chosen.edited
            ? `${fitNotesDeviceName(chosen)}: a size below was typed over, so the revision will note the device as edited.`
            : saved
              ? `Filled from ${chosen.name}: ${formatDimension(saved.widthMm, units)} × ${formatDimension(saved.lengthMm, units)} × ${formatDimension(saved.thicknessMm, units)}, case ${formatDimension(saved.caseAllowanceMm, units)} per side. The revision will note that it fits ${chosen.name}.`
              : `Fits ${chosen.name}.`}
        </Text>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  box: { gap: space.xs, padding: space.sm, borderRadius: radius.sm, backgroundColor: colors.sunk, borderWidth: 1, borderColor: colors.line },
});
