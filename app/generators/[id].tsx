import { Link, useLocalSearchParams } from 'expo-router';
import { Text } from 'react-native';
import { AppFrame } from '@/components/layout/AppFrame';
import { GeneratorWorkbench } from '@/components/generators/GeneratorWorkbench';
import { theme } from '@/components/ui';
import { getGenerator } from '@/shared/generators';

export default function GeneratorScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const generator = typeof id === 'string' ? getGenerator(id) : undefined;
  if (!generator) {
    return (
      <AppFrame title="No such generator">
        <Text style={theme.body}>There is no generator called “{String(id)}”.</Text>
        <Link href="/generators" style={theme.link}>
          See all generators
        </Link>
      </AppFrame>
    );
  }
  return (
    <AppFrame title={generator.title}>
      <Link href="/generators" style={theme.link}>
        ‹ All generators
      </Link>
      <Text style={theme.body}>{generator.description}</Text>
      <GeneratorWorkbench key={generator.id} generator={generator} />
    </AppFrame>
  );
}
