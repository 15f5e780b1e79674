// Web-only: a file chooser and drop zone built on the browser's own <input type="file">.
import { useRef, useState, type DragEvent } from 'react';
import { Text, View } from 'react-native';
import { Button } from '../library/controls';
import { colors, fonts, radius, space, theme } from '../ui';

export function FilePicker({
  accept,
  onPick,
  label,
  hint,
  disabled = false,
}: {
  accept: string;
  onPick: (file: File) => void;
  label: string;
  hint?: string;
  disabled?: boolean;
}) {
  const input = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);

  const onDrop = (e: DragEvent<HTMLDivElement>) => {
    e.preventDefault();
    setOver(false);
    const file = e.dataTransfer.files?.[0];
    if (file && !disabled) onPick(file);
  };

  return (
    <div
      onDragOver={(e) => {
        e.preventDefault();
        if (!disabled) setOver(true);
      }}
      onDragLeave={() => setOver(false)}
      onDrop={onDrop}
      style={{
        border: `2px dashed ${over ? colors.pine : colors.line}`,
        background: over ? colors.pineSoft : colors.paper,
        borderRadius: radius.md,
        padding: space.lg,
      }}
    >
      <input
        ref={input}
        type="file"
        accept={accept}
        aria-label={label}
        data-testid="file-input"
        style={{ display: 'none' }}
        disabled={disabled}
        onChange={(e) => {
          const file = e.target.files?.[0];
          // Clear the input so choosing the same file again (after fixing it) still fires.
          e.target.value = '';
          if (file) onPick(file);
        }}
      />
      <View style={{ gap: space.sm, alignItems: 'flex-start' }}>
        <Button label={label} onPress={() => input.current?.click()} disabled={disabled} testID="file-choose" />
        <Text style={[theme.muted, { fontFamily: fonts.regular }]}>{hint ?? 'or drop the file here'}</Text>
      </View>
    </div>
  );
}
