// The app's entry: the zod set-up must run before any schema module, then Expo Router's own entry.
import './components/zodJitless';
import 'expo-router/entry';
