import { counted } from '../../shared/words';
import { Link } from 'expo-router';
import { Text, View } from 'react-native';
import type { DesignDetail } from '../../shared/schemas/library';
import { space, theme } from '../ui';

/** Where this design came from, and the forks made from it. */
export function Lineage({ design }: { design: DesignDetail }) {
  const from = design.forkedFrom;
  if (!from && design.forks.length === 0) return null;
  return (
    <View style={{ gap: space.xs }} testID="lineage">
      {from ? (
        <Text style={theme.body}>
          Forked from{' '}
          <Link href={`/designs/${from.designId}` as never} style={theme.link}>
            {from.designTitle}
          </Link>
          {from.revisionNumber !== null ? ` r${from.revisionNumber}` : ''} in {from.shopName}
        </Text>
      ) : null}
      {design.forks.length ? (
        <View style={{ gap: 2 }}>
          <Text style={theme.label}>
            Forked {counted(design.forks.length, 'time')}
          </Text>
          {design.forks.map((f) => (
            <Text key={f.designId} style={theme.body}>
              •{' '}
              <Link href={`/designs/${f.designId}` as never} style={theme.link}>
                {f.title}
              </Link>{' '}
              in {f.shopName}
              {f.fromRevisionNumber !== null ? `, from r${f.fromRevisionNumber}` : ''}
            </Text>
          ))}
        </View>
      ) : null}
    </View>
  );
}
