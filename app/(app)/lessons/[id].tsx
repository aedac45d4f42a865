import { lazy, Suspense } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { loadEngineScreens } from '@/components/forecast/load-engine-screens';
import { Loading } from '@/components/ui/load-state';

// A lesson runs the forecast engine in the browser: loaded when a lesson opens, not with the app.
const LessonScreen = lazy(() => loadEngineScreens().then((m) => ({ default: m.LessonScreen })));

export default function LessonRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <Suspense fallback={<Loading label="Opening the lesson and its forecast…" testID="lesson-loading" />}>
      <LessonScreen id={typeof id === 'string' ? id : ''} />
    </Suspense>
  );
}
