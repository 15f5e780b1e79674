import { Link } from 'expo-router';
import { Text, View } from 'react-native';
import { useDesign } from '../api/designs';
import type { DesignDetail } from '../../shared/schemas/library';
import { space, theme } from '../ui';

/** Links to compare this revision with every other revision of the design and of its fork lineage. */
export function CompareLinks({ revisionId, design }: { revisionId: string; design: DesignDetail }) {
  const related = [
    ...(design.forkedFrom ? [{ id: design.forkedFrom.designId, title: design.forkedFrom.designTitle, shop: design.forkedFrom.shopName, isSource: true }] : []),
    ...design.forks.map((f) => ({ id: f.designId, title: f.title, shop: f.shopName, isSource: false })),
  ];
  return (
    <View style={{ gap: space.sm }} testID="compare-links">
      <DesignRevisions revisionId={revisionId} design={design} heading="This design" />
      {related.map((r) => (
        <RelatedDesign key={r.id} designId={r.id} revisionId={revisionId} isSource={r.isSource} title={r.title} shop={r.shop} />
      ))}
    </View>
  );
}

function RelatedDesign({ designId, revisionId, isSource, title, shop }: { designId: string; revisionId: string; isSource: boolean; title: string; shop: string }) {
  const d = useDesign(designId);
  const heading = `${isSource ? 'Forked from' : 'Fork'}: ${title} (${shop})`;
  if (d.isLoading) return <Text style={theme.muted}>Reading {title}…</Text>;
  // A design in a shop the signed-in person is not in: it exists, but it cannot be compared here.
  if (!d.data) return <Text style={theme.muted}>{heading}: not in one of your shops, so its revisions cannot be compared here.</Text>;
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
