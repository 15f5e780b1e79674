import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { View } from 'react-native';
import { CreateShop, RenameShop } from '../../shared/schemas/auth';
import { useCreateShop, useRenameShop } from '../api/shops';
import { FormField } from '../account/FormField';
import { useSubmit } from '../account/useSubmit';
import { Button, Notice } from '../library/controls';
import { space } from '../ui';

/** Renames a shop (owners only). */
export function RenameShopForm({ shopId, name }: { shopId: string; name: string }) {
  const rename = useRenameShop(shopId);
  const form = useForm({ resolver: zodResolver(RenameShop), values: { name } });
  const { control, formState } = form;
  const { submit, formError } = useSubmit(form, ['name'], (values) => rename.mutateAsync(values));
  return (
    <View style={{ gap: space.sm }}>
      <FormField control={control} name="name" label="Shop name" autoCapitalize="words" onSubmitEditing={submit} />
      {formError ? <Notice>{formError}</Notice> : null}
      {rename.isSuccess && !formState.isDirty ? <Notice tone="ok">Saved.</Notice> : null}
      <Button tone="secondary" label="Rename" onPress={submit} busy={rename.isPending} />
    </View>
  );
}

/** Starts a new shop with the signed-in person as its owner. */
export function NewShopForm({ onCreated }: { onCreated: (shopId: string) => void }) {
  const create = useCreateShop();
  const form = useForm({ resolver: zodResolver(CreateShop), defaultValues: { name: '' } });
  const { control } = form;
  const { submit, formError } = useSubmit(form, ['name'], async (values) => onCreated((await create.mutateAsync(values)).id));
  return (
    <View style={{ gap: space.sm }}>
      <FormField control={control} name="name" label="Shop name" autoCapitalize="words" placeholder="e.g. Back Barn Joinery" onSubmitEditing={submit} />
      {formError ? <Notice>{formError}</Notice> : null}
      <Button label="Start the shop" onPress={submit} busy={create.isPending} />
    </View>
  );
}
