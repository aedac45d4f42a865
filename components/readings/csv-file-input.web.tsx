import { useId } from 'react';
import { useTheme } from '@/hooks/use-theme';
import { AppText } from '@/components/ui/text';
import type { CsvFileInputProps } from '@/components/readings/csv-file-input';

/** The browser's own file chooser: a real, labelled <input type="file"> (keyboard and screen readers know it). */
export function CsvFileInput({ label, onFile, testID, disabled }: CsvFileInputProps) {
  const { colors, radii, space, layout, font, scheme } = useTheme();
  const id = useId();
  return (
    <div style={{ display: 'flex', flexDirection: 'column', gap: space.xs }}>
      <label htmlFor={id} style={{ display: 'block' }}>
        <AppText variant="label" weight="bold">
          {label}
        </AppText>
      </label>
      <input
        id={id}
        data-testid={testID}
        type="file"
        accept=".csv,.txt,text/csv,text/plain"
        disabled={disabled}
        onChange={(e) => {
          const file = e.currentTarget.files?.[0];
          if (file) onFile({ file, name: file.name });
          // Choosing the same file again must fire again.
          e.currentTarget.value = '';
        }}
        style={{
          minHeight: layout.minTouchTarget,
          padding: space.sm,
          borderRadius: radii.md,
          border: `1px solid ${colors.fieldBorder}`,
          background: colors.surface,
          color: colors.text,
          // The browser draws the "choose" button: match it to the page's light or dark.
          colorScheme: scheme,
          fontFamily: font.regular.fontFamily,
          fontSize: 16,
        }}
      />
    </div>
  );
}
