// The short line under a design's or revision's title that names the shop it belongs to, so that
// the top bar switching to that shop (useShopOfScreen) is no surprise.
import { Text } from 'react-native';
import { theme } from '../ui';

export function ShopLine({ shopName }: { shopName: string }) {
  return (
    <Text style={theme.body} testID="design-shop">
      In {shopName}
    </Text>
  );
}
