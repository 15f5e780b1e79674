import { zodResolver } from '@hookform/resolvers/zod';
import { Link, router, useLocalSearchParams } from 'expo-router';
import { useForm } from 'react-hook-form';
import { Text } from 'react-native';
import { useSignUp } from '@/components/api/auth';
import { AuthPanel } from '@/components/account/AuthPanel';
import { FormField } from '@/components/account/FormField';
import { safeNext } from '@/components/account/nextPath';
import { useSubmit } from '@/components/account/useSubmit';
import { Button, Notice } from '@/components/library/controls';
import { theme } from '@/components/ui';
import { PASSWORD_MIN, SignUp } from '@/shared/schemas/auth';

export default function SignUpScreen() {
  const params = useLocalSearchParams<{ next?: string; email?: string }>();
  const next = safeNext(params.next);
  const signUp = useSignUp();
  const form = useForm({
    resolver: zodResolver(SignUp),
    defaultValues: { name: '', email: typeof params.email === 'string' ? params.email : '', password: '' },
  });
  const { control } = form;
  const { submit, formError } = useSubmit(form, ['name', 'email', 'password'], async (values) => {
    await signUp.mutateAsync(values);
    router.replace(next as never);
  });

  return (
    <AuthPanel title="Create an account">
      <Text style={theme.body}>An account is yours; shops invite it in. You can also start a shop of your own once you are in.</Text>
      <FormField control={control} name="name" label="Your name" autoComplete="name" autoCapitalize="words" onSubmitEditing={submit} />
      <FormField control={control} name="email" label="E-mail" inputMode="email" autoComplete="email" onSubmitEditing={submit} />
      <FormField
        control={control}
        name="password"
        label="Password"
        secureTextEntry
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters. A few unrelated words work well.`}
        onSubmitEditing={submit}
      />
      {formError ? <Notice title="Account not created">{formError}</Notice> : null}
      <Button label="Create account" onPress={submit} busy={signUp.isPending} testID="sign-up-submit" />
      <Text style={theme.muted}>
        Already have one?{' '}
        <Link href={(next !== '/' ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in') as never} style={theme.link}>
          Sign in
        </Link>
      </Text>
    </AuthPanel>
  );
}
