import { zodResolver } from '@hookform/resolvers/zod';
import { Fragment, useEffect, useImperativeHandle, useMemo, useRef, useState, type ReactNode, type Ref } from 'react';
import { get, useController, useForm, useFormState, type Control, type FieldErrors, type Resolver, type ResolverOptions } from 'react-hook-form';
import { Pressable, StyleSheet, Switch, Text, TextInput, View, type TextStyle } from 'react-native';
import type { z } from 'zod';
import { defaultParams, paramsSchema, type BoolParam, type ChoiceParam, type NumberParam, type ParamDecl, type ParamValues } from '../../shared/params';
import { colors, fonts, radius, space, theme } from '../ui';
import { Segmented } from './Segmented';
import { formatParamInput, formatParamValue, isLength, parseParamText, rangeText, unitSuffix } from './paramText';
import type { DisplayUnits } from './useDisplayUnits';

export type FlagSeverity = 'info' | 'caution' | 'danger';

/** What a screen may do to a mounted form from outside (through the `handle` prop). */
export interface ParamFormHandle {
  /**
   * Writes these values (mm for lengths) into their fields, shown in the current units, and
   * validates and reports the form as after an edit. Params not named keep what they hold.
   */
  setValues(values: Partial<ParamValues>): void;
}

export interface ParamFormProps {
  decls: ParamDecl[];
  /** Starting values (mm for lengths); missing ones take the declared defaults. Read once: remount with a new `key` to reset. */
  initialValues?: Partial<ParamValues>;
  /** Unit lengths are shown and typed in. Switching converts the shown text; stored values stay exact. */
  units: DisplayUnits;
  /** Fires after every edit that leaves the whole form valid, with the values in millimetres. */
  onChange: (values: ParamValues) => void;
  /** Fires after every edit with whether the form is valid, so a preview can say it is showing the last good values. */
  onValidityChange?: (valid: boolean) => void;
  /** Field-level messages from elsewhere (the server's 400 `fields`, a generator's consistency check), by param name. */
  externalErrors?: Record<string, string>;
  /** Fields a warning concerns, by param name: outlined and tagged with the warning's severity. */
  flagged?: Record<string, FlagSeverity>;
  /** Show only these params (e.g. a generator's device fields); the rest keep their values. */
  onlyFields?: string[];
  disabled?: boolean;
  /** Sections fold open and shut; `openSections` says which start open. */
  collapsible?: boolean;
  openSections?: 'all' | 'first';
  /** Receives the form's `setValues` (see ParamFormHandle), e.g. to fill fields from a saved device. */
  handle?: Ref<ParamFormHandle>;
  /** Fires when the person edits a field (typing, a choice, a switch), by param name; not for `setValues`. */
  onFieldEdit?: (name: string) => void;
  /** Extra content shown just above / just below a field, by param name (in that field's section). */
  beforeField?: Record<string, ReactNode>;
  afterField?: Record<string, ReactNode>;
}

/** Form state: number fields hold the text as typed, choices their value, booleans themselves. */
type FormText = Record<string, string | boolean>;
type ExactValues = Record<string, { text: string; value: number }>;

// Form keys are positional so a param name never collides with react-hook-form's path syntax.
const keyOf = (index: number) => `p${index}`;

const NO_NATIVE: ResolverOptions<FormText> = { fields: {}, shouldUseNativeValidation: false };

/**
 * Turns typed text into values (mm) and validates them with the declarations' own zod schema, so the
 * form and the API refuse the same things with the same words. Range messages for lengths are
 * restated in the display unit.
 */
