import { IBMPlexMono_400Regular } from '@expo-google-fonts/ibm-plex-mono';
import { IBMPlexSans_400Regular, IBMPlexSans_500Medium, IBMPlexSans_700Bold } from '@expo-google-fonts/ibm-plex-sans';
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { useFonts } from 'expo-font';
import { Stack } from 'expo-router';
import { useState } from 'react';
import { ActivityIndicator, View } from 'react-native';
import { SafeAreaProvider } from 'react-native-safe-area-context';
import { CurrentShopProvider } from '@/components/shop/CurrentShop';
import { colors } from '@/components/ui';

export default function RootLayout() {
  // The fonts ship inside the app bundle; nothing is fetched from a font service.
  const [fontsLoaded] = useFonts({ IBMPlexSans_400Regular, IBMPlexSans_500Medium, IBMPlexSans_700Bold, IBMPlexMono_400Regular });
  // networkMode 'always': offline, a request is tried and fails with words on screen ("No answer from
  // the server…", components/api/client.ts) instead of waiting, paused, behind an endless spinner.
  const [queryClient] = useState(() => new QueryClient({ defaultOptions: { queries: { retry: 1, staleTime: 10_000, networkMode: 'always' }, mutations: { networkMode: 'always' } } }));
  if (!fontsLoaded) {
    return (
      <View style={{ flex: 1, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.paper }}>
        <ActivityIndicator color={colors.pine} />
      </View>
    );
  }
  return (
    <SafeAreaProvider>
      <QueryClientProvider client={queryClient}>
        <CurrentShopProvider>
          <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: colors.paper } }} />
        </CurrentShopProvider>
      </QueryClientProvider>
    </SafeAreaProvider>
  );
}
