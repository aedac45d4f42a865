import { lazy, Suspense } from 'react';
import { useLocalSearchParams } from 'expo-router';
import { loadEngineScreens } from '@/components/forecast/load-engine-screens';
import { Loading } from '@/components/ui/load-state';

// The builder previews the forecast with the engine in the browser: loaded when opened, not with the app.
const LessonBuilderScreen = lazy(() => loadEngineScreens().then((m) => ({ default: m.LessonBuilderScreen })));

export default function NewLessonRoute() {
  const { club } = useLocalSearchParams<{ club?: string }>();
  return (
    <Suspense fallback={<Loading label="Opening the lesson builder and its forecast preview…" testID="lesson-new-loading" />}>
      <LessonBuilderScreen clubId={typeof club === 'string' ? club : undefined} />
    </Suspense>
  );
}
