import { useEffect, useState } from 'react';
import { formatLength, parseLength } from '../../shared/units';
import { TextField } from './controls';

/** A length in millimetres; NaN when what was typed is not a length, undefined when empty. */
export type Length = number | undefined;

const asText = (v: Length) => (v === undefined || Number.isNaN(v) ? '' : formatLength(v, 'mm', { digits: 3 }).replace(/ mm$/, ''));

/**
 * A length box in millimetres. It keeps exactly what was typed; the form holds the number, or
 * NaN when the text is not a length, so the schema's message appears and nothing is thrown away.
 * A typed unit wins: `3/4 in` or `0.75"` is read as inches.
 */
export function LengthBox({ value, onChange, onBlur, label, error, hint, testID }: { value: Length; onChange: (v: Length) => void; onBlur: () => void; label: string; error?: string; hint?: string; testID?: string }) {
  const [text, setText] = useState(asText(value));
  const [typo, setTypo] = useState<string | null>(null);
  // A half-typed "1-1/" is not an error yet: say so once the box is left.
  const [left, setLeft] = useState(false);
  // Follow values set from outside (a catalog pick, an earlier revision) without fighting the typist.
  useEffect(() => {
    const parsed = text.trim() === '' ? undefined : parseLength(text, 'mm');
    const current = parsed === undefined ? undefined : parsed.ok ? parsed.mm : NaN;
    if (!(current === value || (Number.isNaN(current) && Number.isNaN(value)))) {
      setText(asText(value));
      setTypo(null);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value]);
  return (
    <TextField
      label={label}
      value={text}
      suffix="mm"
      width={150}
      inputMode="decimal"
      onBlur={() => {
        setLeft(true);
        onBlur();
      }}
      onChangeText={(t) => {
        setText(t);
        if (t.trim() === '') {
          setTypo(null);
          onChange(undefined);
          return;
        }
        const p = parseLength(t, 'mm');
        setTypo(p.ok ? null : p.message);
        onChange(p.ok ? p.mm : NaN);
      }}
      error={(left ? typo : null) ?? error}
      hint={hint}
      testID={testID}
    />
  );
}

