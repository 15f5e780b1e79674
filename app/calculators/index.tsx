import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { AppFrame } from '@/components/layout/AppFrame';
import { CatalogCard } from '@/components/generators/CatalogCard';
import { space, theme } from '@/components/ui';
import { CALCULATORS } from '@/shared/calculators';

// Listed from the shared registry, the same code the results are computed with.
export default function CalculatorList() {
  return (
    <AppFrame title="Shop calculators">
      <Text style={theme.body}>Quick arithmetic for the bench. Lengths in millimetres or inches; angles in degrees.</Text>
      <View style={styles.grid}>
        {CALCULATORS.map((c) => (
          <CatalogCard key={c.id} href={`/calculators/${c.id}`} title={c.title} description={c.description} />
        ))}
      </View>
      <Link href="/generators" style={theme.link}>
        Generators: inserts, jigs and templates
      </Link>
    </AppFrame>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
});
