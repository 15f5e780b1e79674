import { router } from 'expo-router';
import { useState } from 'react';
import { Text, View } from 'react-native';
import type { DesignDetail } from '../../shared/schemas/library';
import { useForkDesign } from '../api/designs';
import { Segmented } from '../forms/Segmented';
import { Button, FieldError, Notice, TextField } from '../library/controls';
import { canEdit, useMyShops } from '../library/shopAccess';
import { space, theme } from '../ui';

/**
 * Copies one revision into a shop where the caller is an editor or owner, as r1 of a new design
 * that remembers where it came from.
 */
export function ForkPanel({ design, initialRevisionId, onClose }: { design: DesignDetail; initialRevisionId: string | undefined; onClose: () => void }) {
  const { shops } = useMyShops();
  const targets = shops.filter((s) => canEdit(s.role));
  const fork = useForkDesign(design.id);
  const [revisionId, setRevisionId] = useState(initialRevisionId ?? design.revisions[0]?.id);
  const [shopId, setShopId] = useState(targets.find((s) => s.id !== design.shopId)?.id ?? targets[0]?.id);
  const [title, setTitle] = useState(design.title);

  if (design.revisions.length === 0) return <Notice tone="info">There is no revision to fork yet.</Notice>;
  if (targets.length === 0) return <Notice tone="info">Forking needs a shop where you are an editor or owner, and you have none.</Notice>;

  const fieldErrors = fork.error && 'fields' in fork.error ? ((fork.error as { fields?: Record<string, string> }).fields ?? {}) : {};
  return (
    <View style={{ gap: space.md }} testID="fork-panel">
      <View style={{ gap: 4 }}>
        <Text style={theme.label}>Revision to fork</Text>
        <Segmented label="Revision to fork" options={design.revisions.map((r) => ({ value: r.id, label: `r${r.number}` }))} value={revisionId} onChange={setRevisionId} />
        {fieldErrors.revisionId ? <FieldError message={fieldErrors.revisionId} /> : null}
      </View>
      <View style={{ gap: 4 }}>
        <Text style={theme.label}>Into the shop</Text>
        <Segmented label="Shop to fork into" options={targets.map((s) => ({ value: s.id, label: s.id === design.shopId ? `${s.name} (this shop)` : s.name }))} value={shopId} onChange={setShopId} />
        {fieldErrors.targetShopId ? <FieldError message={fieldErrors.targetShopId} /> : null}
      </View>
      <TextField label="Title of the fork" value={title} onChangeText={setTitle} error={fieldErrors.title} hint="Left empty, the fork keeps this design’s title." testID="fork-title" />
      <Text style={theme.muted}>The fork starts at r1 as a draft, with the same drawing and fit notes, and links back here.</Text>
      {fork.isError && Object.keys(fieldErrors).length === 0 ? <Notice title="Not forked">{fork.error.message}</Notice> : null}
      <View style={[theme.row, { flexWrap: 'wrap' }]}>
        <Button
          label="Fork"
          busy={fork.isPending}
          disabled={!revisionId || !shopId}
          testID="fork-submit"
          onPress={() =>
            fork.mutate(
              { revisionId: revisionId!, targetShopId: shopId!, title: title.trim() && title.trim() !== design.title ? title.trim() : undefined },
              { onSuccess: (r) => router.push(`/designs/${r.designId}` as never) },
            )
          }
        />
        <Button tone="quiet" label="Cancel" onPress={onClose} />
      </View>
    </View>
  );
}
