import { useLocalSearchParams } from 'expo-router';
import { SharedViewScreen } from '@/components/share/shared-view-screen';

export default function SharedViewRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <SharedViewScreen token={typeof token === 'string' ? token : ''} />;
}
