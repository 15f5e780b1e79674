import { Link } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space, theme } from '../ui';

/** A linked card in a list of generators or calculators: a small tag, the title, what it makes. */
export function CatalogCard({ href, title, tag, description, detail }: { href: string; title: string; tag?: string; description: string; detail?: string }) {
  return (
    <Link href={href as never} asChild>
      {/* One flat style object: Link's slot passes neither style functions nor arrays through. */}
      <Pressable accessibilityRole="link" aria-label={title} style={CARD_STYLE}>
        <View style={styles.head}>
          <Text style={theme.heading}>{title}</Text>
          {tag ? <Text style={styles.tag}>{tag}</Text> : null}
        </View>
        <Text style={theme.body}>{description}</Text>
        {detail ? <Text style={theme.muted}>{detail}</Text> : null}
      </Pressable>
    </Link>
  );
}

const styles = StyleSheet.create({
  card: { flexBasis: 320, flexGrow: 1, flexShrink: 1, minWidth: 0 },
  head: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm },
  tag: {
    fontFamily: fonts.medium,
    fontSize: 12,
    color: colors.pineDark,
    backgroundColor: colors.pineSoft,
    paddingHorizontal: space.sm,
    paddingVertical: 2,
    borderRadius: radius.sm,
    textTransform: 'uppercase',
    letterSpacing: 0.6,
  },
});

const CARD_STYLE = StyleSheet.flatten([theme.card, styles.card]);
