import { useState } from 'react';
import { View } from 'react-native';
import { CSV_COLUMNS, CSV_IMPORT_MAX_ROWS, type ImportPreview } from '@/shared/schemas/reading';
import { readingsExportUrl, useImportCommit, useImportPreview, type CsvUpload } from '@/hooks/use-readings';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { AppText, Heading } from '@/components/ui/text';
import { CsvFileInput } from '@/components/readings/csv-file-input';
import { saveDownload } from '@/components/readings/save-download';

const PREVIEW_ROWS = 8;

/** Import: choose a file → see its rows and any row errors → confirm. Export: one button. */
export function CsvImportExport({ tankId }: { tankId: string }) {
  const { space } = useTheme();
  const [upload, setUpload] = useState<CsvUpload | null>(null);
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [message, setMessage] = useState<{ tone: 'ok' | 'danger'; title: string; text: string } | null>(null);
  const [exporting, setExporting] = useState(false);
  const check = useImportPreview(tankId);
  const commit = useImportCommit(tankId);

  const explain = (e: unknown) => {
    const text = e instanceof Error ? e.message : 'Something went wrong.';
    const rows = isApiRequestError(e) ? Object.entries(e.fields).map(([k, m]) => `${k.replace(/^rows\.(\d+)\./, 'line $1, ')}: ${m}`) : [];
    setMessage({ tone: 'danger', title: 'Nothing was imported', text: [text, ...rows].join(' ') });
  };

  const choose = (u: CsvUpload) => {
    setUpload(u);
    setPreview(null);
    setMessage(null);
    check.mutate(u, { onSuccess: setPreview, onError: explain });
  };

  const confirm = () => {
    if (!upload) return;
    commit.mutate(upload, {
      onSuccess: ({ imported }) => {
        setPreview(null);
        setUpload(null);
        setMessage({ tone: 'ok', title: 'Imported', text: `${imported} ${imported === 1 ? 'test was' : 'tests were'} added to the log.` });
      },
      onError: explain,
    });
  };

  return (
    <View style={{ gap: space.md }} testID="csv-import">
      <Heading level={3}>Import tests from a CSV file</Heading>
      <AppText variant="caption" tone="textMuted">
        {`Columns: ${CSV_COLUMNS.join(', ')}. basis is N or ion for each row; temperature in °C; time like 2026-03-01T08:30:00Z. At most ${CSV_IMPORT_MAX_ROWS} rows. Nothing is saved until you confirm, and a file with any bad row imports nothing.`}
      </AppText>
      <CsvFileInput label="CSV file" onFile={choose} testID="csv-file" disabled={check.isPending || commit.isPending} />
      {check.isPending ? <AppText>Reading the file…</AppText> : null}

      {preview ? (
        <View style={{ gap: space.sm }} testID="csv-preview">
          <AppText weight="bold" testID="csv-preview-summary">
            {`${upload?.name ?? 'The file'}: ${preview.rows.length} ${preview.rows.length === 1 ? 'test' : 'tests'} read, ${preview.errors.length} ${preview.errors.length === 1 ? 'problem' : 'problems'}.`}
          </AppText>
          {preview.rows.slice(0, PREVIEW_ROWS).map((r) => (
            <AppText key={r.line} variant="caption">
              {`Line ${r.line}: ${r.takenAt.slice(0, 16).replace('T', ' ')} UTC · ${r.basis === 'N' ? 'as N' : 'as ion'} · ammonia ${r.tan ?? '—'} · nitrite ${r.no2 ?? '—'} · nitrate ${r.no3 ?? '—'}${r.ph === null ? '' : ` · pH ${r.ph}`}`}
            </AppText>
          ))}
          {preview.rows.length > PREVIEW_ROWS ? <AppText variant="caption" tone="textMuted">{`…and ${preview.rows.length - PREVIEW_ROWS} more.`}</AppText> : null}
          {preview.errors.length > 0 ? (
            <Banner tone="danger" title="Fix these rows, then choose the file again" testID="csv-row-errors">
              {preview.errors.slice(0, 20).map((e, i) => (
                <AppText key={i} variant="caption" testID={`csv-row-error-${e.line}`}>
                  {`Line ${e.line}${e.column ? `, ${e.column}` : ''}: ${e.message}`}
                </AppText>
              ))}
              {preview.errors.length > 20 ? <AppText variant="caption">{`…and ${preview.errors.length - 20} more.`}</AppText> : null}
            </Banner>
          ) : (
            <Button
              label={`Import ${preview.rows.length} ${preview.rows.length === 1 ? 'test' : 'tests'}`}
              busy={commit.isPending}
              busyLabel="Importing…"
              onPress={confirm}
              testID="csv-confirm"
            />
          )}
        </View>
      ) : null}
      {message ? <Banner tone={message.tone} title={message.title} message={message.text} testID={`csv-result-${message.tone}`} /> : null}

      <Heading level={3}>Export</Heading>
      <Button
        variant="secondary"
        label="Download all tests as CSV"
        busy={exporting}
        busyLabel="Preparing…"
        testID="csv-export"
        onPress={() => {
          setExporting(true);
          saveDownload(readingsExportUrl(tankId), 'shoalshift-water-tests.csv')
            .catch((e: unknown) => setMessage({ tone: 'danger', title: 'Not downloaded', text: e instanceof Error ? e.message : 'Try again.' }))
            .finally(() => setExporting(false));
        }}
      />
    </View>
  );
}
