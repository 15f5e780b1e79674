import { counted } from '@/shared/words';
import { zodResolver } from '@hookform/resolvers/zod';
import { router } from 'expo-router';
import { useForm } from 'react-hook-form';
import { Text, View } from 'react-native';
import { useChangePassword, useSignOut, useSignOutOthers } from '@/components/api/auth';
import { FormField } from '@/components/account/FormField';
import { SignedInOnly } from '@/components/account/SignedInOnly';
import { useSubmit } from '@/components/account/useSubmit';
import { AppFrame } from '@/components/layout/AppFrame';
import { Button, LinkButton, Notice, Section } from '@/components/library/controls';
import { space, theme } from '@/components/ui';
import { ChangePassword, PASSWORD_MIN, ROLE_LABEL, type Me } from '@/shared/schemas/auth';

export default function AccountScreen() {
  return (
    <AppFrame title="Account">
      <SignedInOnly here="/account">{(me) => <Account me={me} />}</SignedInOnly>
    </AppFrame>
  );
}

function Account({ me }: { me: Me }) {
  const signOut = useSignOut();
  return (
    <>
      <Section title={me.user.name}>
        <Text style={theme.body}>{me.user.email}</Text>
        <Text style={theme.muted}>{me.shops.length ? me.shops.map((s) => `${s.name} (${ROLE_LABEL[s.role]})`).join(' · ') : 'Not in a shop yet'}</Text>
        <View style={[theme.row, { flexWrap: 'wrap', gap: space.sm }]}>
          <LinkButton href="/shop/new" tone="secondary" label="Start a new shop" />
          <Button
            tone="danger"
            label="Sign out"
            busy={signOut.isPending}
            onPress={() => signOut.mutate(undefined, { onSettled: () => router.replace('/') })}
            testID="sign-out"
          />
        </View>
      </Section>
      <Section title="Other devices">
        <SignOutOthers />
      </Section>
      <Section title="Change the password">
        <ChangePasswordForm />
      </Section>
    </>
  );
}

function SignOutOthers() {
  const others = useSignOutOthers();
  const ended = others.data?.ended;
  return (
    <View style={{ gap: space.sm }}>
      <Text style={theme.body}>Signed in on a shop computer, a tablet at the bench or a phone you no longer have? End those sessions; this one stays signed in.</Text>
      {others.error ? <Notice title="Nothing was ended">{others.error.message}</Notice> : null}
      {ended !== undefined ? (
        <Notice tone="ok" title="Done">
          <Text testID="sign-out-others-done">{ended === 0 ? 'You were not signed in anywhere else.' : `Signed out of ${ended === 1 ? 'one other session' : counted(ended, 'other session')}.`}</Text>
        </Notice>
      ) : null}
      <View style={theme.row}>
        <Button tone="secondary" label="Sign out everywhere else" busy={others.isPending} onPress={() => others.mutate()} testID="sign-out-others" />
      </View>
    </View>
  );
}

function ChangePasswordForm() {
  const change = useChangePassword();
  const form = useForm({ resolver: zodResolver(ChangePassword), defaultValues: { currentPassword: '', newPassword: '' } });
  const { control } = form;
  const { submit, formError } = useSubmit(form, ['currentPassword', 'newPassword'], async (values) => {
    await change.mutateAsync(values);
    form.reset();
  });
  return (
    <View style={{ gap: space.md, maxWidth: 460 }}>
      <FormField control={control} name="currentPassword" label="Current password" secureTextEntry autoComplete="current-password" onSubmitEditing={submit} />
      <FormField control={control} name="newPassword" label="New password" secureTextEntry autoComplete="new-password" hint={`At least ${PASSWORD_MIN} characters.`} onSubmitEditing={submit} />
      {formError ? <Notice>{formError}</Notice> : null}
      {change.isSuccess ? <Notice tone="ok">Password changed. Other devices signed in to this account have been signed out.</Notice> : null}
      <Button label="Change password" onPress={submit} busy={change.isPending} />
    </View>
  );
}
