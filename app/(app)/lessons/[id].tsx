import { useLocalSearchParams } from 'expo-router';
import { LessonScreen } from '@/components/lessons/lesson-screen';

export default function LessonRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <LessonScreen id={typeof id === 'string' ? id : ''} />;
}
