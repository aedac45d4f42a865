import { AppText } from '@/components/ui/text';
import type { CsvUpload } from '@/hooks/use-readings';

export interface CsvFileInputProps {
  label: string;
  onFile: (upload: CsvUpload) => void;
  testID: string;
  disabled?: boolean;
}

/** Native builds have no file chooser here yet: import works in the web app. */
export function CsvFileInput({ testID }: CsvFileInputProps) {
  return (
    <AppText tone="textMuted" testID={testID}>
      Importing a CSV file works in the web app.
    </AppText>
  );
}
