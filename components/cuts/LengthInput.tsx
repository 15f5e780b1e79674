import { useEffect, useState } from 'react';
import { formatLength, parseLength, type LengthUnit } from '../../shared/units';
import { TextField } from '../library/controls';

const asText = (v: number | undefined, units: LengthUnit) =>
  v === undefined || Number.isNaN(v) ? '' : formatLength(v, units, { digits: units === 'in' ? 4 : 3 }).replace(/ mm$|"$/, '');

/**
 * A length typed in the display units (fractions allowed in inches), held in millimetres. The form
 * gets NaN for text that is not a length, so the schema refuses it and nothing typed is lost.
 */
export function LengthInput({ value, onChange, onBlur, label, units, error, hint, testID }: { value: number | undefined; onChange: (mm: number | undefined) => void; onBlur: () => void; label: string; units: LengthUnit; error?: string; hint?: string; testID?: string }) {
  const [text, setText] = useState(asText(value, units));
  const [typo, setTypo] = useState<string | null>(null);
  useEffect(() => {
    setText(asText(value, units));
    setTypo(null);
    // Only a change of units (or a value set from outside, e.g. a reset) rewrites the box.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [units]);
  useEffect(() => {
    const parsed = text.trim() === '' ? undefined : parseLength(text, units);
    const current = parsed === undefined ? undefined : parsed.ok ? parsed.mm : NaN;
    if (!(current === value || (Number.isNaN(current) && Number.isNaN(value as number)) || (current !== undefined && value !== undefined && Math.abs(current - value) < 1e-9))) {
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
      width={160}
      inputMode="decimal"
      testID={testID}
      onBlur={onBlur}
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
      error={typo ?? error}
      hint={hint}
    />
  );
}
