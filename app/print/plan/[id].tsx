import { lazy, Suspense } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { SignedInGate } from '@/components/nav/signed-in-gate';
import { loadEngineScreens } from '@/components/forecast/load-engine-screens';
import { Loading } from '@/components/ui/load-state';

const PrintPlanScreen = lazy(() => loadEngineScreens().then((m) => ({ default: m.PrintPlanScreen })));

export default function PrintPlanRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <SignedInGate>
      <Suspense fallback={<Loading label="Laying out the plan for printing…" />}>
        <PrintPlanScreen id={typeof id === 'string' ? id : ''} />
      </Suspense>
    </SignedInGate>
  );
}
