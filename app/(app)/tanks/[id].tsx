import { useLocalSearchParams } from 'expo-router';
import { TankDetailScreen } from '@/components/tanks/tank-detail-screen';

export default function TankRoute() {
  const { id } = useLocalSearchParams<{ id: string }>();
  return <TankDetailScreen id={typeof id === 'string' ? id : ''} />;
}
