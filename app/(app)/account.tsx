import { AccountScreen } from '@/components/account/account-screen';

export default function AccountRoute() {
  return <AccountScreen />;
}
