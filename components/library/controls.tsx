// Small building blocks the library, design, upload and catalog screens share: buttons, fields,
// notices and the status badge. Built only from the ui tokens.
import { Link } from 'expo-router';
import { forwardRef, type ReactNode } from 'react';
import { ActivityIndicator, Pressable, StyleSheet, Text, TextInput, View, type TextInputProps, type ViewStyle } from 'react-native';
import { STATUS_HELP, STATUS_LABEL, type DesignKind, type RevisionStatus } from '../../shared/schemas/library';
import { colors, fonts, radius, space, theme } from '../ui';

type ButtonTone = 'primary' | 'secondary' | 'quiet' | 'danger';

export function Button({
  label,
  onPress,
  tone = 'primary',
  disabled = false,
  busy = false,
  testID,
  accessibilityLabel,
  style,
}: {
  label: string;
  onPress?: () => void;
  tone?: ButtonTone;
  disabled?: boolean;
  busy?: boolean;
  testID?: string;
  accessibilityLabel?: string;
  style?: ViewStyle;
}) {
  const off = disabled || busy;
  return (
    <Pressable
      accessibilityRole="button"
      aria-label={accessibilityLabel ?? label}
      aria-disabled={off}
      aria-busy={busy}
      disabled={off}
      onPress={onPress}
      testID={testID}
      style={({ hovered }: { hovered?: boolean }) => [styles.button, toneStyle[tone], hovered && !off && hoverStyle[tone], off && styles.off, style]}
    >
      {busy ? <ActivityIndicator size="small" color={tone === 'primary' || tone === 'danger' ? colors.paper : colors.pine} /> : null}
      <Text style={[styles.buttonText, toneText[tone]]}>{label}</Text>
    </Pressable>
  );
}

/** A link drawn as a button, for moves to another screen. */
export function LinkButton({ href, label, tone = 'primary', testID }: { href: string; label: string; tone?: ButtonTone; testID?: string }) {
  return (
    // Link's asChild hands the style to the DOM as it is: it must be one plain object (no array,
    // no function), so this button has no hover shade.
    <Link href={href as never} asChild>
      <Pressable accessibilityRole="link" testID={testID} style={StyleSheet.flatten([styles.button, toneStyle[tone]])}>
        <Text style={[styles.buttonText, toneText[tone]]}>{label}</Text>
      </Pressable>
    </Link>
  );
}

export interface FieldProps extends Omit<TextInputProps, 'style'> {
  label: string;
  error?: string;
  hint?: string;
  /** Unit or short text shown after the box, e.g. "mm". */
  suffix?: string;
  width?: number | `${number}%`;
}

/** A labelled text box with its hint and its error under it. */
export const TextField = forwardRef<TextInput, FieldProps>(function TextField({ label, error, hint, suffix, width, multiline, ...input }, ref) {
  return (
    <View style={[styles.field, width !== undefined && { width, flexGrow: 0 }]}>
      <Text style={theme.label}>{label}</Text>
      <View style={theme.row}>
        <TextInput
          ref={ref}
          aria-label={label}
          aria-invalid={!!error}
          placeholderTextColor={colors.inkMuted}
          multiline={multiline}
          style={[styles.input, multiline && styles.multiline, !!error && styles.inputError]}
          {...input}
        />
        {suffix ? <Text style={theme.muted}>{suffix}</Text> : null}
      </View>
      {error ? <FieldError message={error} /> : hint ? <Text style={theme.muted}>{hint}</Text> : null}
    </View>
  );
});

export function FieldError({ message }: { message: string }) {
  return (
    <Text role="alert" style={styles.fieldError}>
      {message}
    </Text>
  );
}

export function Checkbox({ label, checked, onChange, testID }: { label: string; checked: boolean; onChange: (v: boolean) => void; testID?: string }) {
  return (
    <Pressable accessibilityRole="checkbox" aria-checked={checked} aria-label={label} onPress={() => onChange(!checked)} style={styles.check} testID={testID}>
      <View style={[styles.box, checked && styles.boxOn]}>{checked ? <View style={styles.tick} /> : null}</View>
      <Text style={theme.body}>{label}</Text>
    </Pressable>
  );
}

/** A message box: an error with an optional retry, or a plain note. */
export function Notice({ tone = 'error', title, children, action }: { tone?: 'error' | 'info' | 'ok'; title?: string; children?: ReactNode; action?: ReactNode }) {
  const box = tone === 'error' ? styles.noticeError : tone === 'ok' ? styles.noticeOk : styles.noticeInfo;
  return (
    <View style={[styles.notice, box]} role={tone === 'error' ? 'alert' : 'status'}>
      {title ? <Text style={theme.label}>{title}</Text> : null}
      {typeof children === 'string' ? <Text style={theme.body}>{children}</Text> : children}
      {action}
    </View>
  );
}

export function Loading({ label }: { label: string }) {
  return (
    <View style={[theme.row, { padding: space.lg }]} role="status">
      <ActivityIndicator color={colors.pine} />
      <Text style={theme.muted}>{label}</Text>
    </View>
  );
}

// Each status has its own fill and a mark that reads without colour: hollow, half, full, struck.
const STATUS_LOOK: Record<RevisionStatus, { bg: string; fg: string; mark: string }> = {
  draft: { bg: colors.sunk, fg: colors.ink, mark: '○' },
  trial: { bg: colors.copperSoft, fg: '#7A3F14', mark: '◐' },
  proven: { bg: colors.pineSoft, fg: colors.pineDark, mark: '●' },
  retired: { bg: '#E4E1DA', fg: colors.inkMuted, mark: '⊘' },
};

