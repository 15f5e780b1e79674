import { zodResolver } from '@hookform/resolvers/zod';
import { Link } from 'expo-router';
import { useForm } from 'react-hook-form';
import { Text } from 'react-native';
import { useRequestReset } from '@/components/api/auth';
import { AuthPanel } from '@/components/account/AuthPanel';
import { FormField } from '@/components/account/FormField';
import { useSubmit } from '@/components/account/useSubmit';
import { Button, Notice } from '@/components/library/controls';
import { theme } from '@/components/ui';
import { RequestReset } from '@/shared/schemas/auth';

export default function ForgotPasswordScreen() {
  const request = useRequestReset();
  const form = useForm({ resolver: zodResolver(RequestReset), defaultValues: { email: '' } });
  const { control } = form;
  const { submit, formError } = useSubmit(form, ['email'], (values) => request.mutateAsync(values));

  return (
    <AuthPanel title="Forgot the password">
      {request.isSuccess ? (
        <Notice tone="ok" title="Check your mail">
          {request.data.message}
        </Notice>
      ) : (
        <>
          <Text style={theme.body}>Give the address you sign in with. We mail a link that lets you choose a new password.</Text>
          <FormField control={control} name="email" label="E-mail" inputMode="email" autoComplete="email" onSubmitEditing={submit} />
          {formError ? <Notice>{formError}</Notice> : null}
          <Button label="Send the link" onPress={submit} busy={request.isPending} />
        </>
      )}
      <Link href="/sign-in" style={theme.link}>
        Back to sign in
      </Link>
    </AuthPanel>
  );
}
