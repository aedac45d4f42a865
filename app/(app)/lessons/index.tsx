import { LessonsListScreen } from '@/components/lessons/lessons-list-screen';

export default function LessonsRoute() {
  return <LessonsListScreen />;
}
