import { Text, View } from 'react-native';
import { theme } from '../ui';
import { Segmented } from './Segmented';
import type { DisplayUnits } from './useDisplayUnits';

const OPTIONS: { value: DisplayUnits; label: string }[] = [
  { value: 'mm', label: 'mm' },
  { value: 'in', label: 'inches' },
];

/** Switches how lengths are shown and typed; values are stored in millimetres either way. */
export function UnitsToggle({ units, onChange }: { units: DisplayUnits; onChange: (u: DisplayUnits) => void }) {
  return (
    <View style={[theme.row, { flexWrap: 'wrap' }]}>
      <Text style={theme.label}>Lengths in</Text>
      <Segmented label="Length units" options={OPTIONS} value={units} onChange={onChange} />
      {units === 'in' ? <Text style={theme.muted}>Type decimals or fractions: 0.75, 3/4, 1-1/2.</Text> : null}
    </View>
  );
}
