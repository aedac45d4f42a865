import { ClubsScreen } from '@/components/clubs/clubs-screen';

export default function ClubsRoute() {
  return <ClubsScreen />;
}
