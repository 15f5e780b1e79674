import { useState } from 'react';
import { Image, StyleSheet, Text, View } from 'react-native';
import { previewSvgUrl } from '../api/revisions';
import { colors, radius, theme } from '../ui';

/** The latest revision's preview, drawn by the server; a plain placeholder before the first revision. */
export function DesignThumb({ revisionId, size = 72, label }: { revisionId: string | null; size?: number; label: string }) {
  const [failed, setFailed] = useState(false);
  const box = [styles.box, { width: size, height: size }];
  if (!revisionId || failed) {
    return (
      <View style={box} aria-label={revisionId ? `Preview of ${label} could not be loaded` : `${label} has no drawing yet`}>
        <Text style={[theme.muted, styles.none]}>{revisionId ? 'No preview' : 'No drawing yet'}</Text>
      </View>
    );
  }
  return (
    <View style={box}>
      <Image
        source={{ uri: previewSvgUrl(revisionId) }}
        style={{ width: size - 8, height: size - 8 }}
        resizeMode="contain"
        accessibilityLabel={`Drawing of ${label}`}
        onError={() => setFailed(true)}
      />
    </View>
  );
}

const styles = StyleSheet.create({
  box: { borderRadius: radius.sm, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.surface, alignItems: 'center', justifyContent: 'center', overflow: 'hidden' },
  none: { fontSize: 11, lineHeight: 14, textAlign: 'center', paddingHorizontal: 4 },
});
