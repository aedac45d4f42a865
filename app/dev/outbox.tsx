import { OutboxScreen } from '@/components/dev/outbox-screen';

export default function DevOutboxRoute() {
  return <OutboxScreen />;
}
