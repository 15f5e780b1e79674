import { useEffect, useRef, useState } from 'react';
import { StyleSheet, Text, View } from 'react-native';
import { DESIGN_KINDS, LIBRARY_SORTS, REVISION_STATUSES, STATUS_LABEL } from '../../shared/schemas/library';
import type { LibraryFilters as Filters } from '../api/designs';
import { Segmented } from '../forms/Segmented';
import { space, theme } from '../ui';
import { Button, KIND_LABEL, TextField } from './controls';
import { defaultDir, SORT_LABEL } from './libraryParams';

const SEARCH_DELAY_MS = 300;

/** Typing waits a moment before it searches, so each key press does not send a request. */
function useDebounced(value: string, onSettle: (v: string) => void) {
  const settle = useRef(onSettle);
  settle.current = onSettle;
  const first = useRef(true);
  useEffect(() => {
    if (first.current) {
      first.current = false;
      return;
    }
    const t = setTimeout(() => settle.current(value), SEARCH_DELAY_MS);
    return () => clearTimeout(t);
  }, [value]);
}

export function activeFilterCount(f: Filters): number {
  return [f.kind, f.status, f.material, f.tag].filter(Boolean).length;
}

export function LibraryFilters({ filters, onChange, compact }: { filters: Filters; onChange: (patch: Partial<Filters>) => void; compact: boolean }) {
  const [text, setText] = useState(filters.q ?? '');
  const [material, setMaterial] = useState(filters.material ?? '');
  const [tag, setTag] = useState(filters.tag ?? '');
  const [open, setOpen] = useState(!compact);

  // Follow outside changes (a tag clicked on a card, "Clear filters") into the boxes.
  useEffect(() => setText(filters.q ?? ''), [filters.q]);
  useEffect(() => setMaterial(filters.material ?? ''), [filters.material]);
  useEffect(() => setTag(filters.tag ?? ''), [filters.tag]);

  useDebounced(text, (v) => v.trim() !== (filters.q ?? '') && onChange({ q: v.trim() }));
  useDebounced(material, (v) => v.trim() !== (filters.material ?? '') && onChange({ material: v.trim() }));
  useDebounced(tag, (v) => v.trim().toLowerCase() !== (filters.tag ?? '') && onChange({ tag: v.trim().toLowerCase() }));

  const sort = filters.sort ?? 'updated';
  const dir = filters.dir ?? defaultDir(sort);
  const count = activeFilterCount(filters);

  return (
    <View style={styles.wrap} aria-label="Search and filter the library">
      <TextField
        label="Search"
        value={text}
        onChangeText={setText}
        placeholder="Words from titles, tags or notes"
        hint="Every word must match the start of a word, so “phon ins” finds “phone insert”."
        returnKeyType="search"
        onSubmitEditing={() => onChange({ q: text.trim() })}
        testID="library-search"
      />
      {compact ? (
        <Button
          tone="secondary"
          label={open ? 'Hide filters' : count ? `Filters and sort (${count} on)` : 'Filters and sort'}
          onPress={() => setOpen(!open)}
          testID="library-filters-toggle"
        />
      ) : null}
      {open || !compact ? (
        <View style={styles.filters}>
          <View style={compact ? styles.stack : styles.line}>
            <View style={styles.group}>
              <Text style={theme.label}>Kind</Text>
              <Segmented
                label="Kind"
                options={[{ value: '', label: 'All' }, ...DESIGN_KINDS.map((k) => ({ value: k, label: KIND_LABEL[k] }))]}
                value={filters.kind ?? ''}
                onChange={(v) => onChange({ kind: (v || undefined) as Filters['kind'] })}
              />
            </View>
            <View style={styles.group}>
              <Text style={theme.label}>Status of the newest revision</Text>
              <Segmented
                label="Status"
                options={[{ value: '', label: 'Any' }, ...REVISION_STATUSES.map((s) => ({ value: s, label: STATUS_LABEL[s] }))]}
                value={filters.status ?? ''}
                onChange={(v) => onChange({ status: (v || undefined) as Filters['status'] })}
              />
            </View>
          </View>
          <View style={compact ? styles.stack : styles.line}>
            <TextField label="Material" value={material} onChangeText={setMaterial} placeholder="e.g. walnut ply" width={compact ? '100%' : 200} testID="library-material" />
            <TextField label="Tag" value={tag} onChangeText={setTag} placeholder="e.g. charger" width={compact ? '100%' : 200} autoCapitalize="none" testID="library-tag" />
            <View style={styles.group}>
              <Text style={theme.label}>Sort by</Text>
              <View style={[theme.row, { flexWrap: 'wrap' }]}>
                <Segmented
                  label="Sort by"
                  options={LIBRARY_SORTS.map((s) => ({ value: s, label: SORT_LABEL[s] }))}
                  value={sort}
                  onChange={(s) => onChange({ sort: s, dir: undefined })}
                />
                <Segmented
                  label="Order"
                  options={
                    sort === 'title'
                      ? [
                          { value: 'asc', label: 'A → Z' },
                          { value: 'desc', label: 'Z → A' },
                        ]
                      : [
                          { value: 'desc', label: 'Newest first' },
                          { value: 'asc', label: 'Oldest first' },
                        ]
                  }
                  value={dir}
                  onChange={(d) => onChange({ dir: d === defaultDir(sort) ? undefined : (d as Filters['dir']) })}
                />
              </View>
            </View>
          </View>
          {count || filters.q ? (
            <Button
              tone="quiet"
              label="Clear search and filters"
              onPress={() => onChange({ q: undefined, kind: undefined, status: undefined, material: undefined, tag: undefined })}
            />
          ) : null}
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: space.md },
  filters: { gap: space.md },
  group: { gap: 4, maxWidth: '100%' },
  // Groups sit side by side while they fit and wrap under each other on a phone.
  line: { flexDirection: 'row', flexWrap: 'wrap', gap: space.lg, alignItems: 'flex-end' },
  // On a phone each group takes the full width, so its buttons wrap inside it.
  stack: { gap: space.md },
});
