import { zodResolver } from '@hookform/resolvers/zod';
import { Link, useLocalSearchParams } from 'expo-router';
import { useForm } from 'react-hook-form';
import { Text } from 'react-native';
import { useResetPassword } from '@/components/api/auth';
import { AuthPanel } from '@/components/account/AuthPanel';
import { FormField } from '@/components/account/FormField';
import { useSubmit } from '@/components/account/useSubmit';
import { Button, LinkButton, Notice } from '@/components/library/controls';
import { theme } from '@/components/ui';
import { PASSWORD_MIN, ResetPassword } from '@/shared/schemas/auth';

export default function ChooseNewPasswordScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const reset = useResetPassword();
  const form = useForm({
    resolver: zodResolver(ResetPassword),
    defaultValues: { token: typeof token === 'string' ? token : '', password: '' },
  });
  const { control } = form;
  const { submit, formError } = useSubmit(
    form,
    ['password'],
    (values) => reset.mutateAsync(values),
    // The token is not a visible field: say what is wrong with the link itself.
    (errors) => errors.token?.message ?? null,
  );

  if (reset.isSuccess) {
    return (
      <AuthPanel title="Password changed">
        <Notice tone="ok">{reset.data.message}</Notice>
        <Text style={theme.body}>Every device that was signed in to this account has been signed out.</Text>
        <LinkButton href="/sign-in" label="Sign in" />
      </AuthPanel>
    );
  }
  return (
    <AuthPanel title="Choose a new password">
      <FormField
        control={control}
        name="password"
        label="New password"
        secureTextEntry
        autoComplete="new-password"
        hint={`At least ${PASSWORD_MIN} characters.`}
        onSubmitEditing={submit}
      />
      {formError ? (
        <Notice title="Password not changed">
          <Text style={theme.body}>{formError}</Text>
          <Link href="/reset" style={theme.link}>
            Ask for a new link
          </Link>
        </Notice>
      ) : null}
      <Button label="Save the new password" onPress={submit} busy={reset.isPending} />
    </AuthPanel>
  );
}
