import { View } from 'react-native';
import { useLessonList } from '@/hooks/use-lessons';
import { useTheme } from '@/hooks/use-theme';
import { Screen } from '@/components/ui/screen';
import { Card } from '@/components/ui/card';
import { StatusPill } from '@/components/ui/status-pill';
import { AppText, Heading } from '@/components/ui/text';
import { TextLink } from '@/components/ui/text-link';
import { Loading, LoadError } from '@/components/ui/load-state';

/** The lessons of every club the person belongs to. */
export function LessonsListScreen() {
  const { space } = useTheme();
  const lessons = useLessonList();
  return (
    <Screen testID="screen-lessons" title="Lessons">
      <Heading>Lessons</Heading>
      <AppText tone="textMuted">Teaching scenarios from your clubs’ mentors. Guess first, then see the forecast.</AppText>
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
