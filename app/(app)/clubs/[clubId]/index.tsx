import { useLocalSearchParams } from 'expo-router';
import { ClubDetailScreen } from '@/components/clubs/club-detail-screen';

export default function ClubRoute() {
  const { clubId } = useLocalSearchParams<{ clubId: string }>();
  return <ClubDetailScreen id={typeof clubId === 'string' ? clubId : ''} />;
}
