import { StyleSheet, Text, View } from 'react-native';
import { formatLength, type LengthUnit } from '../../shared/units';
import { useFitHistory } from '../api/cuts';
import { Button } from '../library/controls';
import { colors, space, theme } from '../ui';

export interface SuggestedClearanceProps {
  shopId: string | undefined;
  device: string | null | undefined;
  material: string | undefined;
  units: LengthUnit;
  testID?: string;
  /** Offers a button that hands the suggested clearance (mm) to the caller, e.g. to fill the field. */
  onUse?: (clearanceMm: number) => void;
  /** The clearance the form holds now (mm): when it is the suggestion, the button gives way to "in use". */
  currentMm?: number;
  /** Say so in one line when there is no history (or no material to look it up by), instead of showing nothing. */
  sayWhenNone?: boolean;
}

const EPS_MM = 1e-6;

/**
 * One line for beside a clearance field: the clearance the shop's fit history suggests for this
 * device and material, or nothing when there is no history yet (unless `sayWhenNone`). Used by
 * the regenerate panel and the generator workbench.
 */
export function SuggestedClearance({ shopId, device, material, units, testID = 'suggested-clearance-hint', onUse, currentMm, sayWhenNone = false }: SuggestedClearanceProps) {
  const h = useFitHistory(shopId, device, material);
  const s = h.data?.suggestion;
  const fmt = (mm: number) => formatLength(mm, units, { digits: units === 'in' ? 3 : 2 });
  if (!s) {
    if (!sayWhenNone || !device) return null;
    let line: string;
    if (!material?.trim()) line = `Fit history is kept per material; with none here, none is looked up for ${device}.`;
    else if (h.isError) line = `The fit history could not be read: ${h.error.message}`;
    else if (h.isPending) line = `Reading the fit history for ${device}…`;
    else line = `No test cuts with a clearance recorded for ${device} in ${material.trim()} yet.`;
    return (
      <Text style={[theme.muted, h.isError && { color: colors.danger }]} testID={`${testID}-none`}>
        {line}
      </Text>
    );
  }
  const inUse = currentMm !== undefined && Math.abs(currentMm - s.clearanceMm) < EPS_MM;
  return (
    <View style={styles.row} testID={testID}>
      <Text style={[theme.label, styles.text]}>
        Fit history for {device} in {material}: try {fmt(s.clearanceMm)} per side ({s.basis}).
      </Text>
      {onUse ? (
        inUse ? (
          <Text style={[theme.muted, { color: colors.ok }]} testID={`${testID}-in-use`}>
            In use.
          </Text>
        ) : (
          <Button label={`Use ${fmt(s.clearanceMm)}`} tone="secondary" accessibilityLabel={`Use the suggested clearance, ${fmt(s.clearanceMm)} per side`} onPress={() => onUse(s.clearanceMm)} testID={`${testID}-use`} />
        )
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { gap: space.xs, alignItems: 'flex-start' },
  text: { color: colors.pineDark },
});