function makeResolver(decls: ParamDecl[], unitsRef: { current: DisplayUnits }, exact: { current: ExactValues }, parsed: { current: Record<string, number | undefined> }): Resolver<FormText, unknown, ParamValues> {
  // paramsSchema types its input as unknown; the resolver wants an object type on both sides.
  const validate = zodResolver(paramsSchema(decls) as unknown as z.ZodType<ParamValues, ParamValues>);
  return async (values) => {
    const units = unitsRef.current;
    const raw: Record<string, unknown> = {};
    const errors: FieldErrors<FormText> = {};
    decls.forEach((d, i) => {
      const k = keyOf(i);
      const v = values[k];
      if (d.type !== 'number') {
        raw[d.name] = v;
        return;
      }
      const text = String(v ?? '');
      // Text we wrote ourselves (initial value, unit switch) stands for its exact value, not its rounding.
      const r = exact.current[k]?.text === text ? { ok: true as const, value: exact.current[k].value } : parseParamText(d, text, units);
      parsed.current[k] = r.ok ? r.value : undefined;
      if (r.ok) raw[d.name] = r.value;
      else errors[k] = { type: 'parse', message: r.message };
    });
    const z = await validate(raw as ParamValues, undefined, NO_NATIVE as ResolverOptions<ParamValues>);
    decls.forEach((d, i) => {
      const k = keyOf(i);
      const e = get(z.errors, d.name) as { type?: string; message?: string } | undefined;
      if (!e || errors[k]) return;
      let message = e.message ?? `${d.label} is not valid`;
      if (d.type === 'number' && isLength(d) && units === 'in') {
        if (e.type === 'too_small') message = `${d.label} must be at least ${formatParamValue(d, d.min, 'in')} (${d.min} mm)`;
        if (e.type === 'too_big') message = `${d.label} must be at most ${formatParamValue(d, d.max, 'in')} (${d.max} mm)`;
      }
      errors[k] = { type: e.type ?? 'invalid', message };
    });
    if (Object.keys(errors).length > 0) return { values: {}, errors };
    return { values: z.values as ParamValues, errors: {} };
  };
}

