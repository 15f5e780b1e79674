import { Text } from 'react-native';
import { formatLength, type LengthUnit } from '../../shared/units';
import { useFitHistory } from '../api/cuts';
import { theme } from '../ui';

/**
 * One line for beside a clearance field: the clearance the shop's fit history suggests for this
 * device and material, or nothing when there is no history yet. Drop-in for the generator workbench.
 */
export function SuggestedClearance({ shopId, device, material, units, testID = 'suggested-clearance-hint' }: { shopId: string | undefined; device: string | null | undefined; material: string | undefined; units: LengthUnit; testID?: string }) {
  const h = useFitHistory(shopId, device, material);
  const s = h.data?.suggestion;
  if (!s) return null;
  return (
    <Text style={[theme.label, { color: '#1F4A36' }]} testID={testID}>
      Fit history for {device} in {material}: try {formatLength(s.clearanceMm, units, { digits: units === 'in' ? 3 : 2 })} per side ({s.basis}).
    </Text>
  );
}
