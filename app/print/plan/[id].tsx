import { lazy, Suspense } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { SignedInGate } from '@/components/nav/signed-in-gate';
import { Loading } from '@/components/ui/load-state';

const PrintPlanScreen = lazy(() => import('@/components/plans/print-plan-screen').then((m) => ({ default: m.PrintPlanScreen })));

export default function PrintPlanRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <SignedInGate>
      <Suspense fallback={<Loading label="Opening the plan…" />}>
        <PrintPlanScreen id={typeof id === 'string' ? id : ''} />
      </Suspense>
    </SignedInGate>
  );
}
