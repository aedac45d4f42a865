import { View } from 'react-native';
import { useLessonList } from '@/hooks/use-lessons';
import { useClubList } from '@/hooks/use-clubs';
import { useTheme } from '@/hooks/use-theme';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { Loading, LoadError } from '@/components/ui/load-state';
import { lessonAuthorClubs } from './lesson-authors';

/** The lessons of every club the person belongs to. */
export function LessonsListScreen() {
  const { space } = useTheme();
  const lessons = useLessonList();
  const clubs = useClubList();
  const canBuild = lessonAuthorClubs(clubs.data?.clubs ?? []).length > 0;
  return (
    <Screen testID="screen-lessons" title="Lessons">
      <Heading>Lessons</Heading>
      <AppText tone="textMuted">Teaching scenarios from your clubs’ mentors. Guess first, then see the forecast.</AppText>
      {canBuild ? <TextLink href="/lessons/new" label="+ New lesson" testID="lessons-new" /> : null}
      {lessons.isPending ? <Loading label="Loading lessons…" /> : null}
      {lessons.isError ? <LoadError title="Could not load lessons" error={lessons.error} onRetry={() => void lessons.refetch()} retrying={lessons.isFetching} /> : null}
      {lessons.data?.lessons.length === 0 ? <AppText testID="lessons-empty">No lessons yet. Join a club to see its lessons.</AppText> : null}
      <View style={{ gap: space.md }}>
        {lessons.data?.lessons.map((l) => (
          <Card key={l.id} testID={`lesson-card-${l.id}`} style={{ gap: space.xs }}>
            <TextLink href={`/lessons/${l.id}`} label={l.title} variant="title" testID="lesson-link" />
            <View style={{ flexDirection: 'row', gap: space.sm, flexWrap: 'wrap', alignItems: 'center' }}>
              <AppText variant="caption" tone="textMuted">{`${l.clubName} · by ${l.authorName}`}</AppText>
              {l.kind === 'compare' ? <StatusPill tone="info" label="Side by side" /> : null}
            </View>
            {l.summary ? <AppText>{l.summary}</AppText> : null}
          </Card>
        ))}
      </View>
    </Screen>
  );
}
