import { Text } from 'react-native';
import { useMembers } from '@/components/api/shops';
import { SignedInOnly } from '@/components/account/SignedInOnly';
import { AppFrame } from '@/components/layout/AppFrame';
import { Button, LinkButton, Loading, Notice, Section } from '@/components/library/controls';
import { useShopContext } from '@/components/shop/CurrentShop';
import { InviteForm } from '@/components/shop/InviteForm';
import { MemberRoster } from '@/components/shop/MemberRoster';
import { PendingInvites } from '@/components/shop/PendingInvites';
import { ShopArchive } from '@/components/shop/ShopArchive';
import { RenameShopForm } from '@/components/shop/ShopNameForm';
import { theme } from '@/components/ui';
import { ROLE_WITH_ARTICLE, type Me, type ShopSummary } from '@/shared/schemas/auth';

export default function MembersScreen() {
  return (
    <AppFrame title="Members">
      <SignedInOnly here="/shop/members">{(me) => <ForCurrentShop me={me} />}</SignedInOnly>
    </AppFrame>
  );
}

function ForCurrentShop({ me }: { me: Me }) {
  const { current } = useShopContext();
  if (!current) {
    return (
      <Notice tone="info" title="No shop yet">
        <Text style={theme.body}>You are not in a shop. Start one, or open the invite link a shop owner mailed you.</Text>
        <LinkButton href="/shop/new" label="Start a shop" />
      </Notice>
    );
  }
  return <ShopMembers key={current.id} shop={current} me={me} />;
}

function ShopMembers({ shop, me }: { shop: ShopSummary; me: Me }) {
  const members = useMembers(shop.id);
  const isOwner = shop.role === 'owner';
  return (
    <>
      <Text style={theme.body}>
        {shop.name}: you are {ROLE_WITH_ARTICLE[shop.role]} here.{isOwner ? '' : ' Only owners invite people and change roles.'}
      </Text>
      <Section title="People in this shop" testID="members-section">
        {members.isLoading ? (
          <Loading label="Loading members…" />
        ) : members.isError ? (
          <Notice title="Members could not be loaded" action={<Button tone="secondary" label="Try again" onPress={() => members.refetch()} />}>
            {members.error.message}
          </Notice>
        ) : (
          <MemberRoster shopId={shop.id} members={members.data ?? []} canManage={isOwner} myUserId={me.user.id} />
        )}
      </Section>
      {isOwner ? (
        <>
          <Section title="Invite someone">
            <InviteForm shopId={shop.id} shopName={shop.name} />
          </Section>
          <Section title="Open invites">
            <PendingInvites shopId={shop.id} />
          </Section>
          <Section title="Shop name">
            <RenameShopForm shopId={shop.id} name={shop.name} />
          </Section>
          <Section title="Shop archive" testID="archive-section">
            <ShopArchive shopId={shop.id} shopName={shop.name} />
          </Section>
        </>
      ) : null}
    </>
  );
}