export function StatusBadge({ status }: { status: RevisionStatus }) {
  const look = STATUS_LOOK[status];
  return (
    <View style={[styles.badge, { backgroundColor: look.bg }]} aria-label={`Status: ${STATUS_LABEL[status]}. ${STATUS_HELP[status]}`}>
      <Text style={[styles.badgeText, { color: look.fg }]}>
        {look.mark} {STATUS_LABEL[status]}
      </Text>
    </View>
  );
}

export const KIND_LABEL: Record<DesignKind, string> = { insert: 'Insert', jig: 'Jig', template: 'Template' };

export function Tag({ label, onPress }: { label: string; onPress?: () => void }) {
  const body = <Text style={styles.tagText}>#{label}</Text>;
  if (!onPress) return <View style={styles.tag}>{body}</View>;
  return (
    <Pressable accessibilityRole="button" aria-label={`Show designs tagged ${label}`} onPress={onPress} style={({ hovered }: { hovered?: boolean }) => [styles.tag, hovered && styles.tagHover]}>
      {body}
    </Pressable>
  );
}

/** "3 Dec 2026, 14:05" in the reader's own locale. */
export function formatWhen(iso: string, withTime = false): string {
  const d = new Date(iso);
  if (Number.isNaN(d.getTime())) return iso;
  return d.toLocaleString(undefined, withTime ? { day: 'numeric', month: 'short', year: 'numeric', hour: '2-digit', minute: '2-digit' } : { day: 'numeric', month: 'short', year: 'numeric' });
}

export function Section({ title, children, right, testID }: { title: string; children: ReactNode; right?: ReactNode; testID?: string }) {
  return (
    <View style={theme.card} testID={testID}>
      <View style={[theme.row, { justifyContent: 'space-between', flexWrap: 'wrap' }]}>
        <Text accessibilityRole="header" aria-level={2} style={theme.heading}>
          {title}
        </Text>
        {right}
      </View>
      {children}
    </View>
  );
}

const toneStyle = StyleSheet.create({
  primary: { backgroundColor: colors.pine, borderColor: colors.pine },
  secondary: { backgroundColor: colors.surface, borderColor: colors.pine },
  quiet: { backgroundColor: 'transparent', borderColor: 'transparent' },
  danger: { backgroundColor: colors.danger, borderColor: colors.danger },
});
const hoverStyle = StyleSheet.create({
  primary: { backgroundColor: colors.pineDark },
  secondary: { backgroundColor: colors.pineSoft },
  quiet: { backgroundColor: colors.sunk },
  danger: { backgroundColor: '#8A2E20' },
});
const toneText = StyleSheet.create({
  primary: { color: colors.paper },
  secondary: { color: colors.pineDark },
  quiet: { color: colors.pine },
  danger: { color: colors.paper },
});

const styles = StyleSheet.create({
  button: {
    flexDirection: 'row',
    alignItems: 'center',
    justifyContent: 'center',
    gap: space.sm,
    minHeight: 40,
    paddingHorizontal: space.lg,
    borderRadius: radius.sm,
    borderWidth: 1,
    alignSelf: 'flex-start',
  },
  buttonText: { fontFamily: fonts.medium, fontSize: 15 },
  off: { opacity: 0.5 },
  field: { gap: 4, flexGrow: 1, minWidth: 0 },
  input: {
    flex: 1,
    minWidth: 0,
    minHeight: 40,
    borderWidth: 1,
    borderColor: colors.line,
    borderRadius: radius.sm,
    backgroundColor: colors.surface,
    paddingHorizontal: space.md,
    paddingVertical: space.sm,
    fontFamily: fonts.regular,
    fontSize: 15,
    color: colors.ink,
  },
  multiline: { minHeight: 88, textAlignVertical: 'top' },
  inputError: { borderColor: colors.danger, borderWidth: 2 },
  fieldError: { fontFamily: fonts.medium, fontSize: 13, lineHeight: 18, color: colors.danger },
  check: { flexDirection: 'row', alignItems: 'center', gap: space.sm, minHeight: 32, alignSelf: 'flex-start' },
  box: { width: 20, height: 20, borderRadius: 3, borderWidth: 2, borderColor: colors.pine, alignItems: 'center', justifyContent: 'center', backgroundColor: colors.surface },
  boxOn: { backgroundColor: colors.pine },
  // A short L turned 45°: a tick that does not depend on the font having one.
  tick: { width: 6, height: 11, borderRightWidth: 2, borderBottomWidth: 2, borderColor: colors.paper, transform: [{ rotate: '45deg' }], marginTop: -2 },
  notice: { borderRadius: radius.sm, padding: space.md, gap: space.sm, borderLeftWidth: 4 },
  noticeError: { backgroundColor: colors.dangerSoft, borderLeftColor: colors.danger },
  noticeInfo: { backgroundColor: colors.sunk, borderLeftColor: colors.inkMuted },
  noticeOk: { backgroundColor: colors.pineSoft, borderLeftColor: colors.pine },
  badge: { alignSelf: 'flex-start', paddingHorizontal: space.sm, paddingVertical: 2, borderRadius: radius.sm },
  badgeText: { fontFamily: fonts.medium, fontSize: 12, lineHeight: 18 },
  tag: { paddingHorizontal: 6, paddingVertical: 1, borderRadius: radius.sm, borderWidth: 1, borderColor: colors.line, backgroundColor: colors.paper },
  tagHover: { borderColor: colors.pine },
  tagText: { fontFamily: fonts.mono, fontSize: 12, lineHeight: 18, color: colors.inkMuted },
});
