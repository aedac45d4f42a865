import { lazy, Suspense } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { loadEngineScreens } from '@/components/forecast/load-engine-screens';
import { Loading } from '@/components/ui/load-state';

// A shared plan shows its forecast (engine and chart): loaded when opened, not with the app.
const SharedItemScreen = lazy(() => loadEngineScreens().then((m) => ({ default: m.SharedItemScreen })));

export default function SharedItemRoute() {
  const { clubId, shareId } = useLocalSearchParams<{ clubId: string; shareId: string }>();
  return (
    <Suspense fallback={<Loading label="Opening the shared item and its forecast…" testID="shared-item-loading" />}>
      <SharedItemScreen clubId={typeof clubId === 'string' ? clubId : ''} shareId={typeof shareId === 'string' ? shareId : ''} />
    </Suspense>
  );
}
