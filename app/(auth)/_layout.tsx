import { Slot } from 'expo-router';
import { SignedOutGate } from '@/components/nav/signed-out-gate';

export default function AuthLayout() {
  return (
    <SignedOutGate>
      <Slot />
    </SignedOutGate>
  );
}
