import { useLocalSearchParams } from 'expo-router';
import { InviteScreen } from '@/components/clubs/invite-screen';

export default function InviteRoute() {
  const { token } = useLocalSearchParams<{ token: string }>();
  return <InviteScreen token={typeof token === 'string' ? token : ''} />;
}
