import { useState } from 'react';
import type { FieldErrors, FieldValues, Path, UseFormReturn } from 'react-hook-form';
import { placeServerErrors } from '../forms/serverErrors';

/**
 * The submit of every account form: runs `send` with the checked values, places the server's
 * field messages under their fields and keeps the rest as the form's message.
 */
export function useSubmit<TIn extends FieldValues, TOut>(
  form: UseFormReturn<TIn, unknown, TOut>,
  fields: readonly Path<TIn>[],
  send: (values: TOut) => Promise<unknown>,
  onInvalid?: (errors: FieldErrors<TIn>) => string | null,
) {
  const [formError, setFormError] = useState<string | null>(null);
  const submit = form.handleSubmit(
    async (values) => {
      setFormError(null);
      try {
        await send(values);
      } catch (e) {
        setFormError(placeServerErrors(e, form.setError, fields));
      }
    },
    (errors) => setFormError(onInvalid ? onInvalid(errors) : null),
  );
  return { submit, formError };
}