/** A form generated from parameter declarations: sections per group, help and range under each field, errors inline. */
export function ParamForm({ decls, initialValues, units, onChange, onValidityChange, externalErrors, flagged, onlyFields, disabled = false, collapsible = false, openSections = 'all', handle, onFieldEdit, beforeField, afterField }: ParamFormProps) {
  const unitsRef = useRef(units);
  const exact = useRef<ExactValues>({});
  const parsed = useRef<Record<string, number | undefined>>({});
  const onChangeRef = useRef(onChange);
  const onValidityRef = useRef(onValidityChange);
  onChangeRef.current = onChange;
  onValidityRef.current = onValidityChange;

  const defaultValues = useMemo(() => {
    const start = { ...defaultParams(decls), ...initialValues };
    const out: FormText = {};
    decls.forEach((d, i) => {
      const k = keyOf(i);
      const v = start[d.name];
      if (d.type === 'number') {
        const value = typeof v === 'number' ? v : d.default;
        const text = formatParamInput(d, value, unitsRef.current);
        exact.current[k] = { text, value };
        parsed.current[k] = value;
        out[k] = text;
      } else out[k] = v as string | boolean;
    });
    return out;
    // Read once per declaration list, like useForm's own defaultValues.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [decls]);

  const resolver = useMemo(() => makeResolver(decls, unitsRef, exact, parsed), [decls]);
  const { control, watch, setValue, trigger, getValues } = useForm<FormText, unknown, ParamValues>({ defaultValues, resolver, mode: 'onChange' });

  // Report valid values after each edit; an older, slower validation never overwrites a newer one.
  const latest = useRef(0);
  const muted = useRef(false);
  const report = useMemo(
    () => (values: FormText) => {
      const mine = ++latest.current;
      void Promise.resolve(resolver(values, undefined, NO_NATIVE)).then((r) => {
        if (mine !== latest.current) return;
        const valid = Object.keys(r.errors).length === 0;
        onValidityRef.current?.(valid);
        if (valid) onChangeRef.current(r.values as ParamValues);
      });
    },
    [resolver],
  );
  useEffect(() => {
    const sub = watch((values) => {
      if (!muted.current) report(values as FormText);
    });
    return () => sub.unsubscribe();
  }, [watch, report]);

  // A unit switch rewrites each readable length in the new unit, keeping its exact millimetres.
  // All texts are worked out first and written with the watcher muted: a half-converted form read
  // in the new unit would misread the fields not yet rewritten.
  useEffect(() => {
    if (unitsRef.current === units) return;
    const rewrites: { key: string; text: string; value: number }[] = [];
    decls.forEach((d, i) => {
      if (d.type !== 'number' || !isLength(d)) return;
      const k = keyOf(i);
      const value = parsed.current[k];
      // Unreadable text stays as typed, and is now read in the new unit.
      if (value !== undefined) rewrites.push({ key: k, text: formatParamInput(d, value, units), value });
    });
    unitsRef.current = units;
    muted.current = true;
    for (const r of rewrites) {
      exact.current[r.key] = { text: r.text, value: r.value };
      setValue(r.key, r.text);
    }
    muted.current = false;
    void trigger();
    report(getValues());
  }, [units, decls, setValue, trigger, getValues, report]);

  // A server or consistency message stays until its field is edited or new messages arrive.
  const [editedSinceExternal, setEdited] = useState<Record<string, true>>({});
  useEffect(() => setEdited({}), [externalErrors]);
  const markEdited = (name: string) => {
    if (externalErrors?.[name] && !editedSinceExternal[name]) setEdited((s) => ({ ...s, [name]: true }));
  };

  // Values written from outside go in like a unit switch: every text first with the watcher muted,
  // each keeping its exact millimetres, then one validation and one report.
  useImperativeHandle(handle, () => ({
    setValues(values: Partial<ParamValues>) {
      muted.current = true;
      try {
        decls.forEach((d, i) => {
          if (!Object.prototype.hasOwnProperty.call(values, d.name)) return;
          const v = values[d.name];
          const k = keyOf(i);
          if (d.type === 'number') {
            if (typeof v !== 'number' || !Number.isFinite(v)) return;
            const text = formatParamInput(d, v, unitsRef.current);
            exact.current[k] = { text, value: v };
            parsed.current[k] = v;
            setValue(k, text, { shouldDirty: true });
          } else if (v !== undefined) setValue(k, v as string | boolean, { shouldDirty: true });
          else return;
          markEdited(d.name);
        });
      } finally {
        muted.current = false;
      }
      void trigger();
      report(getValues());
    },
  }));

  // A field outside `onlyFields` still shows when it carries a message: it cannot be fixed unseen.
  const visible = useMemo(() => (onlyFields ? [...onlyFields, ...Object.keys(externalErrors ?? {})] : undefined), [onlyFields, externalErrors]);
  const sections = useMemo(() => groupDecls(decls, visible), [decls, visible]);
  return (
    <View style={styles.form} role="form" aria-label="Parameters">
      {sections.map((section, si) => (
        <FormSection
          key={section.title ?? '_'}
          title={section.title}
          control={control}
          keys={section.items.map((it) => keyOf(it.index))}
          flaggedCount={section.items.filter((it) => flagged?.[it.decl.name] || (externalErrors?.[it.decl.name] && !editedSinceExternal[it.decl.name])).length}
          collapsible={collapsible && !!section.title}
          initiallyOpen={openSections === 'all' || si === 0}
        >
          {section.items.map(({ decl, index }) => {
            const external = editedSinceExternal[decl.name] ? undefined : externalErrors?.[decl.name];
            const common = {
              control,
              name: keyOf(index),
              external,
              flag: flagged?.[decl.name],
              disabled,
              onEdit: () => {
                markEdited(decl.name);
                onFieldEdit?.(decl.name);
              },
            };
            const field = decl.type === 'number' ? <NumberField decl={decl} units={units} {...common} /> : decl.type === 'choice' ? <ChoiceField decl={decl} {...common} /> : <BoolField decl={decl} {...common} />;
            return (
              <Fragment key={decl.name}>
                {beforeField?.[decl.name] ?? null}
                {field}
                {afterField?.[decl.name] ?? null}
              </Fragment>
            );
          })}
        </FormSection>
      ))}
    </View>
  );
}

function groupDecls(decls: ParamDecl[], only?: string[]) {
  const sections: { title?: string; items: { decl: ParamDecl; index: number }[] }[] = [];
  decls.forEach((decl, index) => {
    if (only && !only.includes(decl.name)) return;
    let s = sections.find((x) => x.title === decl.group);
    if (!s) {
      s = { title: decl.group, items: [] };
      // Ungrouped params lead, before the first titled section.
      if (decl.group === undefined) sections.unshift(s);
      else sections.push(s);
    }
    s.items.push({ decl, index });
  });
  return sections;
}

/** A titled group of fields. Folded shut, its fields stay mounted (hidden) so their values and errors hold. */
function FormSection({ title, control, keys, flaggedCount, collapsible, initiallyOpen, children }: { title?: string; control: Control<FormText, unknown, ParamValues>; keys: string[]; flaggedCount: number; collapsible: boolean; initiallyOpen: boolean; children: React.ReactNode }) {
  const [open, setOpen] = useState(initiallyOpen);
  const { errors } = useFormState({ control, name: keys });
  const invalid = keys.filter((k) => errors[k]).length;
  const shown = open || !collapsible;
  const marks = [invalid ? `${invalid} to fix` : '', flaggedCount ? `${flaggedCount} flagged` : ''].filter(Boolean).join(', ');
  return (
    <View style={styles.section}>
      {title ? (
        collapsible ? (
          <Pressable accessibilityRole="button" aria-expanded={open} aria-label={`${title} section`} onPress={() => setOpen(!open)} style={styles.sectionHead}>
            <Text role="heading" style={styles.sectionTitle}>
              {open ? '▾' : '▸'} {title}
            </Text>
            {!open && marks ? <Text style={styles.sectionMarks}>{marks}</Text> : null}
          </Pressable>
        ) : (
          <View style={styles.sectionHead}>
            <Text role="heading" style={styles.sectionTitle}>
              {title}
            </Text>
          </View>
        )
      ) : null}
      <View style={[styles.sectionBody, !shown && styles.hidden]}>{children}</View>
    </View>
  );
}

interface FieldProps {
  control: Control<FormText, unknown, ParamValues>;
  name: string;
  external?: string;
  flag?: FlagSeverity;
  disabled: boolean;
  onEdit: () => void;
}

const FLAG_TEXT: Record<FlagSeverity, string> = { info: 'Note', caution: 'Check', danger: 'Fix' };
const FLAG_COLOR: Record<FlagSeverity, { line: string; soft: string; ink: string }> = {
  info: { line: colors.pine, soft: colors.pineSoft, ink: colors.pineDark },
  caution: { line: colors.caution, soft: colors.cautionSoft, ink: colors.caution },
  danger: { line: colors.danger, soft: colors.dangerSoft, ink: colors.danger },
};

/** Label row, the control, then help, range and any error, in a box outlined when a warning concerns it. */
function FieldFrame({ label, flag, help, range, error, children, inline = false }: { label: string; flag?: FlagSeverity; help: string; range?: string; error?: string; children: React.ReactNode; inline?: boolean }) {
  const tone = flag ? FLAG_COLOR[flag] : undefined;
  return (
    <View style={[styles.field, tone && { borderLeftColor: tone.line, backgroundColor: tone.soft }]} testID={`field-${label}`}>
      <View style={[styles.labelRow, inline && styles.inlineRow]}>
        <Text style={theme.label}>{label}</Text>
        {flag ? (
          // Named in words too, so the flag reads without colour.
          <Text style={[styles.flag, { color: tone!.ink, borderColor: tone!.line }]}>{FLAG_TEXT[flag]} · see report</Text>
        ) : null}
        {inline ? <View style={styles.inlineControl}>{children}</View> : null}
      </View>
      {inline ? null : children}
      <Text style={theme.muted}>{help}</Text>
      {range ? <Text style={[theme.muted, styles.range]}>{range}</Text> : null}
      {error ? (
        <Text style={styles.error} aria-live="polite">
          {error}
        </Text>
      ) : null}
    </View>
  );
}

function NumberField({ decl, units, control, name, external, flag, disabled, onEdit }: FieldProps & { decl: NumberParam; units: DisplayUnits }) {
  const { field, fieldState } = useController({ control, name });
  const error = fieldState.error?.message ?? external;
  const suffix = unitSuffix(decl, units);
  const inchText = isLength(decl) && units === 'in';
  const [focused, setFocused] = useState(false);
  return (
    <FieldFrame
      label={decl.label}
      flag={flag}
      help={decl.help}
      range={`Range ${rangeText(decl, units)}`}
      error={error}
    >
      {/* Focus shows on the whole box (value and unit), not as the browser's ring round the text alone. */}
      <View style={[styles.inputRow, focused && styles.inputFocused, error ? styles.inputInvalid : null]}>
        <TextInput
          accessibilityLabel={decl.label}
          aria-invalid={error ? true : undefined}
          value={String(field.value ?? '')}
          onChangeText={(t) => {
            field.onChange(t);
            onEdit();
          }}
          onFocus={() => setFocused(true)}
          onBlur={() => {
            setFocused(false);
            field.onBlur();
          }}
          editable={!disabled}
          // Fractions need "/" and "-", which a decimal keypad lacks.
          inputMode={inchText ? 'text' : decl.unit === 'count' ? 'numeric' : 'decimal'}
          autoCorrect={false}
          autoCapitalize="none"
          style={styles.input}
        />
        {suffix ? <Text style={styles.suffix}>{suffix}</Text> : null}
      </View>
    </FieldFrame>
  );
}

function ChoiceField({ decl, control, name, external, flag, disabled, onEdit }: FieldProps & { decl: ChoiceParam }) {
  const { field, fieldState } = useController({ control, name });
  const error = fieldState.error?.message ?? external;
  return (
    <FieldFrame label={decl.label} flag={flag} help={decl.help} error={error}>
      <Segmented
        label={decl.label}
        options={decl.choices}
        value={field.value as string}
        disabled={disabled}
        invalid={!!error}
        onChange={(v) => {
          field.onChange(v);
          onEdit();
        }}
      />
    </FieldFrame>
  );
}

function BoolField({ decl, control, name, external, flag, disabled, onEdit }: FieldProps & { decl: BoolParam }) {
  const { field, fieldState } = useController({ control, name });
  const error = fieldState.error?.message ?? external;
  return (
    <FieldFrame label={decl.label} flag={flag} help={decl.help} error={error} inline>
      <Switch
        accessibilityLabel={decl.label}
        value={field.value === true}
        disabled={disabled}
        onValueChange={(v) => {
          field.onChange(v);
          onEdit();
        }}
        trackColor={{ false: colors.line, true: colors.pine }}
        thumbColor={colors.surface}
        {...({ activeThumbColor: colors.surface } as object)}
      />
    </FieldFrame>
  );
}

// The box around value and unit shows focus instead (see NumberField). RN's types list no 'none'
// outline style; react-native-web passes it through, and a zero width alone does not hide the ring.
const NO_BROWSER_RING = { outlineStyle: 'none' } as unknown as TextStyle;

const styles = StyleSheet.create({
  form: { gap: space.lg },
  section: { gap: space.sm },
  sectionHead: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', flexWrap: 'wrap', gap: space.sm, borderBottomWidth: 1, borderBottomColor: colors.line, paddingBottom: 4, minHeight: 32 },
  sectionTitle: { fontFamily: fonts.bold, fontSize: 14, lineHeight: 20, color: colors.pineDark, textTransform: 'uppercase', letterSpacing: 0.8 },
  sectionMarks: { fontFamily: fonts.medium, fontSize: 12, color: colors.danger },
  sectionBody: { gap: space.md },
  hidden: { display: 'none' },
  field: { gap: 4, borderLeftWidth: 3, borderLeftColor: 'transparent', paddingLeft: space.sm, paddingVertical: 2, borderRadius: 2 },
  labelRow: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: space.sm },
  inlineRow: { justifyContent: 'space-between' },
  inlineControl: { marginLeft: 'auto' },
  flag: { fontFamily: fonts.medium, fontSize: 11, lineHeight: 16, borderWidth: 1, borderRadius: radius.sm, paddingHorizontal: 6 },
  inputRow: { flexDirection: 'row', alignItems: 'center', borderWidth: 1, borderColor: colors.line, borderRadius: radius.sm, backgroundColor: colors.surface, maxWidth: 260 },
  // Same width in every state, so focusing or flagging a field never shifts the layout.
  inputFocused: { borderColor: colors.pine, boxShadow: `0 0 0 1px ${colors.pine}` },
  inputInvalid: { borderColor: colors.danger, boxShadow: `0 0 0 1px ${colors.danger}` },
  input: { flex: 1, minWidth: 0, fontFamily: fonts.mono, fontSize: 15, color: colors.ink, paddingHorizontal: space.sm, paddingVertical: 8, ...NO_BROWSER_RING },
  suffix: { fontFamily: fonts.mono, fontSize: 13, color: colors.inkMuted, paddingHorizontal: space.sm },
  range: { fontFamily: fonts.mono, fontSize: 12 },
  error: { fontFamily: fonts.medium, fontSize: 13, lineHeight: 18, color: colors.danger },
});
