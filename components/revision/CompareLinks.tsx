import { Link } from 'expo-router';
import { Text, View } from 'react-native';
import { useDesign } from '../api/designs';
import type { DesignDetail } from '../../shared/schemas/library';
import { space, theme } from '../ui';

/** Links to compare this revision with every other revision of the design and of its fork lineage. */
export function CompareLinks({ revisionId, design }: { revisionId: string; design: DesignDetail }) {
  const related = [...(design.forkedFrom ? [design.forkedFrom.designId] : []), ...design.forks.map((f) => f.designId)];
  return (
    <View style={{ gap: space.sm }} testID="compare-links">
      <DesignRevisions revisionId={revisionId} design={design} heading="This design" />
      {related.map((id) => (
        <RelatedDesign key={id} designId={id} revisionId={revisionId} isSource={id === design.forkedFrom?.designId} />
      ))}
    </View>
  );
}

function RelatedDesign({ designId, revisionId, isSource }: { designId: string; revisionId: string; isSource: boolean }) {
  const d = useDesign(designId);
  if (d.isLoading) return <Text style={theme.muted}>Reading the related design…</Text>;
  // A fork in a shop the viewer is not in: it exists, but there is nothing here to compare with.
  if (!d.data) return null;
  return <DesignRevisions revisionId={revisionId} design={d.data} heading={`${isSource ? 'Forked from' : 'Fork'}: ${d.data.title} (${d.data.shopName})`} />;
}

function DesignRevisions({ revisionId, design, heading }: { revisionId: string; design: DesignDetail; heading: string }) {
  const others = design.revisions.filter((r) => r.id !== revisionId);
  if (others.length === 0) return null;
  return (
    <View style={{ gap: 2 }}>
      <Text style={theme.label}>{heading}</Text>
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', columnGap: space.md, rowGap: 2 }}>
        {[...others].sort((a, b) => b.number - a.number).map((r) => (
          <Link key={r.id} href={`/revisions/${revisionId}/compare/${r.id}`} style={theme.link} aria-label={`Compare with ${design.title} r${r.number}`}>
            r{r.number}
          </Link>
        ))}
      </View>
    </View>
  );
}
