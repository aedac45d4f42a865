import { useLocalSearchParams } from 'expo-router';
import { PlansListScreen } from '@/components/plans/plans-list-screen';

export default function PlansRoute() {
  const { tankId } = useLocalSearchParams<{ tankId?: string }>();
  return <PlansListScreen tankId={typeof tankId === 'string' ? tankId : undefined} />;
}
