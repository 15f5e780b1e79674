import { router } from 'expo-router';
import { useState } from 'react';
import { Text, View } from 'react-native';
import { useDevices } from '../api/catalog';
import { useRegenerate } from '../api/revisions';
import { Segmented } from '../forms/Segmented';
import { Button, Notice } from '../library/controls';
import { space, theme } from '../ui';
import { formatDimension } from '../drawing/format';
import type { DisplayUnits } from '../forms/useDisplayUnits';
import { SuggestedClearance } from '../cuts/SuggestedClearance';

/** Same generator and parameters, another device from the shop's catalog; lands on the compare view. */
export function RegeneratePanel({ revisionId, designId, shopId, currentDevice, material, units }: { revisionId: string; designId: string; shopId: string; currentDevice?: string; material?: string; units: DisplayUnits }) {
  const devices = useDevices(shopId);
  const regen = useRegenerate(designId);
  const [deviceId, setDeviceId] = useState<string | null>(null);
  const [missing, setMissing] = useState(false);
  if (devices.isLoading) return <Text style={theme.muted}>Reading the shop’s devices…</Text>;
  if (devices.isError) return <Notice title="The devices could not be loaded">{devices.error.message}</Notice>;
  const list = devices.data ?? [];
  if (list.length === 0) return <Notice tone="info">This shop’s catalog has no devices yet: add one under Catalog first.</Notice>;
  return (
    <View style={{ gap: space.sm }} testID="regenerate">
      <Text style={theme.muted}>Makes a new draft revision with only the device sizes changed{currentDevice ? ` (this one fits ${currentDevice})` : ''}, then shows what changed.</Text>
      <Segmented
        label="Device to fit"
        options={list.map((d) => ({ value: d.id, label: `${d.name} · ${formatDimension(d.widthMm, units)} × ${formatDimension(d.lengthMm, units)}` }))}
        value={deviceId ?? ''}
        onChange={(v) => {
          setDeviceId(v);
          setMissing(false);
        }}
      />
      {deviceId ? (
        <SuggestedClearance shopId={shopId} device={list.find((d) => d.id === deviceId)?.name} material={material} units={units} />
      ) : null}
      <Text style={theme.muted}>The new revision keeps this one’s pocket clearance; to use a suggested clearance, make a new revision from the generator.</Text>
      {missing ? <Text role="alert" style={[theme.muted, { color: '#A83A2A' }]}>Choose the device the new revision should fit.</Text> : null}
      <Button
        label="Regenerate for this device"
        busy={regen.isPending}
        testID="regenerate-submit"
        onPress={() => {
          if (!deviceId) {
            setMissing(true);
            return;
          }
          regen.mutate({ revisionId, deviceId }, { onSuccess: (r) => router.push(`/revisions/${revisionId}/compare/${r.id}`) });
        }}
      />
      {regen.isError ? <Notice title="Nothing was regenerated">{regen.error.message}</Notice> : null}
    </View>
  );
}
