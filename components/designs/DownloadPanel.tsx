import { useState } from 'react';
import { Pressable, StyleSheet, Text, TextInput, View } from 'react-native';
import type { Caution } from '../../shared/safety';
import type { DesignKind, RevisionInfo } from '../../shared/schemas/library';
import { downloadUrl, useDownloadLink, type DownloadFormat, type LengthUnits } from '../api/revisions';
import { Segmented } from '../forms/Segmented';
import { Button, Notice } from '../library/controls';
import { SafetyNotes } from '../SafetyNotes';
import { colors, fonts, radius, space, theme } from '../ui';

const CHOICES: { key: string; format: DownloadFormat; units: LengthUnits; label: string; note: string }[] = [
  { key: 'dxf-mm', format: 'dxf', units: 'mm', label: 'DXF in millimetres', note: '$INSUNITS 4' },
  { key: 'dxf-in', format: 'dxf', units: 'in', label: 'DXF in inches', note: '$INSUNITS 1' },
  { key: 'svg', format: 'svg', units: 'mm', label: 'SVG drawing', note: 'prints 1:1' },
];

/** Which cautions belong beside this design's files: the router always, the rest by what it is. */
export function cautionsForDesign(kind: DesignKind, revision: RevisionInfo | undefined): Caution['id'][] {
  const ids: Caution['id'][] = ['router'];
  if (kind === 'jig') ids.push('saw');
  if (kind === 'insert' || revision?.fitNotes?.charger) ids.push('charger', 'mains');
  ids.push('dust');
  return ids;
}

/** A plain link the browser saves (the server names the file `<title>-r<N>.<ext>`). */
function FileLink({ href, label, note, testID }: { href: string; label: string; note: string; testID: string }) {
  const anchor = { href, hrefAttrs: { download: true, rel: 'noopener' } } as object;
  return (
    <Text {...anchor} accessibilityRole="link" aria-label={`Download ${label}`} style={styles.file} testID={testID}>
      <Text style={styles.fileLabel}>↓ {label}</Text>
      <Text style={styles.fileNote}> · {note}</Text>
    </Text>
  );
}

function ShareLink({ revision }: { revision: RevisionInfo }) {
  const link = useDownloadLink();
  const [choice, setChoice] = useState(CHOICES[0].key);
  const [copied, setCopied] = useState(false);
  const picked = CHOICES.find((c) => c.key === choice)!;
  return (
    <View style={{ gap: space.sm }}>
      <Text style={theme.label}>Link for a computer that is not signed in</Text>
      <Segmented label="File for the link" options={CHOICES.map((c) => ({ value: c.key, label: c.label }))} value={choice} onChange={(v) => { setChoice(v); link.reset(); setCopied(false); }} />
      <Button
        tone="secondary"
        label="Make a 5-minute link"
        busy={link.isPending}
        onPress={() => {
          setCopied(false);
          link.mutate(
            { revisionId: revision.id, format: picked.format, units: picked.units },
            {
              onSuccess: async (r) => {
                try {
                  await navigator.clipboard.writeText(r.url);
                  setCopied(true);
                } catch {
                  // No clipboard here: the link stays on screen to select and copy.
                }
              },
            },
          );
        }}
      />
      {link.isError ? <Notice title="No link made">{link.error.message}</Notice> : null}
      {link.data ? (
        <View style={{ gap: 4 }}>
          <TextInput value={link.data.url} editable={false} selectTextOnFocus style={styles.url} aria-label={`Link to ${link.data.name}`} />
          <Text style={theme.muted}>
            {copied ? 'Copied. ' : ''}Opens {link.data.name} for {Math.round(link.data.expiresInSeconds / 60)} minutes, then stops working.
          </Text>
        </View>
      ) : null}
    </View>
  );
}

export function DownloadPanel({ revision, kind }: { revision: RevisionInfo; kind: DesignKind }) {
  const [sharing, setSharing] = useState(false);
  return (
    <View style={{ gap: space.md }} testID="downloads">
      <View style={styles.files}>
        {CHOICES.map((c) => (
          <FileLink key={c.key} href={downloadUrl(revision.id, c.format, c.units)} label={c.label} note={c.note} testID={`download-${c.key}`} />
        ))}
      </View>
      <Pressable accessibilityRole="button" aria-expanded={sharing} onPress={() => setSharing(!sharing)}>
        <Text style={theme.link}>{sharing ? 'Hide the link maker' : 'Send to the shop computer by link…'}</Text>
      </Pressable>
      {sharing ? <ShareLink revision={revision} /> : null}
      <SafetyNotes only={cautionsForDesign(kind, revision)} compact />
    </View>
  );
}

const styles = StyleSheet.create({
  files: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  file: {
    borderWidth: 1,
    borderColor: colors.pine,
    backgroundColor: colors.pine,
    borderRadius: radius.sm,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    textDecorationLine: 'none',
  },
  fileLabel: { fontFamily: fonts.medium, fontSize: 15, color: colors.paper },
  fileNote: { fontFamily: fonts.mono, fontSize: 12, color: colors.pineSoft },
  url: { ...theme.mono, borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, padding: space.sm, backgroundColor: colors.sunk },
});
