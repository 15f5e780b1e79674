import { router } from 'expo-router';
import { Text, View } from 'react-native';
import { useCreateDesign } from '@/components/api/designs';
import { DesignForm } from '@/components/designs/DesignForm';
import { AppFrame } from '@/components/layout/AppFrame';
import { Notice } from '@/components/library/controls';
import { WithCurrentShop } from '@/components/library/WithCurrentShop';
import { canEdit, type CurrentShop } from '@/components/library/shopAccess';
import { fonts, space, theme } from '@/components/ui';

export default function NewDesignScreen() {
  return (
    <AppFrame title="New design">
      <WithCurrentShop what="A new design">{(shop) => <NewDesign shop={shop} />}</WithCurrentShop>
    </AppFrame>
  );
}

function NewDesign({ shop }: { shop: CurrentShop }) {
  const create = useCreateDesign(shop.shopId);
  if (!canEdit(shop.role)) {
    return <Notice tone="info" title="Editors and owners add designs">You are a viewer in {shop.shopName}. Ask an owner to make you an editor to add designs.</Notice>;
  }
  return (
    <View style={[theme.card, { gap: space.lg, maxWidth: 720 }]}>
      <Text style={theme.body}>
        The design goes into the library of <Text style={{ fontFamily: fonts.bold }}>{shop.shopName}</Text>. Its cut files come next, as numbered revisions.
      </Text>
      <DesignForm
        mode="create"
        submitLabel="Create design"
        onCancel={() => (router.canGoBack() ? router.back() : router.replace('/library' as never))}
        onSubmit={async (values) => {
          const d = await create.mutateAsync(values);
          router.replace(`/designs/${d.id}` as never);
        }}
      />
    </View>
  );
}
