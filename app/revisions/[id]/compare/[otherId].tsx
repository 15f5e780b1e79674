import { useLocalSearchParams } from 'expo-router';
import { ApiError } from '@/components/api/client';
import { useComparison } from '@/components/api/compare';
import { useDesign } from '@/components/api/designs';
import { CompareView } from '@/components/compare/CompareView';
import { AppFrame } from '@/components/layout/AppFrame';
import { Button, LinkButton, Loading, Notice } from '@/components/library/controls';
import { useShopOfScreen } from '@/components/shop/CurrentShop';

export default function CompareScreen() {
  const { id, otherId } = useLocalSearchParams<{ id: string; otherId: string }>();
  const cmp = useComparison(id, otherId);
  // The two may be in different shops (a fork beside its source): the top bar follows the first,
  // the revision this comparison was opened from.
  const first = useDesign(cmp.data?.a.designId);
  useShopOfScreen(first.data?.shopId);
  if (cmp.isLoading) {
    return (
      <AppFrame title="Compare">
        <Loading label="Comparing the two revisions…" />
      </AppFrame>
    );
  }
  if (cmp.isError || !cmp.data) {
    const e = cmp.error;
    const missing = e instanceof ApiError && (e.status === 404 || e.status === 400);
    const signedOut = e instanceof ApiError && e.status === 401;
    return (
      <AppFrame title="Compare">
        <Notice
          title={missing ? 'One of the revisions is not here' : signedOut ? 'Sign in first' : 'The comparison could not be made'}
          action={missing || signedOut ? <LinkButton href={signedOut ? '/sign-in' : `/revisions/${id}`} tone="secondary" label={signedOut ? 'Sign in' : 'Back to the revision'} /> : <Button tone="secondary" label="Try again" onPress={() => cmp.refetch()} />}
        >
          {missing ? 'A revision does not exist, or belongs to a shop you are not a member of.' : (e?.message ?? 'Unknown error')}
        </Notice>
      </AppFrame>
    );
  }
  return (
    <AppFrame title={`Compare r${cmp.data.a.number} with r${cmp.data.b.number}`}>
      <CompareView data={cmp.data} />
    </AppFrame>
  );
}
