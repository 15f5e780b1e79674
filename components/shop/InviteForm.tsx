import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { useController, useForm } from 'react-hook-form';
import { Text, View } from 'react-native';
import { CreateInvite, ROLE_HELP, ROLE_WITH_ARTICLE } from '../../shared/schemas/auth';
import { useSendInvite } from '../api/shops';
import { FormField } from '../account/FormField';
import { useSubmit } from '../account/useSubmit';
import { Button, FieldError, Notice } from '../library/controls';
import { space, theme } from '../ui';
import { RolePicker } from './RolePicker';

const capitalize = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/** The owner invites someone by address; they get a link by mail that works once. */
export function InviteForm({ shopId, shopName }: { shopId: string; shopName: string }) {
  const send = useSendInvite(shopId);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const form = useForm({ resolver: zodResolver(CreateInvite), defaultValues: { email: '', role: 'viewer' as const } });
  const { control } = form;
  const role = useController({ control, name: 'role' });
  const { submit, formError } = useSubmit(form, ['email', 'role'], async (values) => {
    setSentTo(null);
    const invite = await send.mutateAsync(values);
    setSentTo(invite.email);
    form.reset({ email: '', role: values.role });
  });

  return (
    <View style={{ gap: space.md }} testID="invite-form">
      <FormField control={control} name="email" label="Invite by e-mail" inputMode="email" autoComplete="off" placeholder="name@example.com" onSubmitEditing={submit} />
      <View style={{ gap: space.xs }}>
        <Text style={theme.label}>Role in {shopName}</Text>
        <RolePicker label="Role for the invite" value={role.field.value} onChange={role.field.onChange} invalid={!!role.fieldState.error} />
        {role.fieldState.error ? <FieldError message={role.fieldState.error.message ?? 'Choose a role'} /> : <Text style={theme.muted}>{`${capitalize(ROLE_WITH_ARTICLE[role.field.value])} can ${ROLE_HELP[role.field.value]}.`}</Text>}
      </View>
      {formError ? <Notice title="Invite not sent">{formError}</Notice> : null}
      {sentTo ? <Notice tone="ok">{`Invite sent to ${sentTo}. The link works once, for 7 days.`}</Notice> : null}
      <Button label="Send invite" onPress={submit} busy={send.isPending} testID="send-invite" />
    </View>
  );
}
