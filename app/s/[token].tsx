import { lazy, Suspense } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { loadEngineScreens } from '@/components/forecast/load-engine-screens';
import { Loading } from '@/components/ui/load-state';

// A shared plan or lesson brings the engine and the chart: loaded only on this page.
const SharedViewScreen = lazy(() => loadEngineScreens().then((m) => ({ default: m.SharedViewScreen })));

export default function SharedViewRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return (
    <Suspense fallback={<Loading label="Opening the shared page and its forecast…" testID="shared-loading" />}>
      <SharedViewScreen token={typeof token === 'string' ? token : ''} />
    </Suspense>
  );
}
