import type { ReactNode } from 'react';
import { StyleSheet, View } from 'react-native';
import { AppFrame } from '../layout/AppFrame';
import { space, theme } from '../ui';

/** The frame of the account screens: one narrow card, comfortable on a phone and on a desk. */
export function AuthPanel({ title, children }: { title: string; children: ReactNode }) {
  return (
    <AppFrame title={title}>
      <View style={[theme.card, styles.panel]}>{children}</View>
    </AppFrame>
  );
}

const styles = StyleSheet.create({
  panel: { width: '100%', maxWidth: 460, gap: space.md },
});
