import { useLocalSearchParams } from 'expo-router';
import { ConfirmSignUpScreen } from '@/components/auth/confirm-sign-up-screen';

export default function ConfirmSignUpRoute() {
  const { token } = useLocalSearchParams<{ token?: string }>();
  return <ConfirmSignUpScreen token={typeof token === 'string' ? token : ''} />;
}
