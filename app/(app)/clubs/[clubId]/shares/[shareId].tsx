import { useLocalSearchParams } from 'expo-router';
import { SharedItemScreen } from '@/components/clubs/shared-item-screen';

export default function SharedItemRoute() {
  const { clubId, shareId } = useLocalSearchParams<{ clubId: string; shareId: string }>();
  return <SharedItemScreen clubId={typeof clubId === 'string' ? clubId : ''} shareId={typeof shareId === 'string' ? shareId : ''} />;
}
