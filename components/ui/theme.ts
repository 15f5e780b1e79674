import { StyleSheet } from 'react-native';
import { colors, radius, space, type } from './tokens';

/** Shared styles built from the tokens; screens compose these instead of inventing their own. */
export const theme = StyleSheet.create({
  screen: { flex: 1, backgroundColor: colors.paper },
  content: { padding: space.lg, gap: space.lg, width: '100%', maxWidth: 1200, alignSelf: 'center' },
  card: {
    backgroundColor: colors.surface,
    borderRadius: radius.md,
    borderWidth: 1,
    borderColor: colors.line,
    padding: space.lg,
    gap: space.sm,
  },
  title: { ...type.title, color: colors.ink },
  heading: { ...type.heading, color: colors.ink },
  body: { ...type.body, color: colors.ink },
  muted: { ...type.small, color: colors.inkMuted },
  label: { ...type.label, color: colors.ink },
  mono: { ...type.mono, color: colors.ink },
  row: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  link: { ...type.body, color: colors.pine, textDecorationLine: 'underline' },
});
