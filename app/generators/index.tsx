import { Link } from 'expo-router';
import { StyleSheet, Text, View } from 'react-native';
import { AppFrame } from '@/components/layout/AppFrame';
import { CatalogCard } from '@/components/generators/CatalogCard';
import { space, theme } from '@/components/ui';
import { GENERATORS } from '@/shared/generators';

const KIND_LABEL = { insert: 'Insert', jig: 'Jig', template: 'Template' } as const;

// Listed from the shared registry, like the previews: the same code the server lists from, in the bundle.
export default function GeneratorList() {
  return (
    <AppFrame title="Generators">
      <Text style={theme.body}>Set the sizes and get a cut drawing with a fit report. Nothing is saved until you save it.</Text>
      <View style={styles.grid}>
        {GENERATORS.map((g) => (
          <CatalogCard key={g.id} href={`/generators/${g.id}`} title={g.title} tag={KIND_LABEL[g.kind]} description={g.description} detail={`${g.params.length} settings`} />
        ))}
      </View>
      <Link href="/calculators" style={theme.link}>
        Shop calculators: wood movement, tapers, miters
      </Link>
    </AppFrame>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
});
