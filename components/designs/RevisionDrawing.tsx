import type makerjs from 'makerjs';
import { useMemo, useState } from 'react';
import { Image, StyleSheet, Text, View } from 'react-native';
import type { RevisionInfo } from '../../shared/schemas/library';
import { previewSvgUrl, useRevisionModel } from '../api/revisions';
import { Drawing } from '../drawing/Drawing';
import { Loading } from '../library/controls';
import { colors, radius, space, theme } from '../ui';
import { modelLayerPaths } from './modelPaths';

/** The selected revision drawn from its stored geometry; the server's preview if that fails. */
export function RevisionDrawing({ revision, units, title }: { revision: RevisionInfo; units: 'mm' | 'in'; title: string }) {
  const model = useRevisionModel(revision.id);
  const paths = useMemo(() => {
    if (!model.data) return null;
    try {
      return modelLayerPaths(model.data as unknown as makerjs.IModel);
    } catch {
      return null;
    }
  }, [model.data]);

  if (model.isLoading) return <Loading label={`Drawing r${revision.number}…`} />;
  if (!paths) return <PreviewImage revisionId={revision.id} label={`${title} r${revision.number}`} />;
  const e = revision.summary.extents;
  return (
    <Drawing
      paths={paths}
      extents={{ width: e.width, height: e.height }}
      units={units}
      features={revision.summary.features}
      accessibilityLabel={`Drawing of ${title} r${revision.number}`}
      testID="revision-drawing"
    />
  );
}

/** Our own generated SVG, shown as an image (it is served with a sandbox CSP). */
export function PreviewImage({ revisionId, label }: { revisionId: string; label: string }) {
  const [failed, setFailed] = useState(false);
  if (failed) return <Text style={theme.muted}>The drawing for {label} could not be loaded.</Text>;
  return (
    <View style={styles.frame}>
      <Image source={{ uri: previewSvgUrl(revisionId) }} style={styles.image} resizeMode="contain" accessibilityLabel={`Drawing of ${label}`} onError={() => setFailed(true)} />
    </View>
  );
}

const styles = StyleSheet.create({
  frame: { borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, backgroundColor: colors.surface, padding: space.sm },
  image: { width: '100%', height: 320 },
});
