import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { useHealth } from '@/components/api/health';
import { AppFrame } from '@/components/layout/AppFrame';
import { RecentWork } from '@/components/shop/RecentWork';
import { YourShopCard } from '@/components/shop/YourShopCard';
import { colors, radius, space, theme } from '@/components/ui';

function StatusPill({ label, up, slow }: { label: string; up: boolean | undefined; slow?: boolean }) {
  const word = up === undefined ? '…' : up ? 'up' : slow ? 'slow to answer' : 'down';
  return (
    <View style={[styles.pill, { backgroundColor: up ? colors.pineSoft : up === false ? colors.dangerSoft : colors.sunk }]}>
      <Text style={theme.label}>
        {label}: {word}
      </Text>
    </View>
  );
}

export default function Home() {
  const health = useHealth();
  return (
    <AppFrame title="Your shop's jigs, templates and inserts">
      <YourShopCard />
      <RecentWork />
      <View style={theme.card}>
        <Text style={theme.body}>
          Every cut file in one place, tied to the device, charger, stock and bit it was made for — with numbered revisions
          you can compare, fork and send to the router as DXF in the right units.
        </Text>
      </View>
      <View style={theme.card} testID="health-card">
        <Text style={theme.heading}>Service status</Text>
        {health.isError ? (
          <Text style={[theme.body, { color: colors.danger }]}>Cannot reach the server: {health.error.message}</Text>
        ) : (
          <View style={[theme.row, { flexWrap: 'wrap' }]}>
            <StatusPill label="Database" up={health.data?.db} slow={health.data?.slow?.includes('db')} />
            <StatusPill label="File store" up={health.data?.objects} slow={health.data?.slow?.includes('objects')} />
            <StatusPill label="Mail" up={health.data?.mail} slow={health.data?.slow?.includes('mail')} />
          </View>
        )}
      </View>
      <Link href="/help/safety" style={theme.link}>
        Read the shop safety notes
      </Link>
    </AppFrame>
  );
}

const styles = StyleSheet.create({
  pill: { paddingHorizontal: space.md, paddingVertical: space.xs, borderRadius: radius.lg },
});
