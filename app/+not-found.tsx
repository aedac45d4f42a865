import { NotFoundScreen } from '@/components/nav/not-found-screen';

export default function NotFound() {
  return <NotFoundScreen />;
}
