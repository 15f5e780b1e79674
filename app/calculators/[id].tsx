import { Link, useLocalSearchParams } from 'expo-router';
import { Text } from 'react-native';
import { CalculatorWorkbench } from '@/components/calculators/CalculatorWorkbench';
import { AppFrame } from '@/components/layout/AppFrame';
import { NothingHere } from '@/components/layout/NothingHere';
import { theme } from '@/components/ui';
import { getCalculator } from '@/shared/calculators';

export default function CalculatorScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const calculator = typeof id === 'string' ? getCalculator(id) : undefined;
  if (!calculator) {
    return <NothingHere title="No such calculator" message={`There is no calculator called “${String(id)}”.`} back={{ href: '/calculators', label: 'See all calculators' }} />;
  }
  return (
    <AppFrame title={calculator.title}>
      <Link href="/calculators" style={theme.link}>
        ‹ All calculators
      </Link>
      <Text style={theme.body}>{calculator.description}</Text>
      <CalculatorWorkbench key={calculator.id} calculator={calculator} />
    </AppFrame>
  );
}
