import { View } from 'react-native';
import { useLesson } from '@/hooks/use-lessons';
import { useTheme } from '@/hooks/use-theme';
import { isApiRequestError } from '@/lib/api-client';
import { Screen } from '@/components/ui/screen';
import { Banner } from '@/components/ui/banner';
import { AppText, Heading } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { Loading, LoadError } from '@/components/ui/load-state';
import { LessonPlayer } from './lesson-player';
import { LessonTextEditor } from './lesson-text-editor';
import { ShareLinkPanel } from '@/components/share/share-link-panel';

/** One lesson of the caller's club. */
export function LessonScreen({ id }: { id: string }) {
  const { space } = useTheme();
  const lesson = useLesson(id);
  return (
    <Screen testID="screen-lesson" title={lesson.data?.title ?? 'Lesson'}>
      <TextLink href="/lessons" label="← All lessons" testID="lesson-back" />
      {lesson.isPending ? <Loading label="Loading the lesson…" /> : null}
      {lesson.isError && isApiRequestError(lesson.error) && lesson.error.status === 404 ? (
        <Banner tone="watch" title="Lesson not found" message="This lesson does not exist, or it belongs to a club you are not in." testID="lesson-not-found" />
      ) : lesson.isError ? (
        <LoadError title="Could not load this lesson" error={lesson.error} onRetry={() => void lesson.refetch()} retrying={lesson.isFetching} />
      ) : null}
      {lesson.data ? (
        <>
          <View style={{ gap: space.xs }}>
            <Heading testID="lesson-title">{lesson.data.title}</Heading>
            <AppText tone="textMuted">{`${lesson.data.clubName} · by ${lesson.data.authorName}${lesson.data.kind === 'compare' ? ' · comparison' : ''}`}</AppText>
            {lesson.data.summary ? <AppText>{lesson.data.summary}</AppText> : null}
          </View>
          {lesson.data.canManage ? <LessonTextEditor lesson={lesson.data} /> : null}
          <LessonPlayer lesson={lesson.data} />
          {lesson.data.canManage ? <ShareLinkPanel itemType="lesson" itemId={lesson.data.id} /> : null}
        </>
      ) : null}
    </Screen>
  );
}
