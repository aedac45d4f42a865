import { lazy, Suspense } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { loadEngineScreens } from '@/components/forecast/load-engine-screens';
import { Loading } from '@/components/ui/load-state';

// The editor brings the forecast engine and the chart: loaded when a plan opens, not with the app.
const PlanEditorScreen = lazy(() => loadEngineScreens().then((m) => ({ default: m.PlanEditorScreen })));

export default function PlanRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <Suspense fallback={<Loading label="Opening the plan and its forecast…" testID="plan-loading" />}>
      <PlanEditorScreen id={typeof id === 'string' ? id : ''} />
    </Suspense>
  );
}
