import { useEffect, useState } from 'react';
import { formatLength, parseLength, type LengthUnit } from '../../shared/units';
import { TextField } from './controls';

/** A length in millimetres; NaN when what was typed is not a length, undefined when empty. */
export type Length = number | undefined;

const asText = (v: Length, units: LengthUnit) =>
  v === undefined || Number.isNaN(v) ? '' : formatLength(v, units, { digits: units === 'in' ? 4 : 3 }).replace(/ mm$|"$/, '');

const sameLength = (a: Length, b: Length) => a === b || (Number.isNaN(a) && Number.isNaN(b)) || (a !== undefined && b !== undefined && Math.abs(a - b) < 1e-9);

/**
 * A length box, typed in `units` (millimetres unless told; fractions allowed in inches) and held in
 * millimetres. It keeps exactly what was typed; the form holds the number, or NaN when the text is
 * not a length, so the schema's message appears and nothing is thrown away. A typed unit wins:
 * `3/4 in` or `0.75"` is read as inches.
 */
export function LengthBox({ value, onChange, onBlur, label, units = 'mm', width = 150, error, hint, testID }: { value: Length; onChange: (v: Length) => void; onBlur: () => void; label: string; units?: LengthUnit; width?: number; error?: string; hint?: string; testID?: string }) {
  const [text, setText] = useState(asText(value, units));
  const [typo, setTypo] = useState<string | null>(null);
  // A half-typed "1-1/" is not an error yet: say so once the box is left.
  const [left, setLeft] = useState(false);
  // A change of units rewrites the box in the new units.
  useEffect(() => {
    setText(asText(value, units));
    setTypo(null);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [units]);
  // Follow values set from outside (a catalog pick, an earlier revision, a reset) without fighting the typist.
  useEffect(() => {
    const parsed = text.trim() === '' ? undefined : parseLength(text, units);
    const current = parsed === undefined ? undefined : parsed.ok ? parsed.mm : NaN;
    if (!sameLength(current, value)) {
      setText(asText(value, units));
      setTypo(null);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [value]);
  return (
    <TextField
      label={label}
      value={text}
      suffix={units === 'in' ? 'in' : 'mm'}
      width={width}
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
        const p = parseLength(t, units);
        setTypo(p.ok ? null : p.message);
        onChange(p.ok ? p.mm : NaN);
      }}
      error={(left ? typo : null) ?? error}
      hint={hint}
      testID={testID}
    />
  );
}
