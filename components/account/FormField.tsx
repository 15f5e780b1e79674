import { useController, type Control, type FieldValues, type Path } from 'react-hook-form';
import { TextField, type FieldProps } from '../library/controls';

/** A TextField bound to one react-hook-form field; shows that field's message under the box. */
export function FormField<T extends FieldValues>({
  control,
  name,
  ...input
}: { control: Control<T>; name: Path<T> } & Omit<FieldProps, 'value' | 'onChangeText' | 'onBlur' | 'error'>) {
  const { field, fieldState } = useController({ control, name });
  return (
    <TextField
      ref={field.ref}
      value={(field.value as string | undefined) ?? ''}
      onChangeText={field.onChange}
      onBlur={field.onBlur}
      error={fieldState.error?.message}
      autoCapitalize="none"
      autoCorrect={false}
      {...input}
    />
  );
}
