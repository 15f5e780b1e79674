// The design's own details (kind, title, description, tags, material), for a new design and for
// editing one. Validated with the same shared schema the API uses.
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { Text, View } from 'react-native';
import { z } from 'zod';
import { CreateDesign, DESIGN_KINDS } from '../../shared/schemas/library';
import { placeServerErrors } from '../forms/serverErrors';
import { Segmented } from '../forms/Segmented';
import { space, theme } from '../ui';
import { Button, FieldError, KIND_LABEL, Notice, TextField } from '../library/controls';

export type DesignFormValues = z.input<typeof CreateDesign>;
type CreateOut = z.output<typeof CreateDesign>;

export const KIND_HELP: Record<(typeof DESIGN_KINDS)[number], string> = {
  insert: 'A plate or panel set into furniture: pockets, recesses, cord channels',
  jig: 'A shop fixture that holds or guides the work',
  template: 'A pattern to trace or follow with a bearing-guided bit',
};

/** "cord, Charger,  desk" → ["cord", "charger", "desk"]; the schema checks each tag. */
export function splitTags(text: string): string[] {
  return text
    .split(',')
    .map((t) => t.trim().toLowerCase())
    .filter(Boolean);
}

function TagsField({ value, onChange, error }: { value: string[] | undefined; onChange: (v: string[]) => void; error?: string }) {
  // Keep what was typed (commas, spaces) while the value holds the split list.
  const [text, setText] = useState((value ?? []).join(', '));
  return (
    <TextField
      label="Tags"
      value={text}
      onChangeText={(t) => {
        setText(t);
        onChange(splitTags(t));
      }}
      placeholder="charger, desk, walnut"
      hint="Separate tags with commas; they are kept in lower case."
      autoCapitalize="none"
      error={error}
      testID="design-tags"
    />
  );
}

export function DesignForm({
  mode,
  initial,
  onSubmit,
  submitLabel,
  onCancel,
}: {
  mode: 'create' | 'edit';
  initial?: Partial<DesignFormValues>;
  onSubmit: (values: CreateOut) => Promise<unknown>;
  submitLabel: string;
  onCancel?: () => void;
}) {
  // Editing checks the same rules; the kind is fixed once a design exists, so it is not shown.
  const { control, handleSubmit, setError, formState } = useForm<DesignFormValues, unknown, CreateOut>({
    resolver: zodResolver(CreateDesign),
    defaultValues: { kind: 'insert', title: '', description: '', tags: [], material: '', ...initial },
  });
  const [formError, setFormError] = useState<string | null>(null);
  const errors = formState.errors;
  const tagError = errors.tags?.message ?? (Array.isArray(errors.tags) ? errors.tags.find((t) => t?.message)?.message : undefined);

  const submit = handleSubmit(async (values) => {
    setFormError(null);
    try {
      await onSubmit(values);
    } catch (e) {
      setFormError(placeServerErrors(e, setError, ['kind', 'title', 'description', 'tags', 'material']));
    }
  });

  return (
    <View style={{ gap: space.lg }}>
      {mode === 'create' ? (
        <Controller
          control={control}
          name="kind"
          render={({ field, fieldState }) => (
            <View style={{ gap: 4 }}>
              <Text style={theme.label}>Kind</Text>
              <Segmented
                label="Kind"
                options={DESIGN_KINDS.map((k) => ({ value: k, label: KIND_LABEL[k] }))}
                value={field.value}
                onChange={field.onChange}
                invalid={!!fieldState.error}
              />
              <Text style={theme.muted}>{KIND_HELP[field.value ?? 'insert']}</Text>
              {fieldState.error?.message ? <FieldError message={fieldState.error.message} /> : null}
            </View>
          )}
        />
      ) : null}
      <Controller
        control={control}
        name="title"
        render={({ field, fieldState }) => (
          <TextField
            label="Title"
            value={field.value ?? ''}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            placeholder="e.g. Desk insert, phone pocket and pad recess"
            error={fieldState.error?.message}
            testID="design-title"
          />
        )}
      />
      <Controller
        control={control}
        name="description"
        render={({ field, fieldState }) => (
          <TextField
            label="Description"
            value={field.value ?? ''}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            multiline
            placeholder="What it is for, where it goes, anything the next person should know"
            error={fieldState.error?.message}
            testID="design-description"
          />
        )}
      />
      <Controller control={control} name="tags" render={({ field }) => <TagsField value={field.value} onChange={field.onChange} error={tagError} />} />
      <Controller
        control={control}
        name="material"
        render={({ field, fieldState }) => (
          <TextField
            label="Material"
            value={field.value ?? ''}
            onChangeText={field.onChange}
            onBlur={field.onBlur}
            placeholder="e.g. 18 mm birch ply"
            error={fieldState.error?.message}
            testID="design-material"
          />
        )}
      />
      {formError ? <Notice title="Not saved">{formError}</Notice> : null}
      <View style={[theme.row, { flexWrap: 'wrap' }]}>
        <Button label={submitLabel} onPress={submit} busy={formState.isSubmitting} testID="design-submit" />
        {onCancel ? <Button tone="quiet" label="Cancel" onPress={onCancel} /> : null}
      </View>
    </View>
  );
}
