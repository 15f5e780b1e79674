import { Text } from 'react-native';
import { SafetyNotes } from '@/components/SafetyNotes';
import { AppFrame } from '@/components/layout/AppFrame';
import { theme } from '@/components/ui';

export default function SafetyPage() {
  return (
    <AppFrame title="Shop safety">
      <Text style={theme.body}>
        Jigwright draws cut files and does the arithmetic; the cutting, the wiring and the judgement stay with you.
      </Text>
      <SafetyNotes />
    </AppFrame>
  );
}
