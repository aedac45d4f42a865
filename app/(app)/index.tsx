import { HomeScreen } from '@/components/tanks/home-screen';

export default function HomeRoute() {
  return <HomeScreen />;
}
