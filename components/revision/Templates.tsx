import { StyleSheet, Text, View } from 'react-native';
import { apiUrl } from '../api/upload';
import type { LengthUnits } from '../api/revisions';
import { colors, fonts, radius, space, theme } from '../ui';

export const templateUrl = (revisionId: string, paper: 'a4' | 'letter', units: LengthUnits) => apiUrl(`/revisions/${revisionId}/template.pdf?paper=${paper}&units=${units}`);

const PAPERS = [
  { paper: 'a4', label: 'A4 sheets' },
  { paper: 'letter', label: 'US Letter sheets' },
] as const;

/** Printable 1:1 templates: a cover sheet with calibration bars, then tiles to tape together. */
export function TemplateLinks({ revisionId, units }: { revisionId: string; units: LengthUnits }) {
  return (
    <View style={{ gap: space.sm }} testID="templates">
      <Text style={theme.muted}>
        Print at 100 % (no “fit to page”), then measure the calibration bars on the cover sheet before cutting to the paper: if they are off, the template is too. Figures
        in {units === 'in' ? 'inches' : 'millimetres'}.
      </Text>
      <View style={styles.row}>
        {PAPERS.map((p) => (
          <Text
            key={p.paper}
            {...({ href: templateUrl(revisionId, p.paper, units), hrefAttrs: { download: true, rel: 'noopener' } } as object)}
            accessibilityRole="link"
            aria-label={`Printable template on ${p.label}`}
            style={styles.link}
            testID={`template-${p.paper}`}
          >
            Printable template, {p.label}
          </Text>
        ))}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: space.sm },
  link: { fontFamily: fonts.medium, fontSize: 15, color: colors.pineDark, borderWidth: 1, borderColor: colors.pine, borderRadius: radius.sm, paddingHorizontal: space.md, paddingVertical: space.sm, backgroundColor: colors.pineSoft, textDecorationLine: 'none' },
});
