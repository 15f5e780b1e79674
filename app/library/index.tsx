import { counted } from '@/shared/words';
import { Text, View } from 'react-native';
import { useDesignList } from '@/components/api/designs';
import { AppFrame } from '@/components/layout/AppFrame';
import { Button, LinkButton, Loading, Notice } from '@/components/library/controls';
import { DesignCards, DesignTable } from '@/components/library/DesignList';
import { activeFilterCount, LibraryFilters } from '@/components/library/LibraryFilters';
import { useLibraryParams } from '@/components/library/libraryParams';
import { WithCurrentShop } from '@/components/library/WithCurrentShop';
import { canEdit, type CurrentShop } from '@/components/library/shopAccess';
import { fonts, space, theme, useBreakpoint } from '@/components/ui';

export default function LibraryScreen() {
  return (
    <AppFrame title="Library">
      <WithCurrentShop what="The library">{(shop) => <ShopLibrary shop={shop} />}</WithCurrentShop>
    </AppFrame>
  );
}

function ShopLibrary({ shop }: { shop: CurrentShop }) {
  const { isWide } = useBreakpoint();
  const [filters, setFilters] = useLibraryParams();
  const list = useDesignList(shop.shopId, filters);
  const items = list.data?.pages.flatMap((p) => p.items) ?? [];
  const filtered = activeFilterCount(filters) > 0 || !!filters.q;

  return (
    <View style={{ gap: space.lg }}>
      <View style={[theme.row, { justifyContent: 'space-between', flexWrap: 'wrap', gap: space.md }]}>
        <Text style={theme.body}>
          Jigs, templates and inserts of <Text style={{ fontFamily: fonts.bold }}>{shop.shopName}</Text>
        </Text>
        <View style={[theme.row, { flexWrap: 'wrap' }]}>
          <LinkButton href="/catalog" tone="secondary" label="Devices and charger pads" />
          {canEdit(shop.role) ? <LinkButton href="/designs/new" label="New design" testID="new-design" /> : null}
        </View>
      </View>
      <LibraryFilters filters={filters} onChange={setFilters} compact={!isWide} />

      {list.isError && !list.data ? (
        <Notice title="The library could not be loaded" action={<Button tone="secondary" label="Try again" onPress={() => list.refetch()} />}>
          {list.error.message}
        </Notice>
      ) : list.isLoading ? (
        <Loading label="Fetching the library…" />
      ) : items.length === 0 ? (
        filtered ? (
          <Notice tone="info" title="Nothing matches" action={<Button tone="secondary" label="Clear search and filters" onPress={() => setFilters({ q: undefined, kind: undefined, status: undefined, material: undefined, tag: undefined })} />}>
            No design in this shop matches that search and those filters.
          </Notice>
        ) : (
          <Notice tone="info" title="The shelf is bare">
            {canEdit(shop.role)
              ? 'No designs yet. Start one with “New design”, then upload a DXF or SVG as its first revision.'
              : 'No designs yet. An editor or owner of the shop can add the first one.'}
          </Notice>
        )
      ) : (
        <View style={{ gap: space.md, opacity: list.isPlaceholderData ? 0.6 : 1 }} aria-busy={list.isFetching}>
          {isWide ? (
            <DesignTable items={items} filters={filters} onSort={(sort, dir) => setFilters({ sort, dir })} onTag={(tag) => setFilters({ tag })} />
          ) : (
            <DesignCards items={items} onTag={(tag) => setFilters({ tag })} />
          )}
          <View style={[theme.row, { flexWrap: 'wrap', justifyContent: 'space-between' }]}>
            <Text style={theme.muted} role="status">
              Showing {counted(items.length, 'design')}
              {list.hasNextPage ? '; there are more' : ''}
            </Text>
            {list.hasNextPage ? (
              <Button tone="secondary" label="Show more" busy={list.isFetchingNextPage} onPress={() => list.fetchNextPage()} testID="library-more" />
            ) : null}
          </View>
          {list.isFetchNextPageError ? <Notice title="The next page did not load">{list.error?.message ?? 'Try again.'}</Notice> : null}
        </View>
      )}
    </View>
  );
}
