import { useState } from 'react';
import { View } from 'react-native';
import { useDeleteReading, useReadingsPage } from '@/hooks/use-readings';
import { usePreferences } from '@/hooks/use-preferences';
import { useTheme } from '@/hooks/use-theme';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { AppText } from '@/components/ui/text';
import { Loading, LoadError } from '@/components/ui/load-state';
import { ReadingsTable } from '@/components/tanks/readings-table';

/** The tank's test log, a page at a time, newest first; each test can be deleted. */
export function ReadingsLog({ tankId, tank }: { tankId: string; tank: { ph: number; temperatureC: number } }) {
  const { space } = useTheme();
  const units = usePreferences();
  const [page, setPage] = useState(1);
  const query = useReadingsPage(tankId, page);
  const remove = useDeleteReading(tankId);
  const data = query.data;
  const pages = data ? Math.max(1, Math.ceil(data.total / data.pageSize)) : 1;

  if (query.isError && !data) return <LoadError title="Could not load the tests" error={query.error} onRetry={() => void query.refetch()} retrying={query.isFetching} />;
  if (!data) return <Loading label="Loading the tests…" />;
  if (data.total === 0) return <AppText tone="textMuted">No water tests logged yet.</AppText>;

  return (
    <View style={{ gap: space.md }} testID="readings-log">
      <ReadingsTable
        readings={data.readings}
        now={new Date()}
        units={units}
        tank={tank}
        onDelete={(r) => remove.mutate(r.id)}
        deletingId={remove.isPending ? remove.variables : null}
      />
      {remove.isError ? <Banner tone="danger" title="Not deleted" message={remove.error.message} /> : null}
      <AppText testID="readings-page">{`Page ${page} of ${pages} · ${data.total} ${data.total === 1 ? 'test' : 'tests'}`}</AppText>
      <View style={{ flexDirection: 'row', alignItems: 'center', gap: space.md, flexWrap: 'wrap' }}>
        <Button variant="secondary" label="Newer" accessibilityLabel="Newer tests" disabled={page <= 1} onPress={() => setPage((p) => p - 1)} testID="readings-newer" />
        <Button variant="secondary" label="Older" accessibilityLabel="Older tests" disabled={page >= pages} onPress={() => setPage((p) => p + 1)} testID="readings-older" />
      </View>
    </View>
  );
}
