import { router } from 'expo-router';
import { Text } from 'react-native';
import { AuthPanel } from '@/components/account/AuthPanel';
import { SignedInOnly } from '@/components/account/SignedInOnly';
import { useShopContext } from '@/components/shop/CurrentShop';
import { NewShopForm } from '@/components/shop/ShopNameForm';
import { theme } from '@/components/ui';

export default function NewShopScreen() {
  const { choose } = useShopContext();
  return (
    <AuthPanel title="Start a shop">
      <SignedInOnly here="/shop/new">
        {() => (
          <>
            <Text style={theme.body}>A shop keeps its own library. You will be its owner and can invite the others.</Text>
            <NewShopForm
              onCreated={(shopId) => {
                choose(shopId);
                router.replace('/shop/members');
              }}
            />
          </>
        )}
      </SignedInOnly>
    </AuthPanel>
  );
}
