// Home's second card for someone in a shop: the designs changed last, and the usual ways in.
import { router } from 'expo-router';
import { Text, View } from 'react-native';
import { useDesignList } from '../api/designs';
import { DesignCards } from '../library/DesignList';
import { LinkButton, Loading, Notice } from '../library/controls';
import { space, theme, useBreakpoint } from '../ui';
import { useShopContext } from './CurrentShop';

const RECENT = 4;

export function RecentWork() {
  const { current } = useShopContext();
  const { isWide } = useBreakpoint();
  const list = useDesignList(current?.id, { sort: 'updated', dir: 'desc' }, RECENT);
  if (!current) return null;
  const items = list.data?.pages[0]?.items ?? [];
  const canEdit = current.role !== 'viewer';
  return (
    <View style={theme.card} testID="recent-work">
      <Text accessibilityRole="header" aria-level={2} style={theme.heading}>
        Changed lately in {current.name}
      </Text>
      {list.isLoading ? <Loading label="Reading the library…" /> : null}
      {list.error ? (
        <Notice title="Could not read the library" action={<Text style={theme.link} onPress={() => list.refetch()}>Try again</Text>}>
          {list.error.message}
        </Notice>
      ) : null}
      {list.data && items.length === 0 ? (
        <Text style={theme.body} testID="recent-work-empty">
          Nothing here yet. {canEdit ? 'Draw an insert or a jig from a generator, or upload a DXF or SVG you already cut from.' : 'An editor of this shop can add the first design.'}
        </Text>
      ) : null}
      {items.length ? <DesignCards items={items} twoAcross={isWide} onTag={(tag) => router.push(`/library?tag=${encodeURIComponent(tag)}` as never)} /> : null}
      <View style={[theme.row, { flexWrap: 'wrap', gap: space.sm }]}>
        <LinkButton href="/library" tone="secondary" label="The whole library" testID="recent-work-library" />
        {canEdit ? <LinkButton href="/generators/charger-insert" tone="secondary" label="Draw a charger insert" testID="recent-work-charger-insert" /> : null}
      </View>
    </View>
  );
}
