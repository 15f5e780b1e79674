import { Link } from 'expo-router';
import { Text } from 'react-native';
import { AppFrame } from '@/components/layout/AppFrame';
import { theme } from '@/components/ui';

export default function NotFound() {
  return (
    <AppFrame title="Nothing on this bench">
      <Text style={theme.body}>That page does not exist. It may have moved, or the link was mistyped.</Text>
      <Link href="/" style={theme.link}>
        Back to the shop
      </Link>
    </AppFrame>
  );
}
