import { lazy, Suspense } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { Loading } from '@/components/ui/load-state';

// A lesson runs the forecast engine in the browser: loaded when a lesson opens, not with the app.
const LessonScreen = lazy(() => import('@/components/lessons/lesson-screen').then((m) => ({ default: m.LessonScreen })));

export default function LessonRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return (
    <Suspense fallback={<Loading label="Opening the lesson…" testID="lesson-loading" />}>
      <LessonScreen id={typeof id === 'string' ? id : ''} />
    </Suspense>
  );
}
