import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space } from '../ui';

export interface SegmentOption<V extends string | number> {
  value: V;
  label: string;
}

/** A row of mutually exclusive buttons (a radio group), wrapping on narrow screens. */
export function Segmented<V extends string | number>({
  options,
  value,
  onChange,
  label,
  disabled = false,
  invalid = false,
}: {
  options: SegmentOption<V>[];
  value: V | undefined;
  onChange: (v: V) => void;
  /** Accessible name of the group. */
  label: string;
  disabled?: boolean;
  invalid?: boolean;
}) {
  return (
    <View accessibilityRole="radiogroup" aria-label={label} style={[styles.group, invalid && styles.invalid]}>
      {options.map((o) => {
        const selected = o.value === value;
        return (
          <Pressable
            key={String(o.value)}
            accessibilityRole="radio"
            aria-checked={selected}
            aria-label={o.label}
            disabled={disabled}
            onPress={() => onChange(o.value)}
            style={({ hovered }: { hovered?: boolean }) => [styles.option, selected && styles.selected, hovered && !selected && styles.hovered]}
          >
            <Text style={[styles.text, selected && styles.textSelected]}>{o.label}</Text>
          </Pressable>
        );
      })}
    </View>
  );
}

const styles = StyleSheet.create({
  group: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignSelf: 'flex-start',
    // A long label wraps inside its option rather than running past the group's container.
    maxWidth: '100%',
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.sm,
    backgroundColor: colors.sunk,
    padding: 2,
    gap: 2,
  },
  invalid: { borderColor: colors.danger },
  option: { paddingHorizontal: space.md, paddingVertical: 6, borderRadius: 3, minHeight: 32, justifyContent: 'center', flexShrink: 1 },
  hovered: { backgroundColor: colors.paper },
  // Selected reads by weight and a dark fill, not only by hue.
  selected: { backgroundColor: colors.pineDark },
  text: { fontFamily: fonts.medium, fontSize: 14, color: colors.ink },
  textSelected: { color: colors.paper, fontFamily: fonts.bold },
});
