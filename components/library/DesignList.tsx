import { Link } from 'expo-router';
import { Pressable, StyleSheet, Text, View } from 'react-native';
import type { DesignListItem } from '../../shared/schemas/library';
import type { LibraryFilters } from '../api/designs';
import { colors, fonts, space, theme } from '../ui';
import { formatWhen, KIND_LABEL, StatusBadge, Tag } from './controls';
import { DesignThumb } from './DesignThumb';
import { defaultDir } from './libraryParams';

const designHref = (id: string) => `/designs/${id}` as never;

function Lineage({ item }: { item: DesignListItem }) {
  if (!item.forkedFrom) return null;
  return <Text style={theme.muted}>Forked from {item.forkedFrom.title || 'another design'}</Text>;
}

function Revision({ item }: { item: DesignListItem }) {
  return item.latestRevision > 0 ? (
    <View style={[theme.row, { flexWrap: 'wrap' }]}>
      <Text style={theme.mono}>r{item.latestRevision}</Text>
      <StatusBadge status={item.latestStatus} />
    </View>
  ) : (
    <Text style={theme.muted}>No revision yet</Text>
  );
}

/** Phones: one card per design, the drawing beside the words. `twoAcross` sets them in pairs (wide screens). */
export function DesignCards({ items, onTag, twoAcross = false }: { items: DesignListItem[]; onTag: (tag: string) => void; twoAcross?: boolean }) {
  return (
    <View style={[styles.cards, twoAcross && styles.cardsTwoAcross]} role="list" aria-label="Designs">
      {items.map((d) => (
        <View key={d.id} role="listitem" style={[styles.card, twoAcross && styles.cardHalf]} testID={`design-card-${d.id}`}>
          <Link href={designHref(d.id)} asChild>
            <Pressable accessibilityRole="link" aria-label={`Open ${d.title}`} style={styles.cardMain}>
              <DesignThumb revisionId={d.latestRevisionId} label={d.title} size={76} />
              <View style={styles.cardText}>
                <Text style={styles.title} numberOfLines={2}>
                  {d.title}
                </Text>
                <Text style={theme.muted} numberOfLines={1}>
                  {KIND_LABEL[d.kind]}
                  {d.material ? ` · ${d.material}` : ''} · changed {formatWhen(d.updatedAt)}
                </Text>
                <Revision item={d} />
                <Lineage item={d} />
              </View>
            </Pressable>
          </Link>
          {d.tags.length ? (
            <View style={styles.tags}>
              {d.tags.map((t) => (
                <Tag key={t} label={t} onPress={() => onTag(t)} />
              ))}
            </View>
          ) : null}
        </View>
      ))}
    </View>
  );
}

type SortKey = NonNullable<LibraryFilters['sort']>;

function HeaderCell({ label, sortKey, filters, onSort, flex }: { label: string; sortKey?: SortKey; filters: LibraryFilters; onSort: (s: SortKey, d: 'asc' | 'desc') => void; flex: number }) {
  const sort = filters.sort ?? 'updated';
  const dir = filters.dir ?? defaultDir(sort);
  if (!sortKey) {
    return (
      <View style={[styles.th, { flex }]} role="columnheader">
        <Text style={styles.thText}>{label}</Text>
      </View>
    );
  }
  const active = sort === sortKey;
  const next = active ? (dir === 'asc' ? 'desc' : 'asc') : defaultDir(sortKey);
  const arrow = active ? (dir === 'asc' ? ' ▲' : ' ▼') : '';
  return (
    <Pressable
      role="columnheader"
      aria-sort={active ? (dir === 'asc' ? 'ascending' : 'descending') : 'none'}
      aria-label={`Sort by ${label}`}
      onPress={() => onSort(sortKey, next)}
      style={({ hovered }: { hovered?: boolean }) => [styles.th, { flex }, hovered && styles.thHover]}
    >
      <Text style={[styles.thText, active && styles.thActive]}>
        {label}
        {arrow}
      </Text>
    </Pressable>
  );
}

