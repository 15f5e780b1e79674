// The current shop in the top bar; opens into the list of the person's shops to switch between.
// Choosing another shop while a design or revision of a different shop is on show opens the chosen
// shop's library, so the top bar never names one shop over another shop's design.
import { Link, router } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import { colors, fonts, radius, space } from '../ui';
import { useShopContext } from './CurrentShop';
import { ROLE_LABEL } from '../../shared/schemas/auth';

export function ShopSwitcher() {
  const { me, shops, current, choose, screenShopId } = useShopContext();
  const [open, setOpen] = useState(false);
  if (!me) return null;
  if (!current) {
    return (
      <Link href="/shop/new" style={styles.plain}>
        Start a shop
      </Link>
    );
  }
  return (
    <View style={styles.wrap}>
      <Pressable
        accessibilityRole="button"
        aria-expanded={open}
        aria-label={`Current shop: ${current.name}, ${ROLE_LABEL[current.role]}. Switch shop`}
        onPress={() => setOpen((o) => !o)}
        style={({ hovered }: { hovered?: boolean }) => [styles.current, hovered && styles.hover]}
        testID="shop-switcher"
      >
        <Text style={styles.name} numberOfLines={1}>
          {current.name}
        </Text>
        <Text style={styles.role}>{ROLE_LABEL[current.role]}</Text>
        <Text style={styles.caret}>{open ? '▴' : '▾'}</Text>
      </Pressable>
      {open ? (
        <View style={styles.menu} role="menu">
          {shops.map((s) => (
            <Pressable
              key={s.id}
              role="menuitem"
              aria-label={`Switch to ${s.name}`}
              onPress={() => {
                choose(s.id);
                setOpen(false);
                if (screenShopId && screenShopId !== s.id) router.push('/library');
              }}
              style={({ hovered }: { hovered?: boolean }) => [styles.item, s.id === current.id && styles.itemOn, hovered && styles.itemHover]}
            >
              <Text style={[styles.itemText, s.id === current.id && styles.itemTextOn]}>{s.name}</Text>
              <Text style={styles.itemRole}>{ROLE_LABEL[s.role]}</Text>
            </Pressable>
          ))}
          <Link href="/shop/new" style={styles.newShop} onPress={() => setOpen(false)}>
            + Start a new shop
          </Link>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.xs, alignSelf: 'flex-start' },
  current: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: space.sm,
    borderWidth: 1,
    borderColor: colors.pine,
    borderRadius: radius.sm,
    paddingHorizontal: space.md,
    paddingVertical: space.xs,
    maxWidth: 340,
  },
  hover: { backgroundColor: colors.pine },
  name: { fontFamily: fonts.medium, fontSize: 15, color: colors.paper, flexShrink: 1 },
  role: { fontFamily: fonts.regular, fontSize: 12, color: colors.pineDark, backgroundColor: colors.pineSoft, paddingHorizontal: 6, borderRadius: radius.sm },
  caret: { color: colors.pineSoft, fontSize: 12 },
  menu: { backgroundColor: colors.surface, borderRadius: radius.sm, borderWidth: 1, borderColor: colors.line, paddingVertical: space.xs, minWidth: 240 },
  item: { flexDirection: 'row', justifyContent: 'space-between', gap: space.md, paddingHorizontal: space.md, paddingVertical: space.sm },
  itemOn: { borderLeftWidth: 3, borderLeftColor: colors.copper },
  itemHover: { backgroundColor: colors.sunk },
  itemText: { fontFamily: fonts.regular, fontSize: 15, color: colors.ink },
  itemTextOn: { fontFamily: fonts.bold },
  itemRole: { fontFamily: fonts.regular, fontSize: 13, color: colors.inkMuted },
  newShop: { fontFamily: fonts.medium, fontSize: 14, color: colors.pine, paddingHorizontal: space.md, paddingVertical: space.sm },
  plain: { fontFamily: fonts.medium, fontSize: 15, color: colors.pineSoft },
});
