import { useLocalSearchParams } from 'expo-router';
import { ApiError } from '@/components/api/client';
import { useDesign } from '@/components/api/designs';
import { useRevision } from '@/components/api/revisions';
import { AppFrame } from '@/components/layout/AppFrame';
import { Button, LinkButton, Loading, Notice } from '@/components/library/controls';
import { RevisionPage } from '@/components/revision/RevisionPage';
import { useShopOfScreen } from '@/components/shop/CurrentShop';

export default function RevisionScreen() {
  const { id } = useLocalSearchParams<{ id: string }>();
  const revision = useRevision(id);
  const design = useDesign(revision.data?.designId);
  useShopOfScreen(design.data?.shopId);
  if (revision.isLoading || (revision.data && design.isLoading)) {
    return (
      <AppFrame title="Revision">
        <Loading label="Fetching the revision…" />
      </AppFrame>
    );
  }
  const failed = revision.error ?? design.error;
  if (failed || !revision.data || !design.data) {
    const missing = failed instanceof ApiError && (failed.status === 404 || failed.status === 400);
    const signedOut = failed instanceof ApiError && failed.status === 401;
    return (
      <AppFrame title={missing ? 'Revision not found' : 'Revision'}>
        <Notice
          title={missing ? 'No such revision here' : signedOut ? 'Sign in first' : 'The revision could not be loaded'}
          action={
            missing || signedOut ? (
              <LinkButton href={signedOut ? '/sign-in' : '/library'} tone="secondary" label={signedOut ? 'Sign in' : 'Back to the library'} />
            ) : (
              <Button tone="secondary" label="Try again" onPress={() => (revision.error ? revision.refetch() : design.refetch())} />
            )
          }
        >
          {missing ? 'It does not exist, or it belongs to a shop you are not a member of.' : (failed?.message ?? 'Unknown error')}
        </Notice>
      </AppFrame>
    );
  }
  return (
    <AppFrame title={`${revision.data.designTitle} r${revision.data.number}`}>
      <RevisionPage revision={revision.data} design={design.data} />
    </AppFrame>
  );
}
