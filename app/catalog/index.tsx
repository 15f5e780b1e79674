import { useState, type ReactNode } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { useChargers, useDeleteCharger, useDeleteDevice, useDevices } from '@/components/api/catalog';
import { Segmented } from '@/components/forms/Segmented';
import { useDisplayUnits } from '@/components/forms/useDisplayUnits';
import { AppFrame } from '@/components/layout/AppFrame';
import { ChargerForm, DeviceForm } from '@/components/library/CatalogForms';
import { Button, Loading, Notice, Section } from '@/components/library/controls';
import { WithCurrentShop } from '@/components/library/WithCurrentShop';
import { canEdit, type CurrentShop } from '@/components/library/shopAccess';
import { SafetyNotes } from '@/components/SafetyNotes';
import { colors, fonts, space, theme, useBreakpoint } from '@/components/ui';
import type { Charger, Device } from '@/shared/schemas/catalog';
import { formatLength, type LengthUnit } from '@/shared/units';

export default function CatalogScreen() {
  return (
    <AppFrame title="Devices and charger pads">
      <WithCurrentShop what="The catalog">{(shop) => <ShopCatalog shop={shop} />}</WithCurrentShop>
    </AppFrame>
  );
}

const bare = (mm: number, u: LengthUnit) => formatLength(mm, u, { digits: u === 'in' ? 3 : 1 }).replace(/ mm$|"$/, '');
const unitMark = (u: LengthUnit) => (u === 'in' ? '"' : ' mm');
const sizeOf = (w: number, l: number, t: number, u: LengthUnit) => `${bare(w, u)} × ${bare(l, u)} × ${bare(t, u)}${unitMark(u)}`;

function ShopCatalog({ shop }: { shop: CurrentShop }) {
  const [units, setUnits] = useDisplayUnits();
  const editor = canEdit(shop.role);
  return (
    <View style={{ gap: space.lg }}>
      <View style={[theme.row, { justifyContent: 'space-between', flexWrap: 'wrap', gap: space.md }]}>
        <Text style={[theme.body, { flexShrink: 1 }]}>
          The devices <Text style={{ fontFamily: fonts.bold }}>{shop.shopName}</Text> builds pockets for and the charger pads it builds recesses for. Fit notes and generators fill in from here.
        </Text>
        <Segmented label="Units" options={[{ value: 'mm', label: 'mm' }, { value: 'in', label: 'inches' }]} value={units} onChange={setUnits} />
      </View>
      <DeviceSection shopId={shop.shopId} editor={editor} units={units} />
      <ChargerSection shopId={shop.shopId} editor={editor} units={units} />
      <SafetyNotes only={['charger', 'mains']} compact />
    </View>
  );
}

/** Deleting asks once more, in place, naming what goes. */
function DeleteControl({ name, onDelete, busy, error }: { name: string; onDelete: () => void; busy: boolean; error: string | null }) {
  const [asking, setAsking] = useState(false);
  if (!asking) return <Button tone="quiet" label="Delete" accessibilityLabel={`Delete ${name}`} onPress={() => setAsking(true)} />;
  return (
    <View style={{ gap: 4 }}>
      <Text style={theme.muted}>Remove {name} from the catalog? Saved revisions keep their own fit notes.</Text>
      <View style={[theme.row, { flexWrap: 'wrap' }]}>
        <Button tone="danger" label="Yes, delete" busy={busy} onPress={onDelete} />
        <Button tone="quiet" label="Keep it" onPress={() => setAsking(false)} />
      </View>
      {error ? <Text style={{ color: colors.danger }}>{error}</Text> : null}
    </View>
  );
}

interface Column<T> {
  label: string;
  flex: number;
  cell: (item: T) => ReactNode;
}

/** Phones get one block per item; wide screens a table with the same columns. */
function CatalogList<T extends { id: string; name: string }>({ items, columns, actions, label }: { items: T[]; columns: Column<T>[]; actions?: (item: T) => ReactNode; label: string }) {
  const { isWide } = useBreakpoint();
  if (!isWide) {
    return (
      <View style={{ gap: space.sm }} role="list" aria-label={label}>
        {items.map((item) => (
          <View key={item.id} role="listitem" style={styles.block}>
            <Text style={styles.name}>{item.name}</Text>
            {columns.slice(1).map((c) => (
              <View key={c.label} style={theme.row}>
                <Text style={[theme.muted, { width: 110 }]}>{c.label}</Text>
                <View style={{ flex: 1 }}>{c.cell(item)}</View>
              </View>
            ))}
            {actions?.(item)}
          </View>
        ))}
      </View>
    );
  }
  return (
    <View style={styles.table} role="table" aria-label={label}>
      <View style={[styles.tr, styles.thead]} role="row">
        {columns.map((c) => (
          <View key={c.label} role="columnheader" style={[styles.td, { flex: c.flex }]}>
            <Text style={styles.th}>{c.label}</Text>
          </View>
        ))}
        {actions ? <View style={[styles.td, { flex: 1.2 }]} /> : null}
      </View>
      {items.map((item) => (
        <View key={item.id} style={styles.tr} role="row">
          {columns.map((c) => (
            <View key={c.label} role="cell" style={[styles.td, { flex: c.flex }]}>
              {c.cell(item)}
            </View>
          ))}
          {actions ? <View style={[styles.td, { flex: 1.2 }]}>{actions(item)}</View> : null}
        </View>
      ))}
    </View>
  );
}

function DeviceSection({ shopId, editor, units }: { shopId: string; editor: boolean; units: LengthUnit }) {
  const devices = useDevices(shopId);
  const remove = useDeleteDevice(shopId);
  const [adding, setAdding] = useState(false);
  const columns: Column<Device>[] = [
    { label: 'Device', flex: 2.4, cell: (d) => <Text style={theme.body}>{d.name}</Text> },
    { label: 'W × L × T', flex: 2, cell: (d) => <Text style={theme.mono}>{sizeOf(d.widthMm, d.lengthMm, d.thicknessMm, units)}</Text> },
    { label: 'Case adds', flex: 1.4, cell: (d) => <Text style={theme.mono}>{d.caseAllowanceMm ? `${formatLength(d.caseAllowanceMm, units)} per side` : 'bare'}</Text> },
  ];
  return (
    <Section title="Devices" right={editor && !adding ? <Button tone="secondary" label="Add a device" onPress={() => setAdding(true)} testID="device-add" /> : undefined}>
      {adding ? <DeviceForm shopId={shopId} onDone={() => setAdding(false)} /> : null}
      {devices.isLoading ? (
        <Loading label="Fetching devices…" />
      ) : devices.isError ? (
        <Notice title="The devices could not be loaded" action={<Button tone="secondary" label="Try again" onPress={() => devices.refetch()} />}>
          {devices.error.message}
        </Notice>
      ) : devices.data?.length ? (
        <CatalogList
          label="Devices"
          items={devices.data}
          columns={columns}
          actions={editor ? (d) => <DeleteControl name={d.name} busy={remove.isPending && remove.variables === d.id} error={remove.isError && remove.variables === d.id ? remove.error.message : null} onDelete={() => remove.mutate(d.id)} /> : undefined}
        />
      ) : (
        <Text style={theme.muted}>No devices yet.{editor ? ' Add the phones and tablets your inserts are made for.' : ''}</Text>
      )}
    </Section>
  );
}

function ChargerSection({ shopId, editor, units }: { shopId: string; editor: boolean; units: LengthUnit }) {
  const chargers = useChargers(shopId);
  const remove = useDeleteCharger(shopId);
  const [adding, setAdding] = useState(false);
  const range = (c: Charger) =>
    c.rangeMinMm === null && c.rangeMaxMm === null ? 'not given' : `${c.rangeMinMm !== null ? bare(c.rangeMinMm, units) : '?'} – ${c.rangeMaxMm !== null ? bare(c.rangeMaxMm, units) : '?'}${unitMark(units)}`;
  const columns: Column<Charger>[] = [
    { label: 'Charger pad', flex: 2.4, cell: (c) => <Text style={theme.body}>{c.name}</Text> },
    {
      label: 'Size',
      flex: 2,
      cell: (c) => (
        <Text style={theme.mono}>
          {c.shape === 'round' ? `Ø ${bare(c.widthMm, units)} × ${bare(c.thicknessMm, units)}${unitMark(units)}` : sizeOf(c.widthMm, c.lengthMm, c.thicknessMm, units)}
        </Text>
      ),
    },
    { label: 'Rated distance', flex: 1.4, cell: (c) => <Text style={theme.mono}>{range(c)}</Text> },
  ];
  return (
    <Section title="Charger pads" right={editor && !adding ? <Button tone="secondary" label="Add a charger pad" onPress={() => setAdding(true)} testID="charger-add" /> : undefined}>
      {adding ? <ChargerForm shopId={shopId} onDone={() => setAdding(false)} /> : null}
      {chargers.isLoading ? (
        <Loading label="Fetching charger pads…" />
      ) : chargers.isError ? (
        <Notice title="The charger pads could not be loaded" action={<Button tone="secondary" label="Try again" onPress={() => chargers.refetch()} />}>
          {chargers.error.message}
        </Notice>
      ) : chargers.data?.length ? (
        <CatalogList
          label="Charger pads"
          items={chargers.data}
          columns={columns}
          actions={editor ? (c) => <DeleteControl name={c.name} busy={remove.isPending && remove.variables === c.id} error={remove.isError && remove.variables === c.id ? remove.error.message : null} onDelete={() => remove.mutate(c.id)} /> : undefined}
        />
      ) : (
        <Text style={theme.muted}>No charger pads yet.{editor ? ' Add the pads your recesses are cut for.' : ''}</Text>
      )}
    </Section>
  );
}

const styles = StyleSheet.create({
  block: { borderWidth: 1, borderColor: colors.line, borderRadius: 6, padding: space.md, gap: 4, backgroundColor: colors.surface },
  name: { fontFamily: fonts.bold, fontSize: 15, color: colors.ink },
  table: { borderWidth: 1, borderColor: colors.line, borderRadius: 6, overflow: 'hidden' },
  thead: { backgroundColor: colors.sunk },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.line, alignItems: 'center' },
  th: { fontFamily: fonts.medium, fontSize: 13, color: colors.inkMuted },
  // A zero basis makes every row share out the width the same way, so the columns line up.
  td: { paddingHorizontal: space.md, paddingVertical: space.sm, flexBasis: 0, minWidth: 0 },
});
