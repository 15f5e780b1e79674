import { Link, usePathname } from 'expo-router';
import type { ReactNode } from 'react';
import { Pressable, ScrollView, StyleSheet, Text, View } from 'react-native';
import { ShopSwitcher } from '../shop/ShopSwitcher';
import { useShopContext } from '../shop/CurrentShop';
import { colors, fonts, space, theme, useBreakpoint } from '../ui';
import { NAV_ITEMS } from './nav';


/** An entry is current on its own page and on the pages below it (Generators on /generators/…). */
function isActive(pathname: string, href: string): boolean {
  return pathname === href || (href !== '/' && pathname.startsWith(`${href}/`));
}

/** The frame around every screen: brand bar with navigation, then a scrolling content column. */
export function AppFrame({ children, title }: { children: ReactNode; title?: string }) {
  const { isWide } = useBreakpoint();
  const pathname = usePathname();
  const { me } = useShopContext();
  // While it is not known yet who is signed in (undefined), show only the entries for everyone.
  const navItems = NAV_ITEMS.filter((n) => !n.audience || (me === undefined ? false : (n.audience === 'signed-in') === !!me));
  return (
    <View style={theme.screen}>
      <View style={[styles.bar, isWide && styles.barWide]}>
        <Link href="/" asChild>
          <Pressable accessibilityRole="link" style={styles.brand}>
            <View style={styles.mark} />
            <Text style={styles.brandText}>Jigwright</Text>
          </Pressable>
        </Link>
        {/* On phones the entries wrap onto a second row, closer together: every one stays in sight. */}
        <View style={[styles.nav, !isWide && styles.navPhone]} role="navigation">
          {navItems.map((n) => (
            <Link key={n.href} href={n.href as never} style={[styles.navLink, isActive(pathname, n.href) && styles.navActive]}>
              {n.label}
            </Link>
          ))}
        </View>
        <ShopSwitcher />
      </View>
      <ScrollView contentContainerStyle={theme.content}>
        {title ? (
          <Text accessibilityRole="header" style={theme.title}>
            {title}
          </Text>
        ) : null}
        {children}
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    backgroundColor: colors.pineDark,
    paddingHorizontal: space.lg,
    paddingVertical: space.md,
    gap: space.sm,
  },
  barWide: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between' },
  brand: { flexDirection: 'row', alignItems: 'center', gap: space.sm },
  mark: { width: 18, height: 18, borderRadius: 3, borderWidth: 3, borderColor: colors.copper, transform: [{ rotate: '45deg' }] },
  brandText: { fontFamily: fonts.bold, fontSize: 20, color: colors.paper, letterSpacing: 0.5 },
  nav: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg },
  navPhone: { columnGap: space.md, rowGap: 0 },
  navLink: { fontFamily: fonts.medium, fontSize: 15, color: colors.pineSoft, paddingVertical: space.xs },
  navActive: { color: colors.paper, textDecorationLine: 'underline' },
});
