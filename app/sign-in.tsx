import { zodResolver } from '@hookform/resolvers/zod';
import { Link, router, useLocalSearchParams } from 'expo-router';
import { useForm } from 'react-hook-form';
import { Text, View } from 'react-native';
import { useSignIn } from '@/components/api/auth';
import { AuthPanel } from '@/components/account/AuthPanel';
import { FormField } from '@/components/account/FormField';
import { safeNext } from '@/components/account/nextPath';
import { useSubmit } from '@/components/account/useSubmit';
import { Button, Notice } from '@/components/library/controls';
import { useShopContext } from '@/components/shop/CurrentShop';
import { space, theme } from '@/components/ui';
import { SignIn } from '@/shared/schemas/auth';

export default function SignInScreen() {
  const params = useLocalSearchParams<{ next?: string; email?: string }>();
  const next = safeNext(params.next);
  const { me } = useShopContext();
  const signIn = useSignIn();
  const form = useForm({
    resolver: zodResolver(SignIn),
    defaultValues: { email: typeof params.email === 'string' ? params.email : '', password: '' },
  });
  const { control } = form;
  const { submit, formError } = useSubmit(form, ['email', 'password'], async (values) => {
    await signIn.mutateAsync(values);
    router.replace(next as never);
  });
  const withNext = (path: string) => (next !== '/' ? `${path}?next=${encodeURIComponent(next)}` : path);

  return (
    <AuthPanel title="Sign in">
      {me ? <Notice tone="info">{`You are signed in as ${me.user.email}. Signing in again switches account.`}</Notice> : null}
      <FormField control={control} name="email" label="E-mail" inputMode="email" autoComplete="email" onSubmitEditing={submit} />
      <FormField control={control} name="password" label="Password" secureTextEntry autoComplete="current-password" onSubmitEditing={submit} />
      {formError ? <Notice title="Not signed in">{formError}</Notice> : null}
      <View style={[theme.row, { flexWrap: 'wrap', gap: space.lg }]}>
        <Button label="Sign in" onPress={submit} busy={signIn.isPending} testID="sign-in-submit" />
        <Link href={withNext('/reset') as never} style={theme.link}>
          Forgot the password?
        </Link>
      </View>
      <Text style={theme.muted}>
        New here?{' '}
        <Link href={withNext('/sign-up') as never} style={theme.link}>
          Create an account
        </Link>
      </Text>
    </AuthPanel>
  );
}