/** Wide screens: a table whose Title and Changed headers sort it. */
export function DesignTable({
  items,
  filters,
  onSort,
  onTag,
}: {
  items: DesignListItem[];
  filters: LibraryFilters;
  onSort: (s: SortKey, d: 'asc' | 'desc') => void;
  onTag: (tag: string) => void;
}) {
  return (
    <View style={styles.table} role="table" aria-label="Designs">
      <View style={[styles.tr, styles.thead]} role="row">
        <HeaderCell label="Drawing" filters={filters} onSort={onSort} flex={0.9} />
        <HeaderCell label="Title" sortKey="title" filters={filters} onSort={onSort} flex={3.2} />
        <HeaderCell label="Kind" filters={filters} onSort={onSort} flex={1} />
        <HeaderCell label="Material" filters={filters} onSort={onSort} flex={1.4} />
        <HeaderCell label="Newest revision" filters={filters} onSort={onSort} flex={1.8} />
        <HeaderCell label="Changed" sortKey="updated" filters={filters} onSort={onSort} flex={1.3} />
      </View>
      {items.map((d) => (
        <View key={d.id} style={styles.tr} role="row" testID={`design-row-${d.id}`}>
          <View style={[styles.td, { flex: 0.9 }]} role="cell">
            <DesignThumb revisionId={d.latestRevisionId} label={d.title} size={60} />
          </View>
          <View style={[styles.td, { flex: 3.2, gap: 2 }]} role="cell">
            <Link href={designHref(d.id)} style={styles.titleLink}>
              {d.title}
            </Link>
            {d.description ? (
              <Text style={theme.muted} numberOfLines={1}>
                {d.description}
              </Text>
            ) : null}
            <Lineage item={d} />
            {d.tags.length ? (
              <View style={styles.tags}>
                {d.tags.map((t) => (
                  <Tag key={t} label={t} onPress={() => onTag(t)} />
                ))}
              </View>
            ) : null}
          </View>
          <View style={[styles.td, { flex: 1 }]} role="cell">
            <Text style={theme.body}>{KIND_LABEL[d.kind]}</Text>
          </View>
          <View style={[styles.td, { flex: 1.4 }]} role="cell">
            <Text style={theme.body}>{d.material || '—'}</Text>
          </View>
          <View style={[styles.td, { flex: 1.8 }]} role="cell">
            <Revision item={d} />
          </View>
          <View style={[styles.td, { flex: 1.3 }]} role="cell">
            <Text style={theme.body}>{formatWhen(d.updatedAt)}</Text>
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  cards: { gap: space.md },
  cardsTwoAcross: { flexDirection: 'row', flexWrap: 'wrap' },
  cardHalf: { flexBasis: '45%', flexGrow: 1 },
  card: { backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderRadius: 8, padding: space.md, gap: space.sm },
  cardMain: { flexDirection: 'row', gap: space.md, alignItems: 'flex-start' },
  cardText: { flex: 1, gap: 4, minWidth: 0 },
  title: { fontFamily: fonts.bold, fontSize: 16, lineHeight: 21, color: colors.ink },
  tags: { flexDirection: 'row', flexWrap: 'wrap', gap: 4 },
  table: { backgroundColor: colors.surface, borderWidth: 1, borderColor: colors.line, borderRadius: 8, overflow: 'hidden' },
  thead: { backgroundColor: colors.sunk },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.line, alignItems: 'stretch' },
  // A zero basis makes every row share out the width the same way, so the columns line up.
  th: { paddingHorizontal: space.md, paddingVertical: space.sm, justifyContent: 'center', flexBasis: 0 },
  thHover: { backgroundColor: colors.line },
  thText: { fontFamily: fonts.medium, fontSize: 13, color: colors.inkMuted },
  thActive: { color: colors.ink, fontFamily: fonts.bold },
  td: { paddingHorizontal: space.md, paddingVertical: space.sm, justifyContent: 'center', minWidth: 0, flexBasis: 0 },
  titleLink: { fontFamily: fonts.bold, fontSize: 15, lineHeight: 21, color: colors.pine, textDecorationLine: 'underline' },
});
